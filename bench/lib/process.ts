/**
 * Runs one whole process and times it from spawn to exit (wall clock, `process.hrtime`).
 * When GNU time is installed (/usr/bin/time, Debian package `time`) the process runs under it,
 * which adds its CPU time (user + system, including children) and peak memory; CPU time is
 * less disturbed than wall time when other jobs share the machine.
 * On timeout the whole process group is killed (our CLI under tsx is a parent with a child).
 *
 * Every program runs without NODE_EXTRA_CA_CERTS (the rest of the environment is inherited): when
 * it is set, Node reads and parses that certificate file before running any code — about 60 ms
 * of CPU per start measured here with a 220 KB bundle, more than our whole CLI start-up — and no
 * program timed here makes a TLS connection. The other programs ignore the variable.
 */
import { spawn } from "node:child_process";
import { existsSync, readFileSync, rmSync } from "node:fs";

export interface ProcessRun {
  readonly seconds: number;
  /** User + system CPU seconds of the process and its children, when GNU time is available. */
  readonly cpuSeconds?: number;
  /** Peak resident memory in kilobytes (largest single process), when GNU time is available. */
  readonly maxRssKb?: number;
  readonly exitCode: number | null;
  readonly timedOut: boolean;
  readonly stdout: string;
  readonly stderr: string;
}

const GNU_TIME = "/usr/bin/time";

/** The environment of every timed program (see the module comment). */
export function benchEnvironment(env: NodeJS.ProcessEnv = process.env): NodeJS.ProcessEnv {
  const { NODE_EXTRA_CA_CERTS: _certs, ...rest } = env;
  return rest;
}
const TIME_FORMAT = "%U %S %M";

/**
 * Reads the last line of a GNU time report in TIME_FORMAT ("user system maxrss").
 * Example: parseTimeReport("Command exited with non-zero status 2\n1.50 0.25 90000\n") is
 * { cpuSeconds: 1.75, maxRssKb: 90000 }.
 */
export function parseTimeReport(text: string): { cpuSeconds: number; maxRssKb: number } | undefined {
  const last = text.trim().split("\n").pop() ?? "";
  const m = /^(\d+(?:\.\d+)?) (\d+(?:\.\d+)?) (\d+)$/.exec(last.trim());
  if (!m) return undefined;
  return { cpuSeconds: Number(m[1]) + Number(m[2]), maxRssKb: Number(m[3]) };
}

export function runProcess(
  command: string,
  args: readonly string[],
  timeoutSeconds: number,
  cwd: string,
  timeReportPath?: string,
): Promise<ProcessRun> {
  const wrap = timeReportPath !== undefined && existsSync(GNU_TIME);
  if (wrap) rmSync(timeReportPath, { force: true });
  const [cmd, argv] = wrap ? [GNU_TIME, ["-f", TIME_FORMAT, "-o", timeReportPath, command, ...args]] : [command, [...args]];
  return new Promise((resolve, reject) => {
    const start = process.hrtime.bigint();
    const child = spawn(cmd, argv, { cwd, env: benchEnvironment(), detached: true, stdio: ["ignore", "pipe", "pipe"] });
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
      const report = wrap && !timedOut && existsSync(timeReportPath) ? parseTimeReport(readFileSync(timeReportPath, "utf8")) : undefined;
      resolve({
        seconds,
        ...report,
        exitCode: code,
        timedOut,
        stdout: Buffer.concat(out).toString("utf8"),
        stderr: Buffer.concat(err).toString("utf8"),
      });
    });
  });
}
