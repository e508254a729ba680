/**
 * The worker's side of a distributed basis (see coordinator.server.ts): take one task id from the
 * image queue, compute it in this worker's task process, store the outcome in basis_tasks. The
 * row is the truth, the queue message only a pointer: a duplicate delivery of a finished task, or
 * a task of a run that has ended, is acknowledged without work. While it computes, the run is
 * checked every heartbeat; once it is no longer running (cancelled, or finished without this
 * image), the task process is killed.
 */
import { sql } from "kysely";
import type { LiftCandidate, MultiModularInput, ProofBatch } from "@domain/algebra/f4/multimodular";
import type { DbExecutor } from "~/db/schema";
import { IMAGE_QUEUE, getBoss, type TaskMessage } from "./queue.server";
import type { TaskRequest } from "./task-child";
import type { TaskRunner } from "./task-runner.server";

export interface TaskContext {
  workerId: string;
  runner: TaskRunner;
  heartbeatMs: number;
  /** Called when the task process starts a task (tests kill the worker then). */
  onTaskStarted?: (taskId: string) => void;
}

/** Handles one image-queue message; returns what happened (for the log). Throws to make pg-boss retry. */
export async function processTask(db: DbExecutor, message: TaskMessage, ctx: TaskContext): Promise<string> {
  const task = await db
    .updateTable("basis_tasks")
    .set({ status: "running", worker_id: ctx.workerId, attempts: sql`attempts + 1`, started_at: sql`now()` })
    .where("id", "=", message.taskId)
    .where("status", "in", ["queued", "running"]) // running: a retry after the worker holding it died
    .where(sql<boolean>`EXISTS (SELECT 1 FROM basis_runs r WHERE r.id = basis_tasks.run_id AND r.status = 'running')`)
    .returningAll()
    .executeTakeFirst();
  if (!task) return "skipped (done, or its run has ended)";
  // Not the candidate itself (megabytes on large runs): a task process gets it once (proofRequest).
  const run = await db.selectFrom("basis_runs")
    .select(["input", sql<number | null>`(candidate->>'checkedWith')::int`.as("checked_with"), sql<boolean>`candidate_integer IS NOT NULL`.as("has_integer")])
    .where("id", "=", task.run_id).executeTakeFirstOrThrow();
  const input = run.input as unknown as MultiModularInput;
  const deadline = Date.now() + 24 * 3600_000; // the run's own limit stops it (it is cancelled at the analysis' limit)
  // The run's learnt F4 trace, with the first image task this worker's task process gets of the run.
  const trace = task.kind === "image" && ctx.runner.needsTrace(task.run_id)
    ? ((await db.selectFrom("basis_runs").select("trace").where("id", "=", task.run_id).executeTakeFirst())?.trace ?? null)
    : undefined;
  const asBytes = (b: Buffer) => new Uint8Array(b.buffer, b.byteOffset, b.byteLength);
  /**
   * A proof batch's request. The early step-3 check carries its leading monomials; a batch of the
   * run's candidate carries, the first time this task process meets it (or `full`: it no longer
   * has it), its integer form (the run stores one unless its proof is by Hilbert series) or else
   * its text; otherwise only the candidate's key.
   */
  const proofRequest = async (full: boolean): Promise<TaskRequest> => {
    const base = { kind: "proof", runId: task.run_id, input, batch: task.batch as unknown as ProofBatch, deadline } as const;
    const early = earlyCheckCandidate(task.batch, task.seq);
    if (early) return { ...base, candidate: early };
    const key: LiftCandidate = { basis: [], primes: [], unlucky: [], checkedWith: run.checked_with ?? 0 };
    const cacheKey = `${task.run_id}:${key.checkedWith}`;
    if (!full && !ctx.runner.needsCandidate(cacheKey)) return { ...base, candidate: key };
    ctx.runner.candidateSent(cacheKey);
    const stored = await db.selectFrom("basis_runs").select(run.has_integer ? ["candidate_integer"] : ["candidate"]).where("id", "=", task.run_id).executeTakeFirstOrThrow() as { candidate_integer?: Buffer | null; candidate?: unknown };
    return stored.candidate_integer ? { ...base, candidate: key, integer: asBytes(stored.candidate_integer) } : { ...base, candidate: stored.candidate as LiftCandidate };
  };
  const request: TaskRequest =
    task.kind === "image"
      ? { kind: "image", runId: task.run_id, input, primes: imagePrimes(task), deadline, ...(trace === undefined ? {} : { trace: trace && asBytes(trace) }) }
      : await proofRequest(false);
  let runEnded = false;
  const beat = setInterval(() => {
    void db
      .selectFrom("basis_runs")
      .select("status")
      .where("id", "=", task.run_id)
      .executeTakeFirst()
      .then((r) => {
        if (!r || r.status !== "running") {
          runEnded = true;
          ctx.runner.kill();
        }
      })
      .catch(() => undefined);
  }, ctx.heartbeatMs);
  const pending = ctx.runner.run(request).then(async (r) => (r.kind === "needs-candidate" ? ctx.runner.run(await proofRequest(true)) : r));
  ctx.onTaskStarted?.(task.id);
  let reply;
  try {
    reply = await pending;
  } finally {
    clearInterval(beat);
  }
  const mine = () => db.updateTable("basis_tasks").where("id", "=", task.id).where("worker_id", "=", ctx.workerId).where("status", "=", "running");
  if (runEnded) {
    await mine().set({ status: "cancelled", finished_at: sql`now()` }).execute();
    return `${task.kind} ${task.id}: its run ended; stopped`;
  }
  if (reply.kind === "error") throw new Error(`${task.kind} task ${task.id}: ${reply.message}`);
  if (reply.kind === "needs-candidate") throw new Error(`proof task ${task.id}: the task process did not keep the candidate it was sent`);
  if (reply.kind === "image") {
    const bytes = Buffer.from(reply.bytes.buffer, reply.bytes.byteOffset, reply.bytes.byteLength);
    await mine().set({ status: "done", image: bytes, bytes: bytes.byteLength, compute_ms: reply.ms, finished_at: sql`now()` }).execute();
    const primes = imagePrimes(task);
    return `image${primes.length > 1 ? `s mod ${primes.length} primes from` : " mod"} ${task.prime} (${bytes.byteLength} bytes, ${reply.ms} ms, ${reply.replayed} of ${primes.length} replayed${trace ? " from the run's stored trace" : ""})`;
  }
  await mine().set({ status: "done", ok: reply.ok, failed_step: reply.failed ?? null, compute_ms: reply.ms, finished_at: sql`now()` }).execute();
  return `proof batch ${task.seq}: ${reply.ok ? "ok" : `failed (${reply.failed})`} (${reply.ms} ms)`;
}

