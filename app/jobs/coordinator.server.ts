/**
 * The coordinator of a distributed multi-modular basis over Q (issue: one big computation on many
 * workers). It runs in the process that needs the basis (an analysis' job process, or the bench),
 * and does only the serial part itself:
 *
 *   1. records a basis_runs row and keeps `window` tasks ahead on the image queue (one
 *      basis_tasks row + one pg-boss job per task, in liftPrimes order, earlier primes first; a
 *      task is one prime, or a few consecutive primes once images are known to be quick);
 *   2. adds the images to the lift strictly in prime order as they arrive (CRT + rational
 *      reconstruction, unlucky primes set aside by their leading monomials; ImageLifter), so the
 *      primes used and the basis are the same whoever computed which image;
 *   3. once the lift agrees with a fresh prime, cancels the images still queued and puts the
 *      proof on the queue as S-pair batches plus the input and Hilbert/membership steps;
 *   4. records the primes used and the engine version with the run.
 *
 * Scheduling is pg-boss's (priorities, retries, expiry of a dead worker's job, dead letters); a
 * task whose job is dead-lettered is computed here instead, so a run never waits on a lost task.
 */
import { sql } from "kysely";
import type { Kysely } from "kysely";
import type { LiftCandidate, ModularImage, MultiModularInput, ProofBatch } from "@domain/algebra/f4/multimodular";
import type { ImageTracing } from "@domain/algebra/f4/multimodular";
import { ImageLifter, batchReference, decodeImageBatch, decodeImageTrace, encodeImage, encodeIntegerCandidate, imageModPrime, isDeclinedOnly, leadsCandidate, liftPrimes, proofBatches, proveBatch } from "@domain/algebra/f4/multimodular";
import { Limits } from "@domain/algebra/groebner/limits";
import { ENGINE_VERSION } from "~/analyses/engine-version";
import type { Database, JsonObject } from "~/db/schema";
import { cancelRunJobs, imagePrimes } from "./basis-tasks.server";
import { enqueueTask } from "./queue.server";

export interface CoordinatorOptions {
  db: Kysely<Database>;
  databaseUrl: string;
  /** Who coordinates (worker id plus "coordinator"), recorded with the run. */
  coordinatorId: string;
  analysisId?: string | null;
  /** Images kept on the queue beyond the next one the lift needs (default 6). */
  window?: number;
  /** Proof S-pair batches (default 8: more batches than workers balance uneven batches). */
  pairBatches?: number;
  /**
   * The first image, when the caller already computed it (it decided to distribute on its time),
   * and the F4 run it learnt there (encodeImageTrace): stored with the run, so that every worker
   * replays it at its primes (a tenth of an image) instead of learning it again.
   */
  firstImage?: { image: ModularImage; ms: number; trace?: Uint8Array };
  /** How long an active task may take before pg-boss fails it (its worker presumed dead) and retries it. */
  taskExpireSeconds?: number;
  pollMs?: number;
  /** Deadline and cancellation of the whole run. */
  limits?: Limits;
  onProgress?: (p: DistributedProgress) => void;
}

export interface DistributedProgress {
  runId: string;
  stage: "images" | "proof";
  imagesDone: number;
  /** Known once the lift is stable; before that, at least imagesDone + 1. */
  imagesNeeded: number | null;
  proofDone: number;
  proofBatches: number;
  workers: string[];
}

