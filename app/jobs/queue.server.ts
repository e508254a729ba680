/**
 * The pg-boss queue that carries job ids from the web server to the workers. The analyses row is
 * the source of truth (status, attempts, heartbeat); a queue message only says "look at this
 * row", so a duplicate delivery is harmless (the claim in process-job.server.ts is atomic).
 */
import PgBoss from "pg-boss";
import { SITE_LIMITS } from "~/analyses/params";

export const QUEUE = "stillpoint-jobs";

export interface JobMessage {
  analysisId: string;
}

const bosses = new Map<string, Promise<PgBoss>>();

/** A started pg-boss client for `url` (one per process and database; creates its schema and the queue). */
export function getBoss(url: string, options: { supervise?: boolean } = {}): Promise<PgBoss> {
  let boss = bosses.get(url);
  if (!boss) {
    boss = (async () => {
      const b = new PgBoss({ connectionString: url, max: 4, supervise: options.supervise ?? false, schedule: false });
      b.on("error", (e) => console.error("[queue]", e.message));
      await b.start();
      await b.createQueue(QUEUE);
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

export async function stopBosses(): Promise<void> {
  const all = [...bosses.values()];
  bosses.clear();
  await Promise.all(all.map(async (b) => (await b.catch(() => undefined))?.stop({ graceful: false, wait: true, close: true })));
}