/** The primes of an image task: one, or a few consecutive ones when each image is quick (coordinator.server.ts). */
export function imagePrimes(task: { prime: number | null; batch: unknown }): number[] {
  const primes = (task.batch as { primes?: number[] } | null)?.primes;
  return Array.isArray(primes) && primes.length > 0 ? primes : [task.prime!];
}

/** For the early step-3 check, the candidate it is about: the first image's leading monomials (kept in the batch); else null. */
function earlyCheckCandidate(batch: unknown, seq: number): LiftCandidate | null {
  const leads = (batch as { leads?: string[] } | null)?.leads;
  return leads ? { basis: leads, primes: [], unlucky: [], checkedWith: -1 - seq } : null;
}

/**
 * Ends every running run of an analysis (cancelled, stopped, failed or retried): the runs are
 * marked cancelled, their queued and active child jobs cancelled in pg-boss, and the workers
 * computing one kill their task process at the next heartbeat. Returns the number of runs ended.
 */
export async function cancelBasisRuns(db: DbExecutor, databaseUrl: string, where: { analysisId: string } | { runId: string }, reason = "cancelled"): Promise<number> {
  let q = db.updateTable("basis_runs").set({ status: "cancelled", error: reason, finished_at: sql`now()` }).where("status", "=", "running");
  q = "analysisId" in where ? q.where("analysis_id", "=", where.analysisId) : q.where("id", "=", where.runId);
  const runs = await q.returning("id").execute();
  for (const r of runs) await cancelRunJobs(db, databaseUrl, r.id);
  return runs.length;
}

/** Cancels the run's child jobs that pg-boss has not finished (queued, waiting for a retry, active). */
export async function cancelRunJobs(db: DbExecutor, databaseUrl: string, runId: string, onlyTaskIds?: readonly string[]): Promise<void> {
  // The whole run: tasks still marked running are cancelled too (their pg-boss jobs are, below;
  // a worker that died holding one never writes its row). Some tasks only: a worker computing one finishes.
  await db.updateTable("basis_tasks").set({ status: "cancelled", finished_at: sql`now()` })
    .where("run_id", "=", runId).where("status", "in", onlyTaskIds === undefined ? ["queued", "running"] : ["queued"])
    .$if(onlyTaskIds !== undefined, (qb) => qb.where("id", "in", onlyTaskIds!.length ? onlyTaskIds! : ["00000000-0000-0000-0000-000000000000"]))
    .execute();
  const { rows } = await sql<{ id: string }>`
    SELECT id FROM pgboss.job WHERE name = ${IMAGE_QUEUE} AND data->>'runId' = ${runId} AND state IN ('created', 'retry', 'active')
    ${onlyTaskIds ? sql`AND data->>'taskId' = ANY(${onlyTaskIds as string[]})` : sql``}`.execute(db);
  if (rows.length === 0) return;
  const boss = await getBoss(databaseUrl);
  await boss.cancel(IMAGE_QUEUE, rows.map((r) => r.id));
}

/** Runs whose analysis is no longer running (it ended, or its worker died and it was requeued or failed): ended. */
export async function cancelOrphanedRuns(db: DbExecutor, databaseUrl: string): Promise<number> {
  const runs = await db
    .updateTable("basis_runs")
    .set({ status: "cancelled", error: "its analysis is no longer running", finished_at: sql`now()` })
    .where("status", "=", "running")
    .where("analysis_id", "is not", null)
    .where(sql<boolean>`NOT EXISTS (SELECT 1 FROM analyses a WHERE a.id = basis_runs.analysis_id AND a.status = 'running')`)
    .returning("id")
    .execute();
  for (const r of runs) await cancelRunJobs(db, databaseUrl, r.id);
  return runs.length;
}
