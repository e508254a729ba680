import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import type { Database } from "./db/schema";
import { getEnv } from "./env.server";

/**
 * A Kysely instance over a small pg pool. Scripts and tests build their own with this;
 * the app uses the single shared `db()` below.
 */
export function createDb(connectionString: string, options: { max?: number; unavailableAsResponse?: boolean } = {}): Kysely<Database> {
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
  if (!options.unavailableAsResponse) return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  // For the web app: a database that cannot be reached is a 503 with Retry-After in the API's
  // error shape (React Router sends a thrown Response as it is), not an "Unexpected Server Error".
  const guarded = {
    connect: async () => {
      try {
        return await pool.connect();
      } catch (err) {
        console.error("[db] cannot connect:", err instanceof Error ? err.message : err);
        throw databaseUnavailable();
      }
    },
    end: () => pool.end(),
  };
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool: guarded as unknown as pg.Pool }) });
}

/** Seconds a client should wait before retrying while the database is unreachable. */
export const DB_RETRY_AFTER_SECONDS = 5;

/** The answer while the database cannot be reached: 503, Retry-After, our JSON error shape. */
export function databaseUnavailable(): Response {
  return Response.json(
    { error: { code: "unavailable", message: "The database is not reachable just now; nothing was changed. Please try again shortly." } },
    { status: 503, statusText: "Service Unavailable", headers: { "Retry-After": String(DB_RETRY_AFTER_SECONDS) } },
  );
}

let shared: Kysely<Database> | undefined;

/** The process-wide database handle (created on first use from DATABASE_URL / DB_*). */
export function db(): Kysely<Database> {
  shared ??= createDb(getEnv().databaseUrl, { unavailableAsResponse: true });
  return shared;
}

/** Closes the shared pool (scripts and tests call this before exiting). */
export async function closeDb(): Promise<void> {
  const current = shared;
  shared = undefined;
  await current?.destroy();
}
