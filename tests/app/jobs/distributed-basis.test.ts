import { spawn, type ChildProcess } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PolynomialRing, QQ, groebnerBasis } from "@domain/algebra/index";
import type { ImageTracing } from "@domain/algebra/f4/multimodular";
import { ImageLifter, encodeImageTrace, imageModPrime, liftPrimes, multiModularInput } from "@domain/algebra/f4/multimodular";
import { Limits } from "@domain/algebra/groebner/limits";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "../support/test-db";
import { waitFor } from "./fixtures";
import { imagePrimes } from "~/jobs/basis-tasks.server";
import { distributedGroebner } from "~/jobs/coordinator.server";
import { getBoss, stopBosses } from "~/jobs/queue.server";
import { startWorker, type RunningWorker } from "~/jobs/worker.server";
import { katsura } from "../../fixtures/algebra/systems";

/**
 * A distributed basis (coordinator + workers over the image queue) against a real database: the
 * same reduced basis as the single-process path, and a worker killed while it holds a child job
 * costs nothing but time (pg-boss expires its job and another worker recomputes the task).
 * Reduced bases are unique (Cox, Little, O'Shea, ch. 2 §7, Prop. 6), so equality is exact; the
 * single-process reference is this project's Buchberger over Q (checked against SymPy 1.11 and
 * Singular 4.3 in tests/domain/algebra).
 */
process.env.QUEUE_MAINTENANCE_SECONDS = "1";

