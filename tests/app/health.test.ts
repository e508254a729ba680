import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb } from "~/db.server";
import { assertMigrationsOk, createMigrator } from "~/db/migrator.server";
import { checkHealth } from "~/health.server";
import { migrations } from "../../migrations";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "./support/test-db";

describe("checkHealth", () => {
  it("reports an unreachable database without throwing", async () => {
    // Port 9 (discard) on loopback: nothing speaks PostgreSQL there.
    const db = createDb("postgres://postgres@127.0.0.1:9/none", { max: 1 });
    try {
      const health = await checkHealth(db, "1.2.3");
      expect(health.ok).toBe(false);
      expect(health.version).toBe("1.2.3");
      expect(health.database.reachable).toBe(false);
      expect(health.database.error).toBeTruthy();
      expect(health.migrations.current).toBe(false);
    } finally {
      await db.destroy();
    }
  });
});

describe.skipIf(!hasTestDatabase)("checkHealth on a real database", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase({ migrated: false });
  });
  afterAll(async () => {
    await t?.drop();
  });

  it("lists every migration as pending on an empty database", async () => {
    const health = await checkHealth(t.db, "0.0.0");
    expect(health.database.reachable).toBe(true);
    expect(health.migrations).toEqual({ current: false, applied: 0, pending: Object.keys(migrations) });
    expect(health.ok).toBe(false);
  });

  it("is healthy once migrated", async () => {
    assertMigrationsOk(await createMigrator(t.db).migrateToLatest());
    const health = await checkHealth(t.db, "0.0.0");
    expect(health).toEqual({
      ok: true,
      version: "0.0.0",
      database: { reachable: true },
      migrations: { current: true, applied: Object.keys(migrations).length, pending: [] },
    });
  });
});
