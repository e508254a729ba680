import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import type { Database } from "./db/schema";
import { getEnv } from "./env.server";

/**
 * A Kysely instance over a small pg pool. Scripts and tests build their own with this;
 * the app uses the single shared `db()` below.
 */
export function createDb(
  connectionString: string,
  options: { max?: number; waitMs?: number; unavailableAsResponse?: boolean; stats?: PoolStats } = {},
): Kysely<Database> {
  const max = options.max ?? 10;
  const pool = new pg.Pool({
    connectionString,
    max,
    // How long a caller waits for a connection, queued behind others when all `max` are busy (pg
    // uses the one setting for both). A refused connection (database down) still fails at once.
    connectionTimeoutMillis: options.waitMs ?? 3_000,
    // Idle connections must not keep a stopping server process alive.
    allowExitOnIdle: true,
  });
  // An idle client losing its connection must not crash the server.
  pool.on("error", (err) => console.error("[db] idle client error:", err.message));
  if (!options.unavailableAsResponse) return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  // For the web app: a database that cannot be reached is a 503 with Retry-After in the API's
  // error shape (React Router sends a thrown Response as it is), not an "Unexpected Server Error".
  const stats = options.stats;
  if (stats) stats.max = max;
  const guarded = {
    connect: async () => {
      const started = performance.now();
      // Every connection busy: this caller queues.
      const queued = pool.totalCount >= max && pool.idleCount === 0;
      try {
        const client = await pool.connect();
        if (stats) recordAcquisition(stats, queued, performance.now() - started);
        return client;
      } catch (err) {
        if (stats) stats.failed++;
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

/** What the web server's pool did since start: how often a request had to queue for a connection, and how long. */
export interface PoolStats {
  max: number;
  acquisitions: number;
  /** Acquisitions that found every connection busy and waited in pg's queue. */
  queued: number;
  queuedMsTotal: number;
  maxWaitMs: number;
  /** Acquisitions that failed (database down, or no connection within DB_POOL_WAIT_MS). */
  failed: number;
}

function recordAcquisition(stats: PoolStats, queued: boolean, ms: number) {
  stats.acquisitions++;
  if (queued) {
    stats.queued++;
    stats.queuedMsTotal += ms;
  }
  stats.maxWaitMs = Math.max(stats.maxWaitMs, ms);
}

const sharedStats: PoolStats = { max: 0, acquisitions: 0, queued: 0, queuedMsTotal: 0, maxWaitMs: 0, failed: 0 };

/** A copy of the shared pool's counters (shown by /api/health when DB_POOL_STATS=1). */
export function poolStats(): PoolStats {
  return { ...sharedStats, queuedMsTotal: Math.round(sharedStats.queuedMsTotal), maxWaitMs: Math.round(sharedStats.maxWaitMs) };
}

let shared: Kysely<Database> | undefined;

/** The process-wide database handle (created on first use from DATABASE_URL / DB_*, sized by DB_POOL_MAX). */
export function db(): Kysely<Database> {
  const env = getEnv();
  shared ??= createDb(env.databaseUrl, { max: env.dbPool.max, waitMs: env.dbPool.waitMs, unavailableAsResponse: true, stats: sharedStats });
  return shared;
}

/** Closes the shared pool (scripts and tests call this before exiting). */
export async function closeDb(): Promise<void> {
  const current = shared;
  shared = undefined;
  await current?.destroy();
}
