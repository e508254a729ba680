/**
 * Recovers jobs whose worker died: a running row whose heartbeat is older than `staleAfterMs` goes
 * back to the queue while it has attempts left, otherwise it fails with the reason; one whose
 * cancellation was requested becomes cancelled. One atomic UPDATE, so several workers sweeping at
 * once never requeue a row twice.
 */
import { sql } from "kysely";
import type { DbExecutor } from "~/db/schema";

export interface SweepResult {
  requeued: { id: string; timeLimitSeconds: number }[];
  /** Failed (no attempts left) or cancelled. */
  failed: string[];
}

export async function sweepStaleJobs(db: DbExecutor, staleAfterMs: number): Promise<SweepResult> {
  const rows = await db
    .updateTable("analyses")
    .set({
      status: sql`CASE WHEN cancel_requested_at IS NOT NULL THEN 'cancelled' WHEN attempts < max_attempts THEN 'queued' ELSE 'failed' END`,
      error: sql`CASE WHEN cancel_requested_at IS NOT NULL THEN 'Cancelled (its worker had stopped responding).'
        WHEN attempts < max_attempts THEN NULL ELSE
        'The worker running this job stopped responding (no heartbeat since ' || to_char(heartbeat_at AT TIME ZONE 'UTC', 'HH24:MI:SS') ||
        ' UTC) on each of its ' || attempts || ' attempts; it may have crashed or run out of memory.' END`,
      finished_at: sql`CASE WHEN cancel_requested_at IS NULL AND attempts < max_attempts THEN NULL ELSE now() END`,
      progress: sql`jsonb_build_object('stage', CASE WHEN cancel_requested_at IS NOT NULL THEN 'cancelled' WHEN attempts < max_attempts THEN 'queued' ELSE 'failed' END,
        'message', 'the worker running attempt ' || attempts || ' stopped responding' ||
        CASE WHEN cancel_requested_at IS NULL AND attempts < max_attempts THEN '; queued again' ELSE '' END)`,
      worker_id: null,
    })
    .where("status", "=", "running")
    .where("heartbeat_at", "<", sql<Date>`now() - make_interval(secs => ${staleAfterMs / 1000})`)
    .returning(["id", "status", "time_limit_seconds"])
    .execute();
  return {
    requeued: rows.filter((r) => r.status === "queued").map((r) => ({ id: r.id, timeLimitSeconds: r.time_limit_seconds })),
    failed: rows.filter((r) => r.status !== "queued").map((r) => r.id),
  };
}

/** Queued rows with no live queue message (e.g. a send that failed) older than `olderThanMs`. */
export async function orphanedQueuedJobs(db: DbExecutor, olderThanMs: number): Promise<{ id: string; timeLimitSeconds: number }[]> {
  const rows = await db
    .selectFrom("analyses as a")
    .select(["a.id", "a.time_limit_seconds"])
    .where("a.status", "=", "queued")
    .where("a.created_at", "<", sql<Date>`now() - make_interval(secs => ${olderThanMs / 1000})`)
    .where(sql<boolean>`NOT EXISTS (SELECT 1 FROM pgboss.job j WHERE j.data->>'analysisId' = a.id::text AND j.state IN ('created', 'retry', 'active'))`)
    .limit(50)
    .execute();
  return rows.map((r) => ({ id: r.id, timeLimitSeconds: r.time_limit_seconds }));
}

/**
 * A worker shutting down cleanly (SIGTERM, Ctrl-C) hands its running jobs back: queued again with
 * the attempt not counted, so a restart never costs a job one of its tries.
 */
export async function releaseRunningJobs(db: DbExecutor, workerId: string): Promise<{ id: string; timeLimitSeconds: number }[]> {
  const rows = await db
    .updateTable("analyses")
    .set({
      status: "queued",
      worker_id: null,
      attempts: sql`greatest(attempts - 1, 0)`,
      progress: { stage: "queued", message: "the worker was stopped; queued again" },
    })
    .where("worker_id", "=", workerId)
    .where("status", "=", "running")
    .returning(["id", "time_limit_seconds"])
    .execute();
  return rows.map((r) => ({ id: r.id, timeLimitSeconds: r.time_limit_seconds }));
}
