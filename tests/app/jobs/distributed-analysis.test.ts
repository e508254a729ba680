import { spawn, type ChildProcess } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "kysely";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";
import { analysisParams, fixtureCsv, makeJob, makeNetwork, makeTeam, waitFor } from "./fixtures";
import { requestCancel } from "~/analyses/repository.server";
import { computeJob } from "~/jobs/compute";
import { distributedRunsOf } from "~/analyses/distributed-runs.server";
import { enqueue, IMAGE_QUEUE, stopBosses } from "~/jobs/queue.server";
import { startWorker, type RunningWorker } from "~/jobs/worker.server";

/**
 * Analyses whose bases over Q are distributed (threshold 0, so even a small ideal goes through
 * the image queue: slow by construction of the test, not by the engine's speed): the stored
 * result is exactly the one-process result (reduced bases are unique: Cox, Little, O'Shea,
 * "Ideals, Varieties, and Algorithms", ch. 2 §7, Prop. 6), and cancelling the analysis leaves no
 * child job queued or running.
 */
// A dead worker's child job is retried after 3 s (maintenance every second) rather than a minute.
process.env.QUEUE_MAINTENANCE_SECONDS = "1";
process.env.IMAGE_TASK_EXPIRE_SECONDS = "3";

describe.skipIf(!hasTestDatabase)("distributed analyses", () => {
  let t: TestDatabase;
  let team: Awaited<ReturnType<typeof makeTeam>>;
  let cubic: string;
  const workers: RunningWorker[] = [];
  beforeAll(async () => {
    t = await setUpAccountsDb();
    team = await makeTeam(t.db);
    cubic = (await makeNetwork(t.db, team.lab.id, team.owner.id, "cubic", fixtureCsv("cubic-autocatalysis"))).versionId;
  });
  afterAll(async () => {
    for (const w of workers) await w.stop();
    await stopBosses();
    await tearDownAccountsDb(t);
  });
  const start = async (o: { images?: boolean; jobs?: boolean } = {}) => {
    const w = await startWorker({ databaseUrl: t.url, heartbeatMs: 200, graceMs: 1000, sweepEveryMs: 60_000, pollSeconds: 0.5, log: () => {}, distributeAfterMs: 0, ...o });
    workers.push(w);
    return w;
  };
  const job = async (params: object, timeLimitSeconds = 60) => {
    const row = await makeJob(t.db, { kind: "analysis", labId: team.lab.id, networkVersionId: cubic, params, startedBy: team.owner.id, timeLimitSeconds });
    await enqueue(t.url, row.id, timeLimitSeconds);
    return row.id;
  };
  const row = (id: string) => t.db.selectFrom("analyses").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
  const finished = (id: string, ms: number) => waitFor(async () => ((r) => (["succeeded", "failed", "cancelled"].includes(r.status) ? r : undefined))(await row(id)), ms, `job ${id} to finish`);

  it("stores exactly the one-process result; a basis step 3 cannot prove is spread as its homogenisation, and the result records the runs", async () => {
    await start();
    await start({ jobs: false }); // a second machine lending its core to the images
    const params = analysisParams({ initial: { X: "1" } });
    const id = await job(params);
    const done = await finished(id, 90_000);
    expect([done.status, done.error]).toEqual(["succeeded", null]);
    const alone = computeJob({ kind: "analysis", csv: fixtureCsv("cubic-autocatalysis"), params }, { engineTimeoutMs: 60_000 });
    const { distributedBases, ...rest } = done.result as Record<string, unknown> & { distributedBases: Record<string, unknown>[] };
    expect(rest).toEqual(JSON.parse(JSON.stringify(alone)));
    const runs = await t.db.selectFrom("basis_runs").selectAll().where("analysis_id", "=", id).orderBy("created_at").execute();
    // Each basis: first ⟨F⟩ itself, whose step 3 (Hilbert functions) fails on the first image (a
    // saturation: its homogenisation is not saturated), then ⟨F^h⟩, proven, and h = 1.
    expect(runs.length).toBeGreaterThanOrEqual(2);
    expect(runs.length % 2).toBe(0);
    for (let i = 0; i < runs.length; i += 2) {
      expect([runs[i].status, runs[i].error]).toEqual(["failed", expect.stringMatching(/^proof step failed: hilbert/)]);
      expect(runs[i + 1].status).toBe("succeeded");
      const [f, fh] = [runs[i].input as unknown as { vars: string[] }, runs[i + 1].input as unknown as { vars: string[] }];
      expect(fh.vars.slice(0, -1)).toEqual(f.vars);
    }
    for (const r of runs) expect(r.engine_version).toBe(done.engine_version);
    // The result records every run: proven or not, the primes, the engine version, the workers.
    expect(distributedBases.map((b) => [b.runId, b.proven, b.homogenised ?? false])).toEqual(runs.map((r, i) => [r.id, i % 2 === 1, i % 2 === 1]));
    for (const [i, b] of distributedBases.entries()) {
      expect(b.engineVersion).toBe(done.engine_version);
      if (i % 2 === 1) expect(b.primes).toEqual(runs[i].primes_used);
      else expect(b.failed).toBe("hilbert");
    }
    const tasks = await t.db.selectFrom("basis_tasks").select(["status", "worker_id"]).where("run_id", "in", runs.map((r) => r.id)).execute();
    expect(tasks.filter((x) => x.status === "done").length).toBeGreaterThan(0);
    expect(new Set(tasks.map((x) => x.worker_id).filter((w) => w && !w.endsWith("(coordinator)"))).size).toBeGreaterThan(0);
    expect(tasks.filter((x) => x.status === "queued" || x.status === "running")).toEqual([]);
    // What the analysis page shows: images done, who took part (names only for lab members), what replaced a run that was not used.
    const view = await distributedRunsOf(t.db, id, { sharedView: false });
    expect(view.map((v) => v.imagesDone)).toEqual(runs.map((r) => r.images_done));
    expect(view.every((v) => v.imagesDone >= 1 && v.workerCount >= 1 && v.workers.length === v.workerCount)).toBe(true);
    expect(view.map((v) => v.insteadBy)).toEqual(runs.map((_, i) => (i % 2 === 0 ? "later run" : null)));
    const shared = await distributedRunsOf(t.db, id, { sharedView: true });
    expect(shared.every((v) => v.workers.length === 0 && v.workerCount >= 1)).toBe(true);
    for (const w of workers.splice(0)) await w.stop();
  }, 120_000);

  it("a worker killed while it holds a child job of an analysis: another worker recomputes it and the analysis stores the one-process result", async () => {
    // 3-site cycle with three-decimal constants: about 300 primes, so its runs have many child jobs.
    const measured = (await makeNetwork(t.db, team.lab.id, team.owner.id, "three-site", fixtureCsv("three-site-measured"))).versionId;
    await start({ images: false }); // takes the analysis; its images go to the worker below only
    const proc: ChildProcess = spawn("npx", ["tsx", "app/jobs/worker.server.ts"], {
      env: { ...process.env, DATABASE_URL: t.url, WORKER_QUEUES: "images", QUEUE_MAINTENANCE_SECONDS: "1" }, stdio: "ignore", detached: true,
    });
    const params = analysisParams({ initial: { S0: "5.3", E: "1.21", F: "0.97" } });
    const row0 = await makeJob(t.db, { kind: "analysis", labId: team.lab.id, networkVersionId: measured, params, startedBy: team.owner.id, timeLimitSeconds: 120 });
    await enqueue(t.url, row0.id, 120);
    let killed: { id: string; worker: string } | undefined;
    try {
      killed = await waitFor(async () => {
        const r = await t.db.selectFrom("basis_tasks").innerJoin("basis_runs", "basis_runs.id", "basis_tasks.run_id")
          .select(["basis_tasks.id", "basis_tasks.worker_id"]).where("basis_runs.analysis_id", "=", row0.id).where("basis_tasks.status", "=", "running").executeTakeFirst();
        return r ? { id: r.id, worker: r.worker_id! } : undefined;
      }, 60_000, "the separate worker to hold a child job");
    } finally {
      process.kill(-proc.pid!, "SIGKILL");
    }
    const survivor = await start({ jobs: false });
    const done = await finished(row0.id, 150_000);
    expect([done.status, done.error]).toEqual(["succeeded", null]);
    const alone = computeJob({ kind: "analysis", csv: fixtureCsv("three-site-measured"), params }, { engineTimeoutMs: 120_000 });
    const { distributedBases, ...rest } = done.result as Record<string, unknown> & { distributedBases: { proven: boolean; workers: string[] }[] };
    expect(rest).toEqual(JSON.parse(JSON.stringify(alone)));
    const task = await t.db.selectFrom("basis_tasks").selectAll().where("id", "=", killed!.id).executeTakeFirstOrThrow();
    // Either recomputed by the survivor once the queue expired the dead worker's job, or no longer needed.
    if (task.status === "done") {
      expect(task.worker_id).toBe(survivor.id);
      expect(task.attempts).toBeGreaterThanOrEqual(2);
    } else expect(task.status).toBe("cancelled");
    expect(killed!.worker).not.toBe(survivor.id);
    expect(distributedBases.some((b) => b.proven && b.workers.includes(survivor.id))).toBe(true);
    for (const w of workers.splice(0)) await w.stop();
  }, 240_000);

  it("cancelling a distributed analysis leaves no child job queued or running", async () => {
    // No worker takes images here, so the run surely waits on queued child jobs when it is cancelled.
    await start({ images: false });
    const id = await job(analysisParams({ initial: { X: "1" } }));
    const run = await waitFor(async () => t.db.selectFrom("basis_runs").selectAll().where("analysis_id", "=", id).where("status", "=", "running").executeTakeFirst(), 60_000, "a distributed run");
    await waitFor(async () => (await t.db.selectFrom("basis_tasks").select("id").where("run_id", "=", run.id).where("status", "=", "queued").execute()).length > 0, 20_000, "queued child jobs");
    expect(await requestCancel(t.db, id)).toBe("running");
    expect((await finished(id, 20_000)).status).toBe("cancelled");
    expect((await t.db.selectFrom("basis_runs").select("status").where("id", "=", run.id).executeTakeFirstOrThrow()).status).toBe("cancelled");
    const open = await t.db.selectFrom("basis_tasks").select(["id", "status"]).where("run_id", "=", run.id).where("status", "in", ["queued", "running"]).execute();
    expect(open).toEqual([]);
    const { rows } = await sql<{ n: number }>`SELECT count(*)::int AS n FROM pgboss.job WHERE name = ${IMAGE_QUEUE} AND data->>'runId' = ${run.id} AND state IN ('created', 'retry', 'active')`.execute(t.db);
    expect(rows[0].n).toBe(0);
    // And a worker that takes images now finds nothing to do for it.
    await start();
    await new Promise((r) => setTimeout(r, 1500));
    expect(await t.db.selectFrom("basis_tasks").select("id").where("run_id", "=", run.id).where("status", "=", "done").where("worker_id", "is not", null).where("kind", "=", "proof").execute()).toEqual([]);
  }, 120_000);
});
