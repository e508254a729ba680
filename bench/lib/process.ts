/**
 * Runs one whole process and times it from spawn to exit (wall clock, `process.hrtime`).
 * On timeout the whole process group is killed (our CLI under tsx is a parent with a child).
 */
import { spawn } from "node:child_process";

export interface ProcessRun {
  readonly seconds: number;
  readonly exitCode: number | null;
  readonly timedOut: boolean;
  readonly stdout: string;
  readonly stderr: string;
}

export function runProcess(command: string, args: readonly string[], timeoutSeconds: number, cwd: string): Promise<ProcessRun> {
  return new Promise((resolve, reject) => {
    const start = process.hrtime.bigint();
    const child = spawn(command, args, { cwd, detached: true, stdio: ["ignore", "pipe", "pipe"] });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on("data", (b: Buffer) => out.push(b));
    child.stderr.on("data", (b: Buffer) => err.push(b));
    let timedOut = false;
    const timer = setTimeout(() => {
      timedOut = true;
      try {
        if (child.pid !== undefined) process.kill(-child.pid, "SIGKILL");
      } catch {
        child.kill("SIGKILL");
      }
    }, timeoutSeconds * 1000);
    child.on("error", (e) => {
      clearTimeout(timer);
      reject(e);
    });
    child.on("close", (code) => {
      clearTimeout(timer);
      const seconds = Number(process.hrtime.bigint() - start) / 1e9;
      resolve({ seconds, exitCode: code, timedOut, stdout: Buffer.concat(out).toString("utf8"), stderr: Buffer.concat(err).toString("utf8") });
    });
  });
}
