/**
 * One job, start to finish, on a worker: claim the row atomically, run the computation in a child
 * process, heartbeat progress into analyses.progress, obey the cancel flag and the time limit,
 * write the outcome, and e-mail the starter if asked. Every write after the claim is guarded by
 * `worker_id = me AND status = 'running'`, so a row the sweeper has taken back is never overwritten.
 */
import { sql } from "kysely";
import type { AnalysisParams } from "~/analyses/params";
import { findJobById } from "~/analyses/repository.server";
import type { DbExecutor, JobRow, JsonObject } from "~/db/schema";
import type { JobPayload } from "./compute";
import { cancelBasisRuns } from "./basis-tasks.server";
import { notifyStarter } from "./notify.server";
import { parseProgress, type JobProgress } from "./progress";
import { runInChild, type ChildOutcome } from "./run-child.server";

export interface ProcessOptions {
  workerId: string;
  heartbeatMs: number;
  /** Extra time after the limit before the child is killed (the engine stops itself at the limit). */
  graceMs: number;
  /** The engine's own deadline as a multiple of the limit (1; tests raise it to exercise the hard kill). */
  engineDeadlineFactor: number;
  /** Called once the child runs (tests use it to crash the worker mid-run). */
  onChildStarted?: (analysisId: string, pid: number | undefined) => void;
  /**
   * Distributed bases (coordinator.server.ts): an analysis whose basis over Q has a first image
   * modulo a prime slower than this (ms) spreads its images and proof over the workers. Needs
   * `databaseUrl`; absent = every job computes alone.
   */
  distributeAfterMs?: number;
  databaseUrl?: string;
}

/**
 * Claims the next job fairly, atomically: of the queued jobs, the one whose lab has the fewest
 * jobs running, then whose starter has the fewest running, then the job this queue message names,
 * then the oldest. A queue message only means "there is work" (each job has one), so every queued
 * job is still claimed exactly once, but one lab's burst no longer makes another lab's tiny job wait
 * behind all of it. `FOR UPDATE SKIP LOCKED` lets workers claim side by side.
 */
export async function claimNextJob(db: DbExecutor, workerId: string, preferId: string | null): Promise<JobRow | undefined> {
  const picked = await sql<{ id: string }>`
    SELECT a.id FROM analyses a
    WHERE a.status = 'queued' AND a.cancel_requested_at IS NULL
    ORDER BY
      (SELECT count(*) FROM analyses r WHERE r.lab_id = a.lab_id AND r.status = 'running'),
      (SELECT count(*) FROM analyses r WHERE r.started_by = a.started_by AND r.status = 'running'),
      (a.id = ${preferId}) DESC NULLS LAST,
      a.created_at, a.id
    LIMIT 1
    FOR UPDATE OF a SKIP LOCKED`.execute(db);
  const id = picked.rows[0]?.id;
  if (!id) return undefined;
  return claim(db, id, workerId);
}

async function claim(db: DbExecutor, id: string, workerId: string): Promise<JobRow | undefined> {
  return db
    .updateTable("analyses")
    .set({
      status: "running",
      attempts: sql`attempts + 1`,
      worker_id: workerId,
      heartbeat_at: sql`now()`,
      started_at: sql`coalesce(started_at, now())`,
      error: null,
      progress: { stage: "starting", message: "job process starting" },
    })
    .where("id", "=", id)
    .where("status", "=", "queued")
    .where("cancel_requested_at", "is", null)
    .returningAll()
    .executeTakeFirst();
}

async function payloadFor(db: DbExecutor, row: JobRow): Promise<JobPayload> {
  const version = await db.selectFrom("network_versions").select("csv").where("id", "=", row.network_version_id).executeTakeFirstOrThrow();
  const parent = row.parent_id ? await findJobById(db, row.parent_id) : undefined;
  const parentParams = parent?.params as unknown as AnalysisParams;
  switch (row.kind) {
    case "analysis":
      return { kind: "analysis", csv: version.csv, params: row.params as unknown as AnalysisParams };
    case "scan":
      return { kind: "scan", csv: version.csv, params: row.params as never, parent: parentParams };
    case "relation":
      return { kind: "relation", csv: version.csv, params: row.params as never, parent: parentParams };
    case "timecourse":
      return { kind: "timecourse", csv: version.csv, params: row.params as never, parent: parentParams, parentResult: parent?.result ?? null };
  }
}

/** Child processes of the jobs this process is running, so a shutting-down worker can stop them. */
const running = new Set<{ stop(reason: string): void }>();
export function stopAllChildren(reason: string): void {
  for (const c of running) c.stop(reason);
}

const seconds = (ms: number) => `${Math.round(ms / 100) / 10} s`;

/**
 * Handles one queue message: settles the named job if it was cancelled while waiting, then claims
 * the fairest queued job (claimNextJob; usually the named one) and runs it. Returns the final status
 * it wrote, or null if nothing was claimed.
 */
