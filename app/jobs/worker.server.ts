/**
 * The background worker: `npm run worker` (npm start starts one). It takes job ids from the
 * pg-boss queue, runs each job in a child process (process-job.server.ts), and sweeps jobs whose
 * worker died. Any number of workers, on any machines, may share one database: claims and sweeps
 * are single atomic UPDATEs. Run more with `DATABASE_URL=… npm run worker` in another shell.
 */
import { hostname } from "node:os";
import { randomBytes } from "node:crypto";
import { pathToFileURL } from "node:url";
import { createDb } from "~/db.server";
import { getEnv } from "~/env.server";
import { computePendingStructures } from "~/networks/structure-store.server";
import { cancelOrphanedRuns, processTask } from "./basis-tasks.server";
import { enqueue, getBoss, IMAGE_QUEUE, QUEUE, stopBosses, type JobMessage, type TaskMessage } from "./queue.server";
import { TaskRunner } from "./task-runner.server";
import { processJob, stopAllChildren, type ProcessOptions } from "./process-job.server";
import { orphanedQueuedJobs, releaseRunningJobs, sweepStaleJobs } from "./sweeper.server";

export interface WorkerOptions extends Partial<Omit<ProcessOptions, "workerId" | "databaseUrl" | "distributeAfterMs">> {
  /** See ProcessOptions.distributeAfterMs; null = never distribute. Default DISTRIBUTE_AFTER_MS or 3000. */
  distributeAfterMs?: number | null;
  databaseUrl: string;
  /** Jobs run at once by this worker (each in its own process; default 1, as the machine has 2 cores). */
  concurrency?: number;
  sweepEveryMs?: number;
  staleAfterMs?: number;
  pollSeconds?: number;
  log?: (line: string) => void;
  /** How often to look for network structures to compute (default 250 ms). */
  structuresEveryMs?: number;
  logStructures?: boolean;
  /** Take child jobs of distributed bases from the image queue (default true). */
  images?: boolean;
  /** Take jobs from the job queue (default true); false = an image-only worker. */
  jobs?: boolean;
  /** Called when this worker's task process starts a basis task (tests kill the worker then). */
  onTaskStarted?: (taskId: string) => void;
  logTasks?: boolean;
}

function distributeAfter(given: number | null | undefined): number | undefined {
  if (given === null) return undefined;
  if (given !== undefined) return given;
  const env = process.env.DISTRIBUTE_AFTER_MS;
  if (env === "off") return undefined;
  return env !== undefined && env !== "" ? Number(env) : 3000;
}

export interface RunningWorker {
  id: string;
  stop(): Promise<void>;
}

