/**
 * One distributed basis for a job process (child.ts): its own small pool and queue client, the
 * coordinator, and the outcome as a `known` entry (the proven basis, or null = compute it locally).
 */
import type { DistributeRequest } from "@domain/algebra/f4/distribution";
import { distributionKey } from "@domain/algebra/f4/distribution";
import { Limits } from "@domain/algebra/groebner/limits";
import { createDb } from "~/db.server";
import type { Database } from "~/db/schema";
import type { Kysely } from "kysely";
import { distributedGroebner } from "./coordinator.server";

let db: Kysely<Database> | null = null;

export async function distributeOne(
  request: DistributeRequest,
  o: { databaseUrl: string; analysisId: string; workerId: string },
  deadline: number,
  progress: (message: string) => void,
): Promise<[string, readonly string[] | null]> {
  db ??= createDb(o.databaseUrl, { max: 2 });
  const key = distributionKey(request.input);
  progress(`distributed Gröbner basis: first image modulo a prime took ${request.firstImageMs} ms; spreading the images over the workers`);
  const out = await distributedGroebner(request.input, {
    db,
    databaseUrl: o.databaseUrl,
    coordinatorId: `${o.workerId} (coordinator)`,
    analysisId: o.analysisId,
    firstImage: { image: request.firstImage, ms: request.firstImageMs },
    limits: new Limits({ deadline }, "Distributed Gröbner basis"),
    onProgress: (p) =>
      progress(
        p.stage === "images"
          ? `distributed Gröbner basis: ${p.imagesDone} images done of ${p.imagesNeeded ?? `at least ${p.imagesDone + 1}`} needed; workers: ${p.workers.join(", ")}`
          : `distributed Gröbner basis: proof batch ${p.proofDone} of ${p.proofBatches} (${p.imagesDone} images); workers: ${p.workers.join(", ")}`,
      ),
  });
  if (!out.basis) progress(`distributed Gröbner basis not proven (${out.failed}); computing it in this process`);
  return [key, out.basis];
}
