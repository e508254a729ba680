import { readdirSync } from "node:fs";
import path from "node:path";
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { assertMigrationsOk, createMigrator, migrationState } from "~/db/migrator.server";
import { migrations } from "../../../migrations";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "../support/test-db";

const ALL_TABLES = [
  "analyses",
  "api_tokens",
  "audit_events",
  "invitations",
  "labs",
  "memberships",
  "network_versions",
  "networks",
  "users",
];

describe("migrations/index.ts", () => {
  it("lists every migration file in the folder, in name order", () => {
    const files = readdirSync(path.resolve("migrations"))
      .filter((f) => /^\d{14}_[a-z0-9_]+\.ts$/.test(f))
      .map((f) => f.replace(/\.ts$/, ""))
      .sort();
    expect(Object.keys(migrations)).toEqual(files);
    expect(files.length).toBeGreaterThan(0);
  });
});

describe.skipIf(!hasTestDatabase)("migrations on a real database", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase({ migrated: false });
  });
  afterAll(async () => {
    await t?.drop();
  });

  async function tables() {
    const { rows } = await sql<{ table_name: string }>`
      SELECT table_name FROM information_schema.tables
      WHERE table_schema = 'public' AND table_name NOT LIKE 'kysely_%' ORDER BY table_name
    `.execute(t.db);
    return rows.map((r) => r.table_name);
  }

  it("starts empty with every migration pending", async () => {
    expect(await tables()).toEqual([]);
    const state = await migrationState(t.db);
    expect(state.applied).toEqual([]);
    expect(state.pending).toEqual(Object.keys(migrations));
  });

  it("migrates up to the full schema", async () => {
    assertMigrationsOk(await createMigrator(t.db).migrateToLatest());
    expect(await tables()).toEqual(expect.arrayContaining(ALL_TABLES));
    expect((await migrationState(t.db)).pending).toEqual([]);
  });

  it("migrates all the way down to nothing, and up again", async () => {
    const migrator = createMigrator(t.db);
    for (let i = 0; i < Object.keys(migrations).length; i++) assertMigrationsOk(await migrator.migrateDown());
    expect(await tables()).toEqual([]);
    const { rows } = await sql<{ n: number }>`
      SELECT count(*)::int AS n FROM pg_proc WHERE proname LIKE 'stillpoint_%'
    `.execute(t.db);
    expect(rows[0].n).toBe(0);
    assertMigrationsOk(await migrator.migrateToLatest());
    expect(await tables()).toEqual(expect.arrayContaining(ALL_TABLES));
  });
});
