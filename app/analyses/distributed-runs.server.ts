/**
 * The distributed bases of an analysis (app/jobs/coordinator.server.ts), as the page shows them:
 * images done and needed, primes used and set aside, the workers that computed child jobs, the
 * engine version, and why a run was not used.
 */
import { sql } from "kysely";
import type { DbExecutor } from "~/db/schema";

export interface DistributedRunView {
  id: string;
  status: string;
  imagesDone: number;
  /** null while the lift is not yet stable. */
  imagesNeeded: number | null;
  primesUsed: number[];
  unluckyPrimes: number[];
  /** Set aside because the run's learnt F4 run declined there. */
  declinedPrimes: number[];
  proofDone: number;
  proofBatches: number;
  /** Worker ids (host:process:tag); on a shared view only how many. */
  workers: string[];
  workerCount: number;
  engineVersion: string;
  error: string | null;
  /** A run that was not used: what the analysis did instead (a later run spread its homogenised ideal, or one process). */
  insteadBy: "later run" | "one process" | null;
}

export async function distributedRunsOf(db: DbExecutor, analysisId: string, options: { sharedView: boolean }): Promise<DistributedRunView[]> {
  // Not the candidate's text or the trace (megabytes each on large runs): only what the page shows.
  const runs = await db.selectFrom("basis_runs")
    .select(["id", "status", "images_done", "images_needed", "primes_used", "unlucky_primes", "engine_version", "error", "input", sql<number[] | null>`candidate->'declined'`.as("declined")])
    .where("analysis_id", "=", analysisId).orderBy("created_at").execute();
  if (runs.length === 0) return [];
  const tasks = await db.selectFrom("basis_tasks").select(["run_id", "kind", "status", "worker_id"]).where("run_id", "in", runs.map((r) => r.id)).execute();
  return runs.map((r, i) => {
    const mine = tasks.filter((t) => t.run_id === r.id);
    const workers = [...new Set(mine.filter((t) => t.status === "done" && t.worker_id).map((t) => t.worker_id!))].sort();
    const proof = mine.filter((t) => t.kind === "proof");
    return {
      id: r.id,
      status: r.status,
      imagesDone: r.images_done,
      imagesNeeded: r.images_needed,
      primesUsed: (r.primes_used as unknown as number[] | null) ?? [],
      unluckyPrimes: (r.unlucky_primes as unknown as number[] | null) ?? [],
      declinedPrimes: r.declined ?? [],
      proofDone: proof.filter((t) => t.status === "done").length,
      proofBatches: proof.length,
      workers: options.sharedView ? [] : workers,
      workerCount: workers.length,
      engineVersion: r.engine_version,
      error: r.error,
      // A failed run is followed by one on the homogenised ideal when its step 3 failed (app/jobs/distribute-in-child.server.ts).
      insteadBy: r.status !== "failed" ? null : runs.slice(i + 1).some((later) => homogenisationOf(later.input, r.input)) ? "later run" : "one process",
    };
  });
}

/** Whether run input `later` is the homogenisation of `earlier` (the same variables and one more, last). */
function homogenisationOf(later: unknown, earlier: unknown): boolean {
  const a = (later as { vars?: string[] } | null)?.vars, b = (earlier as { vars?: string[] } | null)?.vars;
  return Array.isArray(a) && Array.isArray(b) && a.length === b.length + 1 && b.every((v, k) => a[k] === v);
}
