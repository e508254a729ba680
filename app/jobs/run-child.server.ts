/**
 * Runs one job in a forked child process (app/jobs/child.ts, TypeScript through tsx's loader) and
 * turns whatever happens into one outcome. `stop(reason)` kills the child with SIGKILL: it works
 * even while the child is deep inside a Gröbner basis computation that never yields.
 */
import { fork } from "node:child_process";
import { getPriority, setPriority } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { ChildMessage, ChildStart } from "./child";
import type { JobPayload } from "./compute";
import { reapWithParent } from "./reaper.server";

export type ChildOutcome =
  | { kind: "result"; result: Record<string, unknown> }
  | { kind: "error"; message: string; code?: string }
  | { kind: "stopped"; reason: string }
  | { kind: "crashed"; message: string };

export interface ChildRun {
  outcome: Promise<ChildOutcome>;
  stop(reason: string): void;
  pid: number | undefined;
}

const CHILD = path.join(path.dirname(fileURLToPath(import.meta.url)), "child.ts");

/**
 * How much lower than the worker a job process runs (Unix niceness, 0–19 above the worker's): on
 * a machine where the web server and the worker share cores, a page view then gets the CPU before
 * a Gröbner basis does, and the basis still gets every cycle nobody else wants (bench/load.ts).
 */
export const JOB_NICENESS = 10;

/** Lowers a process that does algebra (a job process, a task process) by JOB_NICENESS. */
export function yieldToRequests(pid: number) {
  try {
    setPriority(pid, Math.min(19, getPriority() + JOB_NICENESS));
  } catch {
    // Not permitted here (some containers): the job runs at the worker's priority.
  }
}

export function runInChild(payload: JobPayload, options: { engineTimeoutMs: number; distribution?: ChildStart["distribution"]; onProgress?: (p: { phase: string; message: string }) => void; onPartial?: (result: Record<string, unknown>) => void }): ChildRun {
  const child = fork(CHILD, [], {
    execArgv: ["--import", "tsx"],
    stdio: ["ignore", "ignore", "pipe", "ipc"],
    // Bounded memory: a blown-up basis fails this child, not the machine (common practice).
    env: { ...process.env, NODE_OPTIONS: "--max-old-space-size=1536" },
  });
  // If this worker is killed, the child goes too (a retry must not race a forgotten attempt).
  if (child.pid !== undefined) reapWithParent(child.pid);
  if (child.pid !== undefined) yieldToRequests(child.pid);
  let settled: ChildOutcome | undefined;
  let stopReason: string | undefined;
  let stderr = "";
  child.stderr?.on("data", (d: Buffer) => {
    stderr = (stderr + d.toString()).slice(-4000);
  });
  const outcome = new Promise<ChildOutcome>((resolve) => {
    child.on("message", (m: ChildMessage) => {
      if (m.type === "progress") options.onProgress?.({ phase: m.phase, message: m.message });
      else if (m.type === "partial") options.onPartial?.(m.result);
      else if (m.type === "result") settled ??= { kind: "result", result: m.result };
      else if (m.type === "error") settled ??= { kind: "error", message: m.message, code: m.code };
    });
    child.on("error", (e) => {
      settled ??= { kind: "crashed", message: `could not run the job process: ${e.message}` };
    });
    child.on("exit", (code, signal) => {
      if (stopReason !== undefined) resolve({ kind: "stopped", reason: stopReason });
      else if (settled) resolve(settled);
      else {
        const tail = stderr.trim().split("\n").slice(-3).join(" ");
        const oom = /heap out of memory/i.test(stderr);
        resolve({
          kind: "crashed",
          message: oom
            ? "The computation ran out of memory (1.5 GB per job); try a smaller size budget or another elimination order."
            : `The job process ended unexpectedly (${signal ? `signal ${signal}` : `exit code ${code}`})${tail ? `: ${tail}` : ""}.`,
        });
      }
    });
  });
  child.send({ payload, engineTimeoutMs: options.engineTimeoutMs, ...(options.distribution ? { distribution: options.distribution } : {}) } satisfies ChildStart);
  return {
    outcome,
    pid: child.pid,
    stop(reason) {
      if (stopReason !== undefined || child.exitCode !== null) return;
      stopReason = reason;
      child.kill("SIGKILL");
    },
  };
}
