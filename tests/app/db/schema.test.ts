import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DATABASE_COLUMNS } from "~/db/schema";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "../support/test-db";

// DATABASE_COLUMNS is tied to the `Database` interface at compile time (every listed name is an
// interface key and every interface key is listed), so comparing it with the migrated database
// compares the interface with the database.
describe.skipIf(!hasTestDatabase)("app/db/schema.ts against the migrated database", () => {
  let t: TestDatabase;
  let actual: Record<string, string[]>;
  beforeAll(async () => {
    t = await createTestDatabase();
    const { rows } = await sql<{ table_name: string; column_name: string }>`
      SELECT table_name, column_name FROM information_schema.columns
      WHERE table_schema = 'public' AND table_name NOT LIKE 'kysely_%'
    `.execute(t.db);
    actual = {};
    for (const row of rows) (actual[row.table_name] ??= []).push(row.column_name);
  });
  afterAll(async () => {
    await t?.drop();
  });

  it("declares exactly the tables the migrations create", () => {
    expect(Object.keys(DATABASE_COLUMNS).sort()).toEqual(Object.keys(actual).sort());
  });

  it.each(Object.entries(DATABASE_COLUMNS))("declares exactly the columns of %s", (table, columns) => {
    expect([...columns].sort()).toEqual([...(actual[table] ?? [])].sort());
  });
});
