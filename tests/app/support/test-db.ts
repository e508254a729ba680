/**
 * Isolated databases for integration tests. `npm test` starts a throw-away PostgreSQL, migrates a
 * template database and passes its URL as TEST_DATABASE_URL. Each test file then copies the
 * template (CREATE DATABASE … TEMPLATE, fast) so files can run in parallel without sharing rows.
 * Without TEST_DATABASE_URL (e.g. `npx vitest run tests/domain`) database tests skip.
 */
import { randomBytes } from "node:crypto";
import type { Kysely } from "kysely";
import pg from "pg";
import { createDb } from "~/db.server";
import type { Database } from "~/db/schema";

export const testDatabaseUrl = process.env.TEST_DATABASE_URL;
export const hasTestDatabase = Boolean(testDatabaseUrl);

export interface TestDatabase {
  url: string;
  db: Kysely<Database>;
  /** Closes the pool and drops the database. */
  drop(): Promise<void>;
}

function withDatabase(url: string, name: string) {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

async function admin<T>(fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: withDatabase(testDatabaseUrl!, "postgres") });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/**
 * A fresh database: a copy of the migrated template, or (`migrated: false`) an empty one.
 * Call `drop()` in afterAll.
 */
export async function createTestDatabase(options: { migrated?: boolean } = {}): Promise<TestDatabase> {
  if (!testDatabaseUrl) throw new Error("TEST_DATABASE_URL is not set; run through `npm test`");
  const template = options.migrated === false ? "template0" : new URL(testDatabaseUrl).pathname.slice(1);
  const name = `t_${randomBytes(6).toString("hex")}`;
  await admin(async (client) => {
    // Two copies of one template at the same moment can collide ("being accessed"); retry briefly.
    for (let attempt = 0; ; attempt++) {
      try {
        await client.query(`CREATE DATABASE ${pg.escapeIdentifier(name)} TEMPLATE ${pg.escapeIdentifier(template)}`);
        return;
      } catch (err) {
        if (attempt >= 20 || !/being accessed/.test(String(err))) throw err;
        await new Promise((r) => setTimeout(r, 100 + Math.random() * 200));
      }
    }
  });
  const url = withDatabase(testDatabaseUrl, name);
  const db = createDb(url, { max: 4 });
  return {
    url,
    db,
    async drop() {
      await db.destroy();
      await admin((client) => client.query(`DROP DATABASE IF EXISTS ${pg.escapeIdentifier(name)} WITH (FORCE)`));
    },
  };
}
