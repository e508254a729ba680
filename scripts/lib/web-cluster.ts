/**
 * Several web processes on one port (node:cluster): one event loop renders one page at a time,
 * so on a machine with more than one core a single process leaves cores idle while requests
 * queue. The primary process only forks, watches and restarts; each worker runs the whole app
 * (its own database pool of DB_POOL_MAX connections). The primary hands out incoming
 * connections round-robin.
 *
 * A worker that dies (a crash, the kernel's out-of-memory killer) is replaced, after a pause that
 * doubles while replacements keep dying within seconds (1 s, 2 s, 4 s … at most 30 s), so a
 * broken build does not spin. SIGTERM or SIGINT to the primary stops every worker and then itself.
 */
import cluster, { type Worker } from "node:cluster";
import { availableParallelism } from "node:os";

/**
 * WEB_PROCESSES, or the default: one per core, at most 4 (beyond that the database, not the
 * event loop, is what requests wait for, and every process holds its own pool).
 *
 *   webProcesses(undefined, 2)  // 2
 *   webProcesses("1", 8)        // 1: a single process, no cluster
 *   webProcesses("two", 2)      // throws: not a count
 */
export function webProcesses(raw: string | undefined, cores = availableParallelism()): number {
  const value = raw?.trim() ?? "";
  if (value === "") return Math.max(1, Math.min(cores, 4));
  if (!/^\d+$/.test(value) || Number(value) < 1 || Number(value) > 64) {
    throw new Error(`WEB_PROCESSES must be a whole number from 1 to 64 (processes serving the app), not "${raw}"`);
  }
  return Number(value);
}

export interface ClusterOptions {
  processes: number;
  log?: (line: string) => void;
  /** Pause before the first replacement of a dead worker (doubles on quick deaths). */
  restartDelayMs?: number;
}

const QUICK_DEATH_MS = 5_000;
const MAX_RESTART_DELAY_MS = 30_000;

/**
 * In the primary: forks `processes` workers running this same script and keeps that many alive
 * until SIGTERM/SIGINT. Returns a promise that settles when everything has stopped. Workers run
 * the same entry, see `cluster.isPrimary === false`, and serve.
 */
export function superviseWorkers(options: ClusterOptions): Promise<void> {
  const log = options.log ?? ((line: string) => console.log(`[serve] ${line}`));
  const baseDelay = options.restartDelayMs ?? 1_000;
  let stopping = false;
  let delay = baseDelay;
  const started = new Map<Worker, number>();

  const fork = () => {
    const worker = cluster.fork();
    started.set(worker, Date.now());
  };

  return new Promise<void>((resolve) => {
    cluster.on("exit", (worker, code, signal) => {
      const lived = Date.now() - (started.get(worker) ?? Date.now());
      started.delete(worker);
      if (stopping) {
        if (started.size === 0) resolve();
        return;
      }
      // A process that had been serving for a while starts the count again.
      if (lived >= QUICK_DEATH_MS) delay = baseDelay;
      const wait = delay;
      delay = Math.min(delay * 2, MAX_RESTART_DELAY_MS);
      log(`web process ${worker.process.pid} ended (${signal ?? `exit code ${code}`}) after ${Math.round(lived / 1000)} s; starting a new one in ${wait / 1000} s`);
      setTimeout(() => {
        if (!stopping) fork();
      }, wait);
    });
    const stop = () => {
      if (stopping) return;
      stopping = true;
      if (started.size === 0) return resolve();
      for (const worker of started.keys()) worker.process.kill("SIGTERM");
    };
    process.once("SIGTERM", stop);
    process.once("SIGINT", stop);
    for (let i = 0; i < options.processes; i++) fork();
  });
}

export const isClusterWorker = () => !cluster.isPrimary;