export async function startWorker(options: WorkerOptions): Promise<RunningWorker> {
  const id = `${hostname()}:${process.pid}:${randomBytes(3).toString("hex")}`;
  const log = options.log ?? ((line: string) => console.log(`[worker ${id}] ${line}`));
  const db = createDb(options.databaseUrl, { max: getEnv().dbPool.workerMax, waitMs: getEnv().dbPool.waitMs });
  const boss = await getBoss(options.databaseUrl, { supervise: true });
  const processOptions: ProcessOptions = {
    workerId: id,
    heartbeatMs: options.heartbeatMs ?? 1000,
    graceMs: options.graceMs ?? 5000,
    engineDeadlineFactor: options.engineDeadlineFactor ?? 1,
    onChildStarted: options.onChildStarted,
    databaseUrl: options.databaseUrl,
    // A few seconds by default (DISTRIBUTE_AFTER_MS; "off" = never): shorter bases cost less alone than their coordination.
    ...(distributeAfter(options.distributeAfterMs) !== undefined ? { distributeAfterMs: distributeAfter(options.distributeAfterMs) } : {}),
  };
  const staleAfterMs = options.staleAfterMs ?? 30_000;

  const workIds: string[] = [];
  for (let i = 0; i < (options.jobs === false ? 0 : (options.concurrency ?? 1)); i++) {
    workIds.push(
      await boss.work<JobMessage>(QUEUE, { batchSize: 1, pollingIntervalSeconds: options.pollSeconds ?? 1 }, async ([job]) => {
        if (!job) return;
        const status = await processJob(db, job.data.analysisId, processOptions);
        if (status) log(`${job.data.analysisId}: ${status}`);
      }),
    );
  }

  // Child jobs of distributed bases (coordinator.server.ts): one at a time, in this worker's task process.
  const TASK_LINGER_MS = 1000;
  const runner = new TaskRunner();
  let stopping = false;
  if (options.images !== false) {
    workIds.push(
      await boss.work<TaskMessage>(IMAGE_QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async ([job]) => {
        if (!job) return;
        const task = (data: TaskMessage) => processTask(db, data, { workerId: id, runner, heartbeatMs: processOptions.heartbeatMs, onTaskStarted: options.onTaskStarted });
        const what = await task(job.data);
        if (options.logTasks) log(what);
        // pg-boss's loop waits out its polling interval even after a job (0.5 s at least), far
        // longer than a small image takes: keep fetching (claim with expiry, complete or fail,
        // as the loop would) while tasks are waiting.
        // When the queue is empty, linger a moment: a coordinator enqueues the proof batches a few
        // tens of ms after the last image arrives, and waiting out the polling interval then left
        // one of two workers idle for 0.4–0.5 s (katsura-8's proof is ~3 s on two workers).
        let idleSince = 0;
        while (!stopping) {
          const [next] = (await boss.fetch<TaskMessage>(IMAGE_QUEUE, { batchSize: 1 })) ?? [];
          if (!next) {
            idleSince ||= Date.now();
            if (Date.now() - idleSince > TASK_LINGER_MS) break;
            await new Promise((r) => setTimeout(r, 20));
            continue;
          }
          idleSince = 0;
          try {
            const more = await task(next.data);
            await boss.complete(IMAGE_QUEUE, next.id);
            if (options.logTasks) log(more);
          } catch (e) {
            await boss.fail(IMAGE_QUEUE, next.id, { message: (e as Error).message });
          }
        }
      }),
    );
  }

  const sweep = async () => {
    try {
      const { requeued, failed } = await sweepStaleJobs(db, staleAfterMs);
      for (const r of requeued) {
        log(`${r.id}: its worker stopped responding; queued again`);
        await enqueue(options.databaseUrl, r.id, r.timeLimitSeconds);
      }
      for (const f of failed) log(`${f}: its worker stopped responding; settled (no attempts left, or cancelled)`);
      for (const r of await orphanedQueuedJobs(db, 5 * 60_000)) await enqueue(options.databaseUrl, r.id, r.timeLimitSeconds);
      await cancelOrphanedRuns(db, options.databaseUrl);
    } catch (e) {
      log(`sweep failed: ${(e as Error).message}`);
    }
  };
  const sweeper = setInterval(() => void sweep(), options.sweepEveryMs ?? 10_000);

  // Network structures (app/networks/structure-store.server.ts): the web server only records
  // requests; this computes them, one at a time, polling a few times a second.
  let structuresBusy = false;
  const computeStructures = async () => {
    if (structuresBusy) return;
    structuresBusy = true;
    try {
      const n = await computePendingStructures(db, 50);
      if (n > 0 && options.logStructures) log(`computed ${n} network structure${n === 1 ? "" : "s"}`);
    } catch (e) {
      log(`structures failed: ${(e as Error).message}`);
    } finally {
      structuresBusy = false;
    }
  };
  const structures = setInterval(() => void computeStructures(), options.structuresEveryMs ?? 250);
  void sweep();
  log("ready");

  return {
    id,
    async stop() {
      stopping = true;
      clearInterval(sweeper);
      clearInterval(structures);
      while (structuresBusy) await new Promise((r) => setTimeout(r, 20));
      for (const w of workIds) await boss.offWork({ id: w }).catch(() => undefined);
      // Hand running jobs back before killing their processes, so no final write can land.
      const released = await releaseRunningJobs(db, id).catch(() => []);
      stopAllChildren("the worker is stopping");
      runner.kill();
      for (const r of released) {
        log(`${r.id}: handed back to the queue`);
        await enqueue(options.databaseUrl, r.id, r.timeLimitSeconds).catch(() => undefined);
      }
      await stopBosses();
      await db.destroy();
    },
  };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  // WORKER_QUEUES: "jobs,images" (default), "images" for a machine that only lends its cores to distributed bases.
  const queues = (process.env.WORKER_QUEUES ?? "jobs,images").split(",").map((q) => q.trim());
  const worker = await startWorker({
    databaseUrl: getEnv().databaseUrl, concurrency: Number(process.env.WORKER_CONCURRENCY ?? 1),
    jobs: queues.includes("jobs"), images: queues.includes("images"), logTasks: process.env.WORKER_LOG_TASKS === "1",
  });
  const shutdown = async () => {
    await worker.stop().catch(() => undefined);
    process.exit(0);
  };
  process.on("SIGINT", () => void shutdown());
  process.on("SIGTERM", () => void shutdown());
}
