import { execFile, spawn, type ChildProcess } from "node:child_process";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase } from "../support/test-db";
import type { TestDatabase } from "../support/test-db";
import { setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";
import { analysisParams, fixtureCsv, makeJob, makeNetwork, makeTeam, waitFor } from "./fixtures";
import { requestCancel } from "~/analyses/repository.server";
import { enqueue, stopBosses } from "~/jobs/queue.server";
import { startWorker, type RunningWorker } from "~/jobs/worker.server";

/**
 * The worker against a real database: results equal the CLI's, cancellation, the time limit (the
 * engine's own deadline and the hard kill of the job process), and recovery of a job whose worker
 * was killed mid-run (retried, or failed with the reason once attempts are used up).
 */
describe.skipIf(!hasTestDatabase)("background worker", () => {
  let t: TestDatabase;
  let team: Awaited<ReturnType<typeof makeTeam>>;
  let worker: RunningWorker | undefined;
  const nets = {} as Record<"cubic" | "slow", string>;

  beforeAll(async () => {
    t = await setUpAccountsDb();
    team = await makeTeam(t.db);
    nets.cubic = (await makeNetwork(t.db, team.lab.id, team.owner.id, "cubic", fixtureCsv("cubic-autocatalysis"))).versionId;
    // Slow by construction (3^10 positive steady states to list; see the fixture's header), so these
    // tests do not depend on how fast the engine is.
    nets.slow = (await makeNetwork(t.db, team.lab.id, team.owner.id, "ten switches", fixtureCsv("ten-switches"))).versionId;
  });
  afterAll(async () => {
    await worker?.stop();
    await stopBosses();
    await tearDownAccountsDb(t);
  });

  const job = async (versionId: string, params: object, timeLimitSeconds = 60) => {
    const row = await makeJob(t.db, { kind: "analysis", labId: team.lab.id, networkVersionId: versionId, params, startedBy: team.owner.id, timeLimitSeconds });
    await enqueue(t.url, row.id, timeLimitSeconds);
    return row.id;
  };
  const row = (id: string) => t.db.selectFrom("analyses").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
  const finished = (id: string, ms: number) => waitFor(async () => ((r) => (["succeeded", "failed", "cancelled"].includes(r.status) ? r : undefined))(await row(id)), ms, `job ${id} to finish`);

  it("runs an analysis in a child process and stores exactly the CLI's JSON", async () => {
    worker = await startWorker({ databaseUrl: t.url, heartbeatMs: 200, graceMs: 1000, sweepEveryMs: 500, staleAfterMs: 3000, pollSeconds: 0.5, log: () => {} });
    const id = await job(nets.cubic, analysisParams({ initial: { X: "1" } }));
    const done = await finished(id, 60_000);
    expect(done.error).toBeNull();
    expect(done.status).toBe("succeeded");
    expect(done.attempts).toBe(1);
    const { stdout } = await promisify(execFile)("npx", ["tsx", "domain/cli/main.ts", "analyse", "tests/fixtures/networks/cubic-autocatalysis.csv", "--initial", "X=1", "--json"]);
    const cli = JSON.parse(stdout);
    // The stored result is the CLI's analyse object plus the CLI's multistationarity object under one extra key.
    const { multistationarity: verdict, ...analysis } = done.result as Record<string, unknown>;
    expect(analysis).toEqual(cli);
    const ms = JSON.parse((await promisify(execFile)("npx", ["tsx", "domain/cli/main.ts", "multistationarity", "tests/fixtures/networks/cubic-autocatalysis.csv", "--json"])).stdout);
    expect(verdict).toEqual(ms);
    // The three positive steady states of -(X-1)(X-2)(X-3) (see the fixture's header comment).
    expect((done.result as { steadyStates: { concentrations: { X: number } }[] }).steadyStates.map((s) => s.concentrations.X)).toEqual([1, 2, 3]);
  }, 90_000);

  it("e-mails the starter who asked for it when the job ends", async () => {
    const { captureMail } = await import("~/mail/mailer.server");
    const mail = captureMail();
    try {
      const r = await makeJob(t.db, { kind: "analysis", labId: team.lab.id, networkVersionId: nets.cubic, params: analysisParams(), startedBy: team.owner.id, timeLimitSeconds: 30, notify: true });
      await enqueue(t.url, r.id, 30);
      expect((await finished(r.id, 30_000)).status).toBe("succeeded");
      await waitFor(async () => mail.outbox.length > 0, 5000, "the e-mail");
      expect(mail.outbox[0]!.to).toBe("owner@alpha.test");
      expect(mail.outbox[0]!.subject).toBe("Stillpoint: Analysis of cubic (version 1) has finished");
      expect(mail.outbox[0]!.text).toContain(`/labs/alpha/analyses/${r.id}`);
    } finally {
      mail.restore();
    }
  }, 40_000);

  it("cancels a running job: the child process is killed and the row says so", async () => {
    const id = await job(nets.slow, analysisParams(), 60);
    await waitFor(async () => (await row(id)).status === "running", 20_000, "running");
    // Cancel once the first stages are stored (they take well under a second; the listing cannot finish).
    await waitFor(async () => (await row(id)).partial_result !== null, 20_000, "a partial result");
    expect(await requestCancel(t.db, id)).toBe("running");
    const done = await finished(id, 10_000);
    expect(done.status).toBe("cancelled");
    expect(done.error).toMatch(/Cancelled after/);
    // What finished before the cancel is kept, marked with what was not: the structure and the
    // parametrisation stage are in; listing 3^10 steady states was never reached or finished.
    expect(done.result).toBeNull();
    const partial = done.partial_result as { species: string[]; unfinished: { stage: string; reason: string }[]; steadyStates: unknown } | null;
    expect(partial).not.toBeNull();
    expect(partial!.species).toHaveLength(10);
    expect(partial!.steadyStates).toBeNull();
    expect(partial!.unfinished.map((u) => u.stage)).toEqual(expect.arrayContaining(["steady-states", "multistationarity"]));
    expect(done.error).toMatch(/Parts finished before that are kept; not finished: .*steady-states/);
  }, 60_000);

  it("cancels a queued job at once", async () => {
    const r = await makeJob(t.db, { kind: "analysis", labId: team.lab.id, networkVersionId: nets.cubic, params: analysisParams(), startedBy: team.owner.id, timeLimitSeconds: 10 });
    expect(await requestCancel(t.db, r.id)).toBe("cancelled");
    expect((await row(r.id)).status).toBe("cancelled");
  });

  it("a computation that cannot finish is stopped by the engine's deadline with a clear message", async () => {
    // The engine's deadline at a fifth of the limit (2 s of 10 s), far from the hard kill (tested
    // next) even when the child process is slow to start on a busy machine, so the outcome is the
    // engine's own and only one: a stored result whose unfinished stages say what stopped.
    await worker!.stop();
    worker = await startWorker({ databaseUrl: t.url, heartbeatMs: 200, graceMs: 1000, engineDeadlineFactor: 0.2, sweepEveryMs: 500, staleAfterMs: 3000, pollSeconds: 0.5, log: () => {} });
    // Listing 3^10 steady states cannot finish in 2 s.
    const started = Date.now();
    const id = await job(nets.slow, analysisParams(), 10);
    const done = await finished(id, 30_000);
    expect(Date.now() - started).toBeLessThan(20_000);
    expect([done.status, done.error]).toEqual(["succeeded", null]);
    const result = done.result as { unfinished: { stage: string; reason: string }[]; warnings: string[] };
    expect(result.unfinished.length).toBeGreaterThan(0);
    expect(result.unfinished.every((u) => u.stage.length > 0 && u.reason.length > 0)).toBe(true);
  }, 40_000);

  it("kills the job process hard when the engine overruns the limit", async () => {
    await worker!.stop();
    // The engine is told 20× the limit, so only the worker's hard kill can stop it at 2 s (+0.5 s grace).
    worker = await startWorker({ databaseUrl: t.url, heartbeatMs: 200, graceMs: 500, engineDeadlineFactor: 20, sweepEveryMs: 500, staleAfterMs: 3000, pollSeconds: 0.5, log: () => {} });
    const id = await job(nets.slow, analysisParams(), 2);
    const done = await finished(id, 30_000);
    expect(done.status).toBe("failed");
    expect(done.error).toMatch(/^Stopped: the time limit of 2 s was exceeded during /);
    await worker.stop();
    worker = undefined;
  }, 40_000);

  it("a worker stopped cleanly hands its running job back without using up an attempt", async () => {
    worker = await startWorker({ databaseUrl: t.url, heartbeatMs: 200, graceMs: 1000, sweepEveryMs: 500, staleAfterMs: 3000, pollSeconds: 0.5, log: () => {} });
    const id = await job(nets.slow, analysisParams(), 10);
    await waitFor(async () => (await row(id)).status === "running", 20_000, "running");
    await worker.stop();
    worker = undefined;
    const back = await row(id);
    expect([back.status, back.attempts, back.worker_id]).toEqual(["queued", 0, null]);
    // The engine stops at a fifth of the limit, far from the hard kill (the child's start-up counts
    // against the limit too), so the outcome is the engine's own: a result with its unfinished stages.
    worker = await startWorker({ databaseUrl: t.url, heartbeatMs: 200, graceMs: 1000, engineDeadlineFactor: 0.2, sweepEveryMs: 500, staleAfterMs: 3000, pollSeconds: 0.5, log: () => {} });
    const done = await finished(id, 30_000);
    expect(done.attempts).toBe(1);
    // The engine's own deadline ends it first: a result whose unfinished stages say so.
    expect([done.status, done.error]).toEqual(["succeeded", null]);
    expect((done.result as { unfinished: unknown[] }).unfinished.length).toBeGreaterThan(0);
    await worker.stop();
    worker = undefined;
  }, 60_000);

  it("recovers jobs whose worker process was killed mid-run: retried, or failed with the reason", async () => {
    const retried = await job(nets.slow, analysisParams(), 10);
    const lastTry = await job(nets.slow, analysisParams(), 10);
    await t.db.updateTable("analyses").set({ max_attempts: 1 }).where("id", "=", lastTry).execute();
    // A separate worker process, killed with SIGKILL once both jobs run (no chance to clean up).
    const proc: ChildProcess = spawn("npx", ["tsx", "app/jobs/worker.server.ts"], {
      env: { ...process.env, DATABASE_URL: t.url, WORKER_CONCURRENCY: "2" },
      stdio: "ignore",
      detached: true,
    });
    try {
      await waitFor(async () => (await row(retried)).status === "running" && (await row(lastTry)).status === "running", 30_000, "both running");
      await new Promise((r) => setTimeout(r, 500));
    } finally {
      process.kill(-proc.pid!, "SIGKILL");
    }
    expect((await row(retried)).status).toBe("running");
    // The retry's engine stops at a fifth of the limit, so its outcome is the engine's own (see above).
    worker = await startWorker({ databaseUrl: t.url, heartbeatMs: 200, graceMs: 1000, engineDeadlineFactor: 0.2, sweepEveryMs: 500, staleAfterMs: 2500, pollSeconds: 0.5, log: () => {} });
    const failed = await finished(lastTry, 30_000);
    expect(failed.status).toBe("failed");
    expect(failed.error).toMatch(/stopped responding .* on each of its 1 attempts/);
    const again = await finished(retried, 40_000);
    expect(again.attempts).toBe(2);
    expect(again.status).toBe("succeeded");
    const stuck = await t.db.selectFrom("analyses").select("id").where("status", "=", "running").execute();
    expect(stuck).toEqual([]);
  }, 90_000);
});
