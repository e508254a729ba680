/**
 * A job's process must die with its worker. The child computes synchronously (a Gröbner step can
 * run for minutes without returning to its event loop), so it cannot notice by itself that its
 * worker was killed, and Node has no "parent death signal". So each child gets a reaper: a tiny
 * detached shell loop, outside both processes, that polls both ids twice a second and SIGKILLs
 * the child as soon as the worker is gone. It ends by itself when the child ends, and never
 * signals anything while the worker lives (so a reused id is never touched).
 *
 *   const child = fork(...);
 *   reapWithParent(child.pid!);   // kill -9 the child when this process dies
 */
import { spawn } from "node:child_process";

export function reapWithParent(childPid: number, parentPid: number = process.pid): void {
  const script = [
    `while kill -0 ${parentPid} 2>/dev/null && kill -0 ${childPid} 2>/dev/null; do sleep 0.5; done`,
    `if ! kill -0 ${parentPid} 2>/dev/null; then kill -9 ${childPid} 2>/dev/null; fi`,
  ].join("; ");
  const reaper = spawn("/bin/sh", ["-c", script], { detached: true, stdio: "ignore" });
  reaper.on("error", (e) => console.error(`[jobs] could not start the reaper of process ${childPid}: ${e.message}`));
  reaper.unref();
}
