/**
 * At most `limit` requests of one web process in progress at once; the rest wait in arrival order.
 * Without it, a process under overload starts every request it has read, and all of them advance
 * a step at a time in turns: each takes as long as all of them together (and holds its memory and
 * its database connection meanwhile), so under 200 users every page came late rather than most
 * coming soon. With a limit the process works through them first come, first served. Nothing is
 * refused: a waiting request is answered when its turn comes, or dropped unread if the client
 * gives up first.
 *
 *   const admit = admission(8);
 *   app.use((req, res, next) => admit(req, res, next));
 */
import type { NextFunction, Request, Response } from "express";

export interface Admission {
  (req: Request, res: Response, next: NextFunction): void;
  readonly inProgress: number;
  readonly waiting: number;
}

export function admission(limit: number): Admission {
  let inProgress = 0;
  const queue: { res: Response; next: NextFunction }[] = [];

  const start = (res: Response, next: NextFunction) => {
    inProgress++;
    let released = false;
    const release = () => {
      if (released) return;
      released = true;
      inProgress--;
      // The next one that is still wanted (its client may have closed the connection meanwhile).
      while (queue.length > 0 && inProgress < limit) {
        const waiting = queue.shift()!;
        if (!waiting.res.destroyed && !waiting.res.writableEnded && !waiting.res.socket?.destroyed) start(waiting.res, waiting.next);
      }
    };
    res.once("finish", release);
    res.once("close", release);
    next();
  };

  const admit = ((_req: Request, res: Response, next: NextFunction) => {
    if (inProgress < limit) start(res, next);
    else queue.push({ res, next });
  }) as Admission;
  Object.defineProperty(admit, "inProgress", { get: () => inProgress });
  Object.defineProperty(admit, "waiting", { get: () => queue.length });
  return admit;
}

/**
 *   requestsInProgress(undefined)  // 8
 *   requestsInProgress("0")        // 0: no limit
 */
export function requestsInProgress(raw: string | undefined): number {
  const value = raw?.trim() ?? "";
  if (value === "") return 8;
  if (!/^\d+$/.test(value) || Number(value) > 10_000) throw new Error(`REQUESTS_IN_PROGRESS must be a whole number (0 for no limit), not "${raw}"`);
  return Number(value);
}
