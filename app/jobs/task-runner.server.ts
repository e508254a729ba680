/**
 * One task process per worker (app/jobs/task-child.ts), forked on first use, one task at a time.
 * `kill()` stops it hard (SIGKILL, works inside an F4 matrix); the next task forks a new one.
 * A reaper kills it with its worker (reaper.server.ts), as for job processes.
 */
import { fork, type ChildProcess } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { TaskReply, TaskRequest } from "./task-child";
import { reapWithParent } from "./reaper.server";
import { yieldToRequests } from "./run-child.server";

const CHILD = path.join(path.dirname(fileURLToPath(import.meta.url)), "task-child.ts");

export class TaskRunner {
  private child: ChildProcess | null = null;
  private pending: { resolve: (r: TaskReply) => void } | null = null;
  /** Runs whose stored trace (if any) this task process has been sent: it keeps it, so once is enough. */
  private traceSent = new Set<string>();
  /** Candidates (run:checkedWith) this task process has been sent in full or as integer form. */
  private candidatesSent = new Set<string>();

  private spawn(): ChildProcess {
    this.traceSent = new Set();
    this.candidatesSent = new Set();
    const child = fork(CHILD, [], {
      execArgv: ["--import", "tsx"],
      stdio: ["ignore", "ignore", "inherit", "ipc"],
      serialization: "advanced", // images travel as bytes
      env: { ...process.env, NODE_OPTIONS: "--max-old-space-size=1536" },
    });
    if (child.pid !== undefined) {
      reapWithParent(child.pid);
      // Algebra, like a job process: page views on the same cores come first.
      yieldToRequests(child.pid);
    }
    child.on("message", (m: TaskReply) => {
      const p = this.pending;
      this.pending = null;
      p?.resolve(m);
    });
    child.on("exit", (code, signal) => {
      if (this.child === child) this.child = null;
      const p = this.pending;
      this.pending = null;
      p?.resolve({ kind: "error", message: `the task process ended (${signal ? `signal ${signal}` : `exit code ${code}`})` });
    });
    return child;
  }

  /** The task process' id, once forked (for the tests). */
  get pid(): number | undefined {
    return this.child?.pid;
  }

  /** Whether the next image task of `runId` must carry the run's stored trace (this process has not had it). */
  needsTrace(runId: string): boolean {
    return !(this.child && this.traceSent.has(runId));
  }

  /** Whether a proof batch of candidate `key` must carry the candidate (this process has not had it). */
  needsCandidate(key: string): boolean {
    return !(this.child && this.candidatesSent.has(key));
  }

  /** Notes that the next request carries candidate `key` (the process keeps it; it may drop old ones and say so). */
  candidateSent(key: string): void {
    this.child ??= this.spawn();
    this.candidatesSent.add(key);
    while (this.candidatesSent.size > 6) this.candidatesSent.delete(this.candidatesSent.values().next().value!);
  }

  run(req: TaskRequest): Promise<TaskReply> {
    if (this.pending) return Promise.reject(new Error("TaskRunner: one task at a time"));
    this.child ??= this.spawn();
    if (req.kind === "image" && "trace" in req) {
      this.traceSent.add(req.runId);
      while (this.traceSent.size > 6) this.traceSent.delete(this.traceSent.values().next().value!);
    }
    const child = this.child;
    return new Promise<TaskReply>((resolve) => {
      this.pending = { resolve };
      child.send(req);
    });
  }

  kill(): void {
    this.child?.kill("SIGKILL");
    this.child = null;
  }
}