describe.skipIf(!hasTestDatabase)("distributed multi-modular basis", () => {
  let t: TestDatabase;
  const workers: RunningWorker[] = [];
  beforeAll(async () => {
    t = await createTestDatabase();
    // This process supervises the queue (expires a dead worker's jobs), as every worker does.
    await getBoss(t.url, { supervise: true });
  });
  afterAll(async () => {
    for (const w of workers) await w.stop();
    await stopBosses();
    await t?.drop();
  });
  const start = async () => {
    const w = await startWorker({ databaseUrl: t.url, heartbeatMs: 200, pollSeconds: 0.5, sweepEveryMs: 60_000, log: () => {} });
    workers.push(w);
    return w;
  };
  const system = (n: number) => {
    const R = new PolynomialRing(katsura(n).vars, QQ, "grevlex");
    return { R, polys: katsura(n).polys.map((s) => R.parse(s)) };
  };

  it("two workers give the single-process basis; the run records primes, engine version, workers and stored images", async () => {
    const [a, b] = [await start(), await start()];
    const { R, polys } = system(5);
    const out = await distributedGroebner(multiModularInput(polys), { db: t.db, databaseUrl: t.url, coordinatorId: "test-coordinator", window: 4, pairBatches: 3 });
    expect(out.failed).toBeUndefined();
    expect(out.basis).toEqual(groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g)));
    expect(out.primes.length).toBeGreaterThan(1);
    expect(out.workers.every((w) => [a.id, b.id].includes(w))).toBe(true);
    const run = await t.db.selectFrom("basis_runs").selectAll().where("id", "=", out.runId).executeTakeFirstOrThrow();
    expect(run.status).toBe("succeeded");
    expect(run.primes_used).toEqual(out.primes);
    expect(run.engine_version).toBe(out.engineVersion);
    expect(run.images_needed).toBe(out.primes.length + out.unlucky.length + 1);
    const tasks = await t.db.selectFrom("basis_tasks").selectAll().where("run_id", "=", out.runId).execute();
    const images = tasks.filter((x) => x.kind === "image" && x.status === "done");
    // Quick images go a few primes per task after the first (the coordinator's TASK_TARGET_MS).
    const primesComputed = images.flatMap((x) => imagePrimes(x));
    expect(new Set(primesComputed).size).toBe(primesComputed.length);
    expect(primesComputed.length).toBeGreaterThanOrEqual(run.images_needed!);
    expect(images.find((x) => x.seq === 0)!.batch).toBeNull();
    expect(images.some((x) => imagePrimes(x).length > 1)).toBe(true);
    expect(images.every((x) => x.bytes! > 0 && x.image!.byteLength === x.bytes)).toBe(true);
    // The early step-3 check, 3 pair batches, inputs; step 3 again only if the first prime was unlucky
    // (otherwise the candidate has the first image's leading monomials and the early check covers it).
    const proofs = tasks.filter((x) => x.kind === "proof");
    const firstLucky = out.primes.includes(images.find((x) => x.seq === 0)!.prime!);
    expect(proofs.map((x) => [x.status, x.ok])).toEqual(Array(firstLucky ? 5 : 6).fill(["done", true]));
    expect(proofs.filter((x) => (x.batch as { kind?: string } | null)?.kind === "hilbert")).toHaveLength(firstLucky ? 1 : 2);
    // Images after a worker's first are sent as residues on its previous image's support.
    expect(images.some((x) => x.bytes! < images.find((y) => y.seq === 0)!.bytes! / 3)).toBe(true);
    for (const w of workers.splice(0)) await w.stop();
  }, 120_000);

  it("the coordinator's learnt F4 run is stored with the run; the workers replay it from their first prime on, and the basis is the same", async () => {
    const lines: string[] = [];
    for (let i = 0; i < 2; i++) {
      workers.push(await startWorker({ databaseUrl: t.url, heartbeatMs: 200, pollSeconds: 0.5, sweepEveryMs: 60_000, logTasks: true, log: (l) => lines.push(l) }));
    }
    const { R, polys } = system(5);
    const input = multiModularInput(polys);
    // As an analysis' job process does (domain/algebra/f4/distribution.ts): the first image here, traced.
    const tracing: ImageTracing = { trace: undefined, replayed: 0, declined: 0 };
    const image = imageModPrime(input, liftPrimes(input).next().value as number, new Limits(), undefined, undefined, tracing);
    const trace = encodeImageTrace(input, tracing.trace!);
    const out = await distributedGroebner(input, { db: t.db, databaseUrl: t.url, coordinatorId: "test-coordinator", window: 4, pairBatches: 3, firstImage: { image, ms: 1, trace } });
    expect(out.basis).toEqual(groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g)));
    const run = await t.db.selectFrom("basis_runs").select("trace").where("id", "=", out.runId).executeTakeFirstOrThrow();
    expect(Buffer.compare(run.trace!, Buffer.from(trace))).toBe(0);
    // Each task process gets the stored trace with its first task of the run and replays every prime.
    const imageLines = lines.filter((l) => l.startsWith("image"));
    expect(imageLines.length).toBeGreaterThan(0);
    expect(imageLines.filter((l) => l.includes("from the run's stored trace")).length).toBeLessThanOrEqual(2);
    expect(imageLines.filter((l) => l.includes("from the run's stored trace")).length).toBeGreaterThanOrEqual(1);
    for (const l of imageLines) {
      const [, got, of] = /(\d+) of (\d+) replayed/.exec(l)!;
      expect(got, l).toBe(of);
    }
    for (const w of workers.splice(0)) await w.stop();
  }, 120_000);

  it("a prime where the stored trace declines is set aside by the workers' images as by the single-process lift: same primes, same basis", async () => {
    workers.push(await start());
    const R = new PolynomialRing(["x", "y", "z"], QQ, "grevlex");
    // The third lift prime as a constant term: the learnt run declines there (tests/domain/algebra/f4/declined-primes.test.ts).
    const q = [...liftPrimes(multiModularInput([R.parse("x")]))][2];
    const polys = [`x^2 + y*z + 1`, `y^2 + x*z - ${q}`, `z^2 + x*y - 3`].map((s) => R.parse(s));
    const input = multiModularInput(polys);
    const tracing: ImageTracing = { trace: undefined, replayed: 0, declined: 0 };
    const image = imageModPrime(input, liftPrimes(input).next().value as number, new Limits(), undefined, undefined, tracing);
    const out = await distributedGroebner(input, { db: t.db, databaseUrl: t.url, coordinatorId: "test-coordinator", window: 2, pairBatches: 2, firstImage: { image, ms: 1, trace: encodeImageTrace(input, tracing.trace!) } });
    expect(out.basis).toEqual(groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g)));
    expect(out.declined).toEqual([q]);
    // The single-process lift, deciding declines the same way, uses the same primes.
    const lifter = new ImageLifter(multiModularInput(polys));
    const own: ImageTracing = { trace: undefined, replayed: 0, declined: 0, onDecline: () => lifter.takesDecline() };
    let cand = null;
    for (const p of liftPrimes(input)) if ((cand = lifter.add(imageModPrime(input, p, new Limits(), undefined, undefined, own)))) break;
    expect(out.primes).toEqual(cand!.primes);
    expect(out.unlucky).toEqual(cand!.unlucky);
    for (const w of workers.splice(0)) await w.stop();
  }, 120_000);

  it("a worker killed while it holds a child job: the task is recomputed by another worker and the basis is the same", async () => {
    const { R, polys } = system(6);
    await getBoss(t.url, { supervise: true }); // (the first test's workers stopped this process's queue client)
    // A worker in its own process, alone at first, so it surely holds a task when it is killed.
    const proc: ChildProcess = spawn("npx", ["tsx", "app/jobs/worker.server.ts"], {
      env: { ...process.env, DATABASE_URL: t.url, QUEUE_MAINTENANCE_SECONDS: "1" }, stdio: "ignore", detached: true,
    });
    let killed: { id: string; worker: string } | undefined;
    const running = distributedGroebner(multiModularInput(polys), { db: t.db, databaseUrl: t.url, coordinatorId: "test-coordinator", window: 4, taskExpireSeconds: 3 });
    try {
      killed = await waitFor(async () => {
        const r = await t.db.selectFrom("basis_tasks").select(["id", "worker_id"]).where("status", "=", "running").executeTakeFirst();
        return r ? { id: r.id, worker: r.worker_id! } : undefined;
      }, 60_000, "the separate worker to hold a task");
    } finally {
      process.kill(-proc.pid!, "SIGKILL");
    }
    const survivor = await start();
    const out = await running;
    expect(out.basis).toEqual(groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g)));
    const task = await t.db.selectFrom("basis_tasks").selectAll().where("id", "=", killed!.id).executeTakeFirstOrThrow();
    // Either recomputed by the survivor after pg-boss expired the dead worker's job, or no longer needed once the lift was stable.
    if (task.status === "done") {
      expect(task.worker_id).toBe(survivor.id);
      expect(task.attempts).toBeGreaterThanOrEqual(2);
    } else expect(task.status).toBe("cancelled");
    expect(out.workers).toContain(survivor.id);
    expect(killed!.worker).not.toBe(survivor.id);
  }, 180_000);
});
