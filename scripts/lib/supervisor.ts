/**
 * Keeps a child process running: when it exits on its own it is started again (after a short,
 * growing pause), so under `npm start` a crashed worker or app server comes back instead of
 * taking the database and everything else down. Only a child that keeps crashing (more than
 * `maxRestarts` times within `windowMs`) is given up on; then `exited` resolves and the caller
 * decides. `stop()` (Ctrl-C) stops the current process and ends the supervision.
 *
 *   const worker = supervise("worker", () => startWorkerProcess(env));
 *   await worker.stop();
 */
import { log } from "./log";
import { type Managed, sleep } from "./processes";

export interface SupervisorOptions {
  maxRestarts?: number;
  windowMs?: number;
  /** First pause before a restart; doubles with every crash inside the window. */
  backoffMs?: number;
  /** Called after every restart (for tests and logs). */
  onRestart?: (attempt: number, code: number | null) => void;
}

export interface Supervised extends Managed {
  /** How many times the child was restarted so far. */
  restarts(): number;
}

export async function supervise(name: string, start: () => Promise<Managed> | Managed, options: SupervisorOptions = {}): Promise<Supervised> {
  const maxRestarts = options.maxRestarts ?? 5;
  const windowMs = options.windowMs ?? 60_000;
  const backoffMs = options.backoffMs ?? 1_000;
  let current = await start();
  let stopped = false;
  let restarts = 0;
  const crashes: number[] = [];
  let giveUp!: (code: number | null) => void;
  const exited = new Promise<number | null>((resolve) => (giveUp = resolve));

  void (async () => {
    for (;;) {
      const code = await current.exited;
      if (stopped) return giveUp(code);
      const now = Date.now();
      crashes.push(now);
      while (crashes.length > 0 && crashes[0]! < now - windowMs) crashes.shift();
      if (crashes.length > maxRestarts) {
        log(name, `exited (code ${code}) ${crashes.length} times within ${Math.round(windowMs / 1000)} s; giving up`);
        return giveUp(code);
      }
      const pause = backoffMs * 2 ** (crashes.length - 1);
      log(name, `exited (code ${code}); restarting in ${(pause / 1000).toFixed(1)} s`);
      await sleep(pause);
      if (stopped) return giveUp(code);
      try {
        current = await start();
      } catch (err) {
        log(name, `could not restart: ${err instanceof Error ? err.message : err}`);
        return giveUp(code);
      }
      restarts++;
      options.onRestart?.(restarts, code);
    }
  })();

  return {
    name,
    get child() {
      return current.child;
    },
    exited,
    restarts: () => restarts,
    async stop() {
      stopped = true;
      await current.stop();
    },
  };
}
