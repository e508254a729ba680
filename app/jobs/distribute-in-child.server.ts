/**
 * One distributed basis for a job process (child.ts): its own small pool and queue client, the
 * coordinator, and the outcome as a `known` entry (the proven basis, or null = compute it locally).
 */
import type { DistributeRequest } from "@domain/algebra/f4/distribution";
import { distributionKey, homogenisedRoute } from "@domain/algebra/f4/distribution";
import { Limits } from "@domain/algebra/groebner/limits";
import { createDb } from "~/db.server";
import type { Database } from "~/db/schema";
import type { Kysely } from "kysely";
import { distributedGroebner, type DistributedOutcome, type DistributedProgress } from "./coordinator.server";

let db: Kysely<Database> | null = null;

/**
 * What the analysis result records of each basis it spread over the workers (key
 * `distributedBases`): which primes were lifted and which set aside, by which engine version and
 * workers. Not proven = computed in the job's own process instead (`failed` says which proof step).
 */
export interface DistributedBasisRecord {
  runId: string;
  proven: boolean;
  failed?: string;
  elements: number | null;
  primes: number[];
  unluckyPrimes: number[];
  /** Primes set aside because the run's learnt F4 run declined there (absent when none). */
  declinedPrimes?: number[];
  engineVersion: string;
  workers: string[];
  /** The run spread the homogenised ideal F^h (after step 3 failed on F); its basis was dehomogenised. */
  homogenised?: boolean;
}

/** IMAGE_TASK_EXPIRE_SECONDS (README): unset = the coordinator's default (10 × the first image's time, at least 60 s). */
function taskExpiry(): { taskExpireSeconds?: number } {
  const v = Number(process.env.IMAGE_TASK_EXPIRE_SECONDS);
  return Number.isFinite(v) && v > 0 ? { taskExpireSeconds: v } : {};
}

function recordOf(out: DistributedOutcome): DistributedBasisRecord {
  return {
    runId: out.runId, proven: out.basis !== null, ...(out.failed ? { failed: out.failed } : {}), elements: out.basis?.length ?? null,
    primes: out.primes, unluckyPrimes: out.unlucky, ...(out.declined.length > 0 ? { declinedPrimes: out.declined } : {}), engineVersion: out.engineVersion, workers: out.workers,
  };
}

function progressText(p: DistributedProgress): string {
  return p.stage === "images"
    ? `distributed Gröbner basis: ${p.imagesDone} images done of ${p.imagesNeeded ?? `at least ${p.imagesDone + 1}`} needed; workers: ${p.workers.join(", ")}`
    : `distributed Gröbner basis: proof batch ${p.proofDone} of ${p.proofBatches} (${p.imagesDone} images); workers: ${p.workers.join(", ")}`;
}

export async function distributeOne(
  request: DistributeRequest,
  o: { databaseUrl: string; analysisId: string; workerId: string },
  deadline: number,
  progress: (message: string) => void,
): Promise<{ key: string; basis: readonly string[] | null; records: DistributedBasisRecord[] }> {
  db ??= createDb(o.databaseUrl, { max: 2 });
  const key = distributionKey(request.input);
  progress(`distributed Gröbner basis: first image modulo a prime took ${request.firstImageMs} ms; spreading the images over the workers`);
  const out = await distributedGroebner(request.input, {
    db,
    databaseUrl: o.databaseUrl,
    coordinatorId: `${o.workerId} (coordinator)`,
    analysisId: o.analysisId,
    firstImage: { image: request.firstImage, ms: request.firstImageMs, ...(request.firstTrace ? { trace: request.firstTrace } : {}) },
    ...taskExpiry(),
    limits: new Limits({ deadline }, "Distributed Gröbner basis"),
    onProgress: (p) => progress(progressText(p)),
  });
  const records = [recordOf(out)];
  let basis = out.basis;
  const viaH = !basis && out.failed === "hilbert" ? homogenisedRoute(request.input) : null;
  if (viaH) {
    // Step 3 by Hilbert functions cannot prove ⟨F⟩ (its homogenisation is not saturated): spread
    // the homogenised ideal instead, whose step 3 is the homogeneous case, then set h = 1.
    progress("distributed Gröbner basis: step 3 cannot be proven for this ideal as it stands; spreading its homogenisation instead");
    const outH = await distributedGroebner(viaH.input, {
      db, databaseUrl: o.databaseUrl, coordinatorId: `${o.workerId} (coordinator)`, analysisId: o.analysisId, ...taskExpiry(),
      limits: new Limits({ deadline }, "Distributed Gröbner basis"), onProgress: (p) => progress(progressText(p)),
    });
    records.push({ ...recordOf(outH), homogenised: true });
    if (outH.basis) basis = viaH.finish(outH.basis, new Limits({ deadline }, "Distributed Gröbner basis"));
  }
  if (!basis) progress(`distributed Gröbner basis not proven (${records[records.length - 1].failed}); computing it in this process`);
  return { key, basis, records };
}
