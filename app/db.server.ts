import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import type { Database } from "./db/schema";
import { getEnv } from "./env.server";

/**
 * A Kysely instance over a small pg pool. Scripts and tests build their own with this;
 * the app uses the single shared `db()` below.
 */
export function createDb(connectionString: string, options: { max?: number } = {}): Kysely<Database> {
  const pool = new pg.Pool({
    connectionString,
    max: options.max ?? 10,
    // Fail fast when the database is down, so /api/health answers instead of hanging.
    connectionTimeoutMillis: 3_000,
    // Idle connections must not keep a stopping server process alive.
    allowExitOnIdle: true,
  });
  // An idle client losing its connection must not crash the server.
  pool.on("error", (err) => console.error("[db] idle client error:", err.message));
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}

let shared: Kysely<Database> | undefined;

/** The process-wide database handle (created on first use from DATABASE_URL / DB_*). */
export function db(): Kysely<Database> {
  shared ??= createDb(getEnv().databaseUrl);
  return shared;
}

/** Closes the shared pool (scripts and tests call this before exiting). */
export async function closeDb(): Promise<void> {
  const current = shared;
  shared = undefined;
  await current?.destroy();
}
