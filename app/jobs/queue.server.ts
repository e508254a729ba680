/**
 * The pg-boss queue that carries job ids from the web server to the workers. The analyses row is
 * the source of truth (status, attempts, heartbeat); a queue message only says "look at this
 * row", so a duplicate delivery is harmless (the claim in process-job.server.ts is atomic).
 */
import PgBoss from "pg-boss";
import { SITE_LIMITS } from "~/analyses/params";

export const QUEUE = "stillpoint-jobs";
/** Child jobs of a distributed basis (app/jobs/coordinator.ts): one modular image or one proof batch each. */
export const IMAGE_QUEUE = "stillpoint-images";
/** Where an image job lands after its last retry (pg-boss dead letter); its coordinator computes it itself. */
export const IMAGE_DEAD_QUEUE = "stillpoint-images-dead";

export interface JobMessage {
  analysisId: string;
}

const bosses = new Map<string, Promise<PgBoss>>();

/** A started pg-boss client for `url` (one per process and database; creates its schema and the queue). */
export function getBoss(url: string, options: { supervise?: boolean } = {}): Promise<PgBoss> {
  let boss = bosses.get(url);
  if (!boss) {
    boss = (async () => {
      // Maintenance (which also expires the active jobs of a worker that died, so they are retried)
      // every 10 s rather than pg-boss's 2 minutes: a lost image should be recomputed promptly.
      const b = new PgBoss({
        connectionString: url, max: 4, supervise: options.supervise ?? false, schedule: false,
        maintenanceIntervalSeconds: Number(process.env.QUEUE_MAINTENANCE_SECONDS ?? 10),
      });
      b.on("error", (e) => console.error("[queue]", e.message));
      await b.start();
      await b.createQueue(QUEUE);
      await b.createQueue(IMAGE_DEAD_QUEUE);
      await b.createQueue(IMAGE_QUEUE, { name: IMAGE_QUEUE, deadLetter: IMAGE_DEAD_QUEUE });
      return b;
    })();
    bosses.set(url, boss);
    boss.catch(() => bosses.delete(url));
  }
  return boss;
}

/**
 * Puts a job id on the queue. The message expires a minute after the longest time limit any job
 * may have: the worker that takes it may run another (fairer) job than the one it names.
 */
export async function enqueue(url: string, analysisId: string, timeLimitSeconds: number): Promise<void> {
  const boss = await getBoss(url);
  const longest = Math.max(timeLimitSeconds, SITE_LIMITS.maxTimeLimitSeconds);
  await boss.send(QUEUE, { analysisId } satisfies JobMessage, { expireInSeconds: longest + 60, retryLimit: 1, retryDelay: 5 });
}

export interface TaskMessage {
  taskId: string;
  runId: string;
}

/**
 * Puts a basis task on the image queue. pg-boss does the scheduling: `priority` (the lift needs
 * images in prime order, and a proof batch is waited on), `retryLimit` (a handler that throws),
 * `expireInSeconds` (an active job whose worker died is failed by maintenance and retried by
 * another worker), and the dead letter queue once retries are used up.
 */
export async function enqueueTask(url: string, message: TaskMessage, o: { priority: number; expireInSeconds: number }): Promise<string | null> {
  const boss = await getBoss(url);
  return boss.send(IMAGE_QUEUE, message satisfies TaskMessage, {
    priority: o.priority, expireInSeconds: Math.max(1, Math.ceil(o.expireInSeconds)), retryLimit: 2, retryDelay: 0, deadLetter: IMAGE_DEAD_QUEUE,
  });
}

export async function stopBosses(): Promise<void> {
  const all = [...bosses.values()];
  bosses.clear();
  await Promise.all(all.map(async (b) => (await b.catch(() => undefined))?.stop({ graceful: false, wait: true, close: true })));
}