export interface DistributedOutcome {
  runId: string;
  /** The proven basis as exact text in the input's ring (sorted by increasing leading monomial), or null. */
  basis: string[] | null;
  failed?: string;
  primes: number[];
  unlucky: number[];
  /** Primes set aside because the run's trace declined there (ModularImage.declined). */
  declined: number[];
  engineVersion: string;
  workers: string[];
  /** Bytes of the stored images (mean) and time from enqueue to start (median, ms), for the bench. */
  meanImageBytes: number;
  medianWaitMs: number;
  /** Median time from "could start" (enqueued and a worker free) to start (ms): the queue's own overhead. */
  medianPickupMs: number;
  /** Tasks and compute time (ms, inside the task process) per worker: how the work was split. */
  computeByWorker?: Record<string, { tasks: number; ms: number }>;
  timings: { imagesMs: number; liftMs: number; proofMs: number };
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Work per image task once the first image's time is known (ms), and the most primes one task takes. */
const TASK_TARGET_MS = 300;
const MAX_IMAGES_PER_TASK = 64;
/** How often the images' progress is written and the early step-3 check looked up (ms). */
const PROGRESS_EVERY_MS = 100;

export async function distributedGroebner(input: MultiModularInput, o: CoordinatorOptions): Promise<DistributedOutcome> {
  const { db } = o;
  const limits = o.limits ?? new Limits();
  const window = Math.max(1, o.window ?? 6);
  const pollMs = o.pollMs ?? 50;
  let polls = 0;
  const expire = o.taskExpireSeconds ?? Math.max(60, 10 * ((o.firstImage?.ms ?? 5000) / 1000));
  if (o.analysisId) {
    // A run left by an earlier attempt of the same analysis (its process died): end it first.
    const { cancelBasisRuns } = await import("./basis-tasks.server");
    await cancelBasisRuns(db, o.databaseUrl, { analysisId: o.analysisId }, "superseded by a new attempt");
  }
  const run = await db
    .insertInto("basis_runs")
    .values({
      analysis_id: o.analysisId ?? null, input: input as unknown as JsonObject, coordinator: o.coordinatorId, engine_version: ENGINE_VERSION,
      trace: o.firstImage?.trace ? Buffer.from(o.firstImage.trace.buffer, o.firstImage.trace.byteOffset, o.firstImage.trace.byteLength) : null,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  const runId = run.id;
  const primes: number[] = [];
  const primeGen = liftPrimes(input);
  const seqOfPrime = new Map<number, number>();
  const primeAt = (i: number) => {
    while (primes.length <= i) {
      const p = primeGen.next().value as number;
      seqOfPrime.set(p, primes.length);
      primes.push(p);
    }
    return primes[i];
  };
  let localTracing: ImageTracing | undefined; // the run's trace, for images computed here (computeImagesLocally)
  const enqueued = new Map<number, string>(); // seq -> id of the task computing it ("first": the caller's)
  const taskFirstSeq = new Map<string, number>();
  const decoded = new Map<number, ModularImage>(); // prime -> image, for images written on another's support
  const ready = new Map<number, ModularImage>(); // seq -> image decoded with its task, not yet lifted
  let nextSeq = 0;
  // Images per task: 1 until the first image's time is known, then enough for about
  // TASK_TARGET_MS each, so that quick images (the 4-site cycle's: 40 ms) do not pay the
  // queue's and the database's per-task cost (about 8 ms) every time.
  let perTask = 1;
  const enqueueImagesUpTo = async (limit: number) => {
    while (nextSeq < limit) {
      const start = nextSeq, count = start === 0 ? 1 : perTask;
      const primesOf = Array.from({ length: count }, (_, i) => primeAt(start + i));
      const row = await db.insertInto("basis_tasks")
        .values({ run_id: runId, kind: "image", seq: start, prime: primesOf[0], ...(count > 1 ? { batch: JSON.stringify({ primes: primesOf }) as unknown as JsonObject } : {}) })
        .returning("id").executeTakeFirstOrThrow();
      for (let i = 0; i < count; i++) enqueued.set(start + i, row.id);
      taskFirstSeq.set(row.id, start);
      nextSeq = start + count;
      // Earlier primes first: the lift takes them in order.
      await enqueueTask(o.databaseUrl, { taskId: row.id, runId }, { priority: 1_000_000 - start, expireInSeconds: expire });
    }
  };
  const workers = async () =>
    (await db.selectFrom("basis_tasks").select("worker_id").distinct().where("run_id", "=", runId).where("worker_id", "is not", null).execute())
      .map((r) => r.worker_id!)
      .sort();
  // At most every PROGRESS_EVERY_MS while images arrive (the 4-site cycle lifts 744 images in under
  // a second: two queries each would double that); always at a stage's end and in the proof.
  let progressAt = 0;
  const progress = async (p: Omit<DistributedProgress, "runId" | "workers">, force = true) => {
    if (!force && Date.now() - progressAt < PROGRESS_EVERY_MS) return;
    progressAt = Date.now();
    await db.updateTable("basis_runs").set({ images_done: p.imagesDone, images_needed: p.imagesNeeded }).where("id", "=", runId).execute();
    o.onProgress?.({ runId, ...p, workers: await workers() });
  };

  try {
    const lifter = new ImageLifter(input, () => limits.checkTime());
    let candidate: LiftCandidate | null = null;
    let seq = 0;
    if (o.firstImage) {
      // Stored like any other image, so the page and the bench count it.
      const bytes = Buffer.from(encodeImage(o.firstImage.image));
      await db.insertInto("basis_tasks").values({
        run_id: runId, kind: "image", seq: 0, prime: primeAt(0), status: "done", worker_id: o.coordinatorId, attempts: 1, image: bytes,
        bytes: bytes.byteLength, compute_ms: o.firstImage.ms, started_at: sql`now()`, finished_at: sql`now()`,
      }).execute();
      enqueued.set(0, "first");
      nextSeq = 1;
      if (o.firstImage.image.p !== primeAt(0)) throw new Error("distributedGroebner: the first image must be modulo the first lift prime");
    }
    const imagesStart = Date.now();
    // Step 3 of the proof on the first image's leading monomials, beside the images: when it
    // cannot succeed (the homogenised ideal is not saturated), stop before lifting, as the
    // single-process run does. Graded orders only; lex and block orders prove membership instead.
    let early: { id: string; batch: ProofBatch; leads: LiftCandidate } | null = null;
    let earlyPassed = false, earlyLookedAt = 0;
    let proofSeq = 0;
    const batchKinds = proofBatches(input, { basis: [], primes: [], unlucky: [], checkedWith: 0 }, 1).map((b) => b.kind);
    let aborted: string | undefined;
    while (!candidate) {
      await enqueueImagesUpTo(seq + window * perTask);
      let image = await imageAt(seq);
      // A prime where the run's trace declined and the lift can no longer set one aside (rare:
      // the workers compute such images afresh once declines are frequent): its image in full, here.
      if (isDeclinedOnly(image) && !lifter.takesDecline()) image = imageModPrime(input, image.p, limits);
      if (seq === 0 && o.firstImage) perTask = imagesPerTask(o.firstImage.ms);
      if (seq === 0 && batchKinds.includes("hilbert")) {
        const leads = leadsCandidate(input, image);
        const batch: ProofBatch = { kind: "hilbert", p: image.p };
        const row = await db.insertInto("basis_tasks").values({ run_id: runId, kind: "proof", seq: proofSeq++, batch: { ...batch, leads: leads.basis } as unknown as JsonObject }).returning("id").executeTakeFirstOrThrow();
        await enqueueTask(o.databaseUrl, { taskId: row.id, runId }, { priority: 2_000_001, expireInSeconds: expire * 4 });
        early = { id: row.id, batch, leads };
      }
      if (early && !earlyPassed && Date.now() - earlyLookedAt >= PROGRESS_EVERY_MS) {
        earlyLookedAt = Date.now();
        const r = await db.selectFrom("basis_tasks").select(["status", "ok"]).where("id", "=", early.id).executeTakeFirstOrThrow();
        if (r.status === "done" && r.ok === false) { aborted = "hilbert"; break; }
        earlyPassed = r.status === "done" && r.ok === true;
      }
      candidate = lifter.add(image);
      seq++;
      await progress({ stage: "images", imagesDone: seq, imagesNeeded: candidate ? seq : null, proofDone: 0, proofBatches: 0 }, candidate !== null);
    }
    if (!candidate && aborted) {
      await cancelRunJobs(db, o.databaseUrl, runId);
      await db.updateTable("basis_runs").set({ status: "failed", error: `proof step failed: ${aborted} (checked on the first image, before lifting)`, finished_at: sql`now()` }).where("id", "=", runId).execute();
      return { runId, basis: null, failed: aborted, primes: [], unlucky: [], declined: [], engineVersion: ENGINE_VERSION, workers: await workers(), meanImageBytes: 0, medianWaitMs: 0, medianPickupMs: 0, timings: { imagesMs: Date.now() - imagesStart, liftMs: lifter.liftMs, proofMs: 0 } };
    }
    if (!candidate) throw new Error("distributedGroebner: no candidate");
    if (early) {
      // The early check must pass too (it is what makes the lift worth proving).
      const r = await waitForProof(early.id, () => computeLocally({ kind: "proof", batch: early!.batch }, early!.leads));
      if (!r.ok) {
        await cancelRunJobs(db, o.databaseUrl, runId);
        await db.updateTable("basis_runs").set({ status: "failed", error: "proof step failed: hilbert (checked on the first image)", finished_at: sql`now()` }).where("id", "=", runId).execute();
        return { runId, basis: null, failed: "hilbert", primes: [], unlucky: [], declined: [], engineVersion: ENGINE_VERSION, workers: await workers(), meanImageBytes: 0, medianWaitMs: 0, medianPickupMs: 0, timings: { imagesMs: Date.now() - imagesStart, liftMs: lifter.liftMs, proofMs: 0 } };
      }
    }
    const imagesMs = Date.now() - imagesStart;
    // Images no longer needed: cancel those still queued (one a worker is computing finishes; its row is ignored).
    const extra = [...taskFirstSeq.entries()].filter(([, s]) => s >= seq).map(([id]) => id);
    await cancelRunJobs(db, o.databaseUrl, runId, extra);

    const proofStart = Date.now();
    // Step 3 already passed on the first image at the same prime: when that image is one the
    // candidate was combined from, the candidate has its leading monomials, so the batch would
    // compute the same thing again (one more F4 run modulo p on the input's homogenisation, in a
    // task process that has not cached it: 0.24 s on katsura-8).
    const checked = (b: ProofBatch) => early !== null && b.kind === "hilbert" && b.p === primeAt(0) && candidate!.primes.includes(b.p);
    const batches = proofBatches(input, candidate, o.pairBatches ?? 8).filter((b) => !checked(b));
    // Arrays as JSON text: pg would send a JS array as a Postgres array.
    const json = (x: unknown) => JSON.stringify(x) as unknown as JsonObject;
    // Its integer form too (not for Hilbert-series proofs, whose batches need the text): each
    // worker loads that instead of parsing the text (katsura-8: ~370 ms per fresh task process).
    const integer = input.series ? null : encodeIntegerCandidate(input, candidate, limits);
    await db.updateTable("basis_runs").set({
      candidate: json(candidate), primes_used: json(candidate.primes), unlucky_primes: json(candidate.unlucky),
      candidate_integer: integer && Buffer.from(integer.buffer, integer.byteOffset, integer.byteLength),
    }).where("id", "=", runId).execute();
    const proofIds: string[] = [];
    for (const [i, batch] of batches.entries()) {
      const row = await db.insertInto("basis_tasks").values({ run_id: runId, kind: "proof", seq: proofSeq++, batch: batch as unknown as JsonObject }).returning("id").executeTakeFirstOrThrow();
      proofIds.push(row.id);
      // Proof batches before any image of another run; the pairs (the long ones) first.
      await enqueueTask(o.databaseUrl, { taskId: row.id, runId }, { priority: 2_000_000 - i, expireInSeconds: expire * 4 });
    }
    let failed: string | undefined;
    let done = 0;
    for (const [i, batch] of batches.entries()) {
      const r = await waitForProof(proofIds[i], () => computeLocally({ kind: "proof", batch }, candidate!));
      done++;
      await progress({ stage: "proof", imagesDone: seq, imagesNeeded: seq, proofDone: done, proofBatches: batches.length });
      if (!r.ok) {
        failed = r.failed;
        break;
      }
    }
    const proofMs = Date.now() - proofStart;
    await cancelRunJobs(db, o.databaseUrl, runId); // anything left (a failed proof stops early)
    await db.updateTable("basis_runs").set({ status: failed ? "failed" : "succeeded", error: failed ? `proof step failed: ${failed}` : null, finished_at: sql`now()` }).where("id", "=", runId).execute();
    const stats = await db.selectFrom("basis_tasks")
      .select([
        sql<number>`sum(bytes)::float8 / nullif(sum(CASE WHEN kind = 'image' THEN coalesce(jsonb_array_length(batch->'primes'), 1) END), 0)`.as("bytes"),
        sql<number>`percentile_cont(0.5) WITHIN GROUP (ORDER BY extract(epoch FROM started_at - enqueued_at) * 1000)`.as("wait"),
      ])
      .where("run_id", "=", runId).where("status", "=", "done").where("worker_id", "<>", o.coordinatorId)
      .executeTakeFirst();
    // Pick-up latency: from the moment a task could start (enqueued, and its worker free again) to its start.
    const pickup = await sql<{ ms: number | null }>`
      SELECT percentile_cont(0.5) WITHIN GROUP (ORDER BY extract(epoch FROM started_at - greatest(enqueued_at, coalesce(prev, enqueued_at))) * 1000) AS ms
      FROM (SELECT started_at, enqueued_at, lag(finished_at) OVER (PARTITION BY worker_id ORDER BY started_at) AS prev
            FROM basis_tasks WHERE run_id = ${runId} AND status = 'done' AND worker_id <> ${o.coordinatorId}) x`.execute(db);
    const split = await db.selectFrom("basis_tasks").select(["worker_id", sql<number>`sum(compute_ms)::int`.as("ms"), sql<number>`count(*)::int`.as("n")])
      .where("run_id", "=", runId).where("status", "=", "done").where("worker_id", "is not", null).groupBy("worker_id").execute();
    return {
      computeByWorker: Object.fromEntries(split.map((r) => [r.worker_id!, { tasks: r.n, ms: r.ms }])),
      medianPickupMs: Number(pickup.rows[0]?.ms ?? 0),
      runId, basis: failed ? null : [...candidate.basis], ...(failed ? { failed } : {}), primes: [...candidate.primes], unlucky: [...candidate.unlucky], declined: [...(candidate.declined ?? [])],
      engineVersion: ENGINE_VERSION, workers: await workers(), meanImageBytes: Number(stats?.bytes ?? 0), medianWaitMs: Number(stats?.wait ?? 0),
      timings: { imagesMs, liftMs: lifter.liftMs, proofMs },
    };
  } catch (e) {
    await db.updateTable("basis_runs").set({ status: "failed", error: (e as Error).message, finished_at: sql`now()` }).where("id", "=", runId).where("status", "=", "running").execute().catch(() => undefined);
    await cancelRunJobs(db, o.databaseUrl, runId).catch(() => undefined);
    throw e;
  }

  /**
   * Image `s` of this run: waits for the task computing it (which may hold a few consecutive
   * primes) and decodes all of them; computes them here if the task was dead-lettered or failed.
   */
  async function imageAt(s: number): Promise<ModularImage> {
    const have = ready.get(s);
    if (have) { ready.delete(s); return have; }
    const id = enqueued.get(s)!;
    for (;;) {
      limits.checkTime();
      const base = db.selectFrom("basis_tasks").select(["status", "image", "prime", "batch", "compute_ms"]).where("run_id", "=", runId).where("kind", "=", "image");
      const t = await (id === "first" ? base.where("seq", "=", 0) : base.where("id", "=", id)).executeTakeFirstOrThrow();
      let images: ModularImage[] | null = null;
      if (t.status === "done" && t.image) {
        const bytes = new Uint8Array(t.image);
        // Residues on an earlier image's support (task-child.ts): that image was added before.
        const ref = batchReference(bytes);
        images = ref === null || decoded.has(ref) ? decodeImageBatch(bytes, (q) => decoded.get(q)) : await computeImagesLocally(imagePrimes(t));
        // Task size from the latest image time (a process's first images run cold, several times slower).
        if (t.compute_ms !== null) perTask = imagesPerTask(t.compute_ms / imagePrimes(t).length);
      } else if (t.status === "failed" || (id !== "first" && (await deadLettered(id)))) {
        images = await computeImagesLocally(imagePrimes(t));
      }
      if (images) {
        for (const image of images) {
          decoded.set(image.p, image);
          ready.set(seqOfPrime.get(image.p)!, image);
        }
        const image = ready.get(s)!;
        ready.delete(s);
        return image;
      }
      await sleep(pollMs);
    }
  }

  /** How many primes a task takes, for images of `ms` each: TASK_TARGET_MS of work, at most MAX_IMAGES_PER_TASK. */
  function imagesPerTask(ms: number): number {
    return Math.max(1, Math.min(MAX_IMAGES_PER_TASK, Math.floor(TASK_TARGET_MS / Math.max(1, ms))));
  }

  async function computeImagesLocally(primesOf: readonly number[]): Promise<ModularImage[]> {
    // With the run's trace, as a worker would: the same primes are then declined and set aside.
    if (localTracing === undefined && o.firstImage?.trace) {
      localTracing = { trace: decodeImageTrace(input, o.firstImage.trace), replayed: 0, declined: 0, onDecline: () => true };
    }
    return primesOf.map((p) => imageModPrime(input, p, limits, undefined, undefined, localTracing));
  }

  async function waitForProof(taskId: string, local: () => Promise<{ ok: boolean; failed?: string }>): Promise<{ ok: boolean; failed?: string }> {
    for (;;) {
      limits.checkTime();
      const t = await db.selectFrom("basis_tasks").select(["status", "ok", "failed_step"]).where("id", "=", taskId).executeTakeFirstOrThrow();
      if (t.status === "done") return { ok: t.ok === true, ...(t.failed_step ? { failed: t.failed_step } : {}) };
      if (t.status === "failed" || (await deadLettered(taskId))) return local();
      await sleep(pollMs);
    }
  }

  /**
   * A task whose job used up its retries (pg-boss moved it to the dead letter queue). Looked up
   * about once a second, not at every poll: pgboss.job has no index on the task id.
   */
  async function deadLettered(taskId: string): Promise<boolean> {
    if (++polls % Math.max(1, Math.round(1000 / pollMs)) !== 0) return false;
    const { rows } = await sql<{ n: number }>`SELECT count(*)::int AS n FROM pgboss.job WHERE data->>'taskId' = ${taskId} AND state = 'failed'`.execute(db);
    return (rows[0]?.n ?? 0) > 0;
  }

  async function computeLocally(what: { kind: "proof"; batch: ProofBatch }, c: LiftCandidate): Promise<{ ok: boolean; failed?: string }> {
    const r = proveBatch(input, c, what.batch, limits);
    return r.ok ? { ok: true } : { ok: false, failed: r.failed };
  }
}
