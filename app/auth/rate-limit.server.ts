import { sql, type Kysely } from "kysely";
import type { Database } from "~/db/schema";
import { db as sharedDb } from "~/db.server";

/** One limit: at most `max` actions per `windowMinutes` in `bucket`. */
export interface RateLimit {
  bucket: string;
  max: number;
  windowMinutes: number;
}

export type RateVerdict = { allowed: true } | { allowed: false; retryAfterSeconds: number };

/**
 * Counts an action against every limit at once, atomically: inside one transaction it takes a
 * transaction-scoped advisory lock per bucket (sorted, so two callers never deadlock), counts the
 * bucket's events in the sliding window and, only when every bucket has room, records one event
 * in each. Of 100 parallel requests against a limit of 30, exactly 30 pass.
 *
 *   await takeRateLimit([{ bucket: "code:client:10.0.0.1", max: 30, windowMinutes: 15 }])
 *   // → { allowed: true } thirty times in the window, then { allowed: false, retryAfterSeconds }
 */
export async function takeRateLimit(limits: RateLimit[], database: Kysely<Database> = sharedDb()): Promise<RateVerdict> {
  const sorted = [...limits].sort((a, b) => (a.bucket < b.bucket ? -1 : a.bucket > b.bucket ? 1 : 0));
  return database.transaction().execute(async (trx) => {
    for (const limit of sorted) {
      await sql`SELECT pg_advisory_xact_lock(hashtextextended(${limit.bucket}, 16))`.execute(trx);
    }
    const now = Date.now();
    let retryAfterSeconds = 0;
    for (const limit of sorted) {
      const windowMs = limit.windowMinutes * 60_000;
      const rows = await trx
        .selectFrom("rate_limit_events")
        .select("created_at")
        .where("bucket", "=", limit.bucket)
        .where("created_at", ">", new Date(now - windowMs))
        .orderBy("created_at", "desc")
        .limit(limit.max)
        .execute();
      if (rows.length >= limit.max) {
        // The window frees up when the max-th newest event leaves it.
        const freeAt = rows[limit.max - 1]!.created_at.getTime() + windowMs;
        retryAfterSeconds = Math.max(retryAfterSeconds, Math.ceil((freeAt - now) / 1000), 1);
      }
    }
    if (retryAfterSeconds > 0) return { allowed: false, retryAfterSeconds } as const;
    await trx.insertInto("rate_limit_events").values(sorted.map((l) => ({ bucket: l.bucket }))).execute();
    // Rows older than a day serve no window; drop a few per call so the table stays small.
    await sql`DELETE FROM rate_limit_events WHERE id IN (
      SELECT id FROM rate_limit_events WHERE created_at < now() - interval '1 day' LIMIT 100)`.execute(trx);
    return { allowed: true } as const;
  });
}