export async function processJob(db: DbExecutor, messageId: string, options: ProcessOptions): Promise<string | null> {
  // Cancelled while waiting (e.g. after a requeue): settle it rather than leave it queued.
  await db
    .updateTable("analyses")
    .set({ status: "cancelled", finished_at: sql`now()`, error: "Cancelled before a worker started it.", progress: { stage: "cancelled" } })
    .where("id", "=", messageId)
    .where("status", "=", "queued")
    .where("cancel_requested_at", "is not", null)
    .execute();
  const row = await db.transaction().execute((trx) => claimNextJob(trx, options.workerId, messageId));
  if (!row) return null;
  const id = row.id;
  const started = Date.now();
  const limitMs = row.time_limit_seconds * 1000;
  let progress: JobProgress = { stage: "starting", message: "job process starting", elapsedMs: 0 };
  const mine = () => db.updateTable("analyses").where("id", "=", id).where("worker_id", "=", options.workerId).where("status", "=", "running");

  let outcome: ChildOutcome;
  let lostRow = false;
  let cancelled = false;
  // Partial results are written in the order they arrive; the final write waits for the last one.
  let partialWrites: Promise<unknown> = Promise.resolve();
  let partialStages: string[] | null = null;
  try {
    const payload = await payloadFor(db, row);
    const distribute = row.kind === "analysis" && options.distributeAfterMs !== undefined && options.databaseUrl !== undefined;
    const child = runInChild(payload, {
      engineTimeoutMs: limitMs * options.engineDeadlineFactor,
      ...(distribute ? { distribution: { thresholdMs: options.distributeAfterMs!, databaseUrl: options.databaseUrl!, analysisId: id, workerId: options.workerId } } : {}),
      onProgress: (p) => {
        progress = parseProgress(p, Date.now() - started);
      },
      onPartial: (result) => {
        partialStages = Array.isArray(result.unfinished) ? (result.unfinished as { stage: string }[]).map((u) => u.stage) : [];
        partialWrites = partialWrites.then(() => mine().set({ partial_result: result as JsonObject }).execute().catch(() => undefined));
      },
    });
    running.add(child);
    void child.outcome.then(() => running.delete(child));
    options.onChildStarted?.(id, child.pid);
    const beat = async () => {
      const r = await mine()
        .set({ heartbeat_at: sql`now()`, progress: { ...progress, elapsedMs: Date.now() - started } as unknown as JsonObject })
        .returning("cancel_requested_at")
        .executeTakeFirst()
        .catch(() => undefined);
      if (!r) {
        lostRow = true;
        child.stop("the job was taken back by the sweeper");
      } else if (r.cancel_requested_at) {
        cancelled = true;
        child.stop("cancelled");
      }
    };
    const heartbeat = setInterval(() => void beat(), options.heartbeatMs);
    const limit = setTimeout(() => child.stop("time limit"), limitMs + options.graceMs);
    try {
      outcome = await child.outcome;
    } finally {
      clearInterval(heartbeat);
      clearTimeout(limit);
    }
  } catch (e) {
    outcome = { kind: "crashed", message: `could not start the job: ${(e as Error).message}` };
  }
  await partialWrites;
  // Child jobs of its distributed bases end with the job, whatever the outcome (cancelled: killed at their next heartbeat).
  if (options.databaseUrl) await cancelBasisRuns(db, options.databaseUrl, { analysisId: id }, cancelled ? "the analysis was cancelled" : "the analysis ended").catch(() => undefined);
  if (lostRow) return null;
  const kept = (stages: string[] | null) => (stages ? ` Parts finished before that are kept; not finished: ${stages.join(", ")}.` : "");

  const elapsed = Date.now() - started;
  const timings = { ...row.timings, [`attempt${row.attempts}`]: elapsed, totalMs: elapsed };
  let update;
  if (outcome.kind === "result") {
    update = { status: "succeeded" as const, result: outcome.result as JsonObject, partial_result: null, error: null, progress: { stage: "done", message: "finished", elapsedMs: elapsed } };
  } else if (outcome.kind === "stopped" && cancelled) {
    update = { status: "cancelled" as const, error: `Cancelled after ${seconds(elapsed)} (during ${progress.stage}).${kept(partialStages)}`, progress: { ...progress, stage: "cancelled", elapsedMs: elapsed } };
  } else if (outcome.kind === "stopped") {
    const where = progress.basisSize !== undefined ? `; Gröbner basis had ${progress.basisSize} polynomials with ${progress.pairsLeft ?? "?"} pairs left` : "";
    update = {
      status: "failed" as const,
      error: `Stopped: the time limit of ${row.time_limit_seconds} s was exceeded during ${progress.stage}${where}. Try a longer limit (up to the lab's maximum), numeric rate constants, or another elimination order.${kept(partialStages)}`,
      progress: { ...progress, stage: "stopped", elapsedMs: elapsed },
    };
  } else {
    const message = outcome.kind === "error" && outcome.code === "cancelled" ? "Cancelled." : outcome.message;
    update = { status: "failed" as const, error: message, progress: { ...progress, stage: "failed", elapsedMs: elapsed } };
  }
  const written = await mine()
    .set({ ...update, progress: update.progress as unknown as JsonObject, timings, finished_at: sql`now()`, heartbeat_at: sql`now()` })
    .returning("id")
    .executeTakeFirst();
  if (!written) return null;
  if (row.notify_by_email) await notifyStarter(db, id).catch((e) => console.error(`[worker] mail for ${id} failed:`, (e as Error).message));
  return update.status;
}
