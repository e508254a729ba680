/**
 * Child processes that a script starts and must stop again: each runs in its own process
 * group (so Ctrl-C reaches only us, and we stop children in order), and is stopped by its
 * own id — SIGTERM to its group, SIGKILL if it lingers.
 */
import { type ChildProcess, spawn } from "node:child_process";
import { log } from "./log";

export interface Managed {
  name: string;
  child: ChildProcess;
  exited: Promise<number | null>;
  stop(): Promise<void>;
}

export function startProcess(
  name: string,
  command: string,
  args: string[],
  options: { env?: NodeJS.ProcessEnv; quiet?: boolean; cwd?: string } = {},
): Managed {
  const child = spawn(command, args, {
    cwd: options.cwd,
    env: options.env ?? process.env,
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
  });
  const prefix = (chunk: Buffer) =>
    chunk
      .toString()
      .split("\n")
      .filter((line) => line.trim() !== "")
      .map((line) => `[${name}] ${line}\n`)
      .join("");
  if (!options.quiet) {
    child.stdout?.on("data", (c: Buffer) => process.stdout.write(prefix(c)));
    child.stderr?.on("data", (c: Buffer) => process.stderr.write(prefix(c)));
  } else {
    // Keep the last lines so a failure can still be explained.
    const tail: string[] = [];
    const keep = (c: Buffer) => {
      tail.push(...prefix(c).split("\n").filter(Boolean));
      tail.splice(0, Math.max(0, tail.length - 40));
    };
    child.stdout?.on("data", keep);
    child.stderr?.on("data", keep);
    (child as ChildProcess & { tail?: string[] }).tail = tail;
  }
  const exited = new Promise<number | null>((resolve) => {
    child.once("exit", (code, signal) => resolve(code ?? (signal ? 128 : null)));
    child.once("error", (err) => {
      log(name, `could not start: ${err.message}`);
      resolve(127);
    });
  });
  let stopping: Promise<void> | undefined;
  return {
    name,
    child,
    exited,
    stop() {
      stopping ??= (async () => {
        if (child.exitCode !== null || child.signalCode !== null || child.pid === undefined) return;
        signalGroup(child.pid, "SIGTERM");
        const done = await Promise.race([exited.then(() => true), sleep(8_000).then(() => false)]);
        if (!done) {
          log(name, "did not stop within 8 s; killing it");
          signalGroup(child.pid, "SIGKILL");
          await exited;
        }
      })();
      return stopping;
    },
  };
}

/** The last output lines of a quiet process (for error messages). */
export function outputTail(p: Managed): string {
  return ((p.child as ChildProcess & { tail?: string[] }).tail ?? []).join("\n");
}

function signalGroup(pid: number, signal: NodeJS.Signals) {
  try {
    process.kill(-pid, signal);
  } catch {
    try {
      process.kill(pid, signal);
    } catch {
      /* already gone */
    }
  }
}

export function sleep(ms: number) {
  return new Promise((resolve) => setTimeout(resolve, ms));
}

/** Polls `url` until it answers (any HTTP status below 500 unless `accept` says otherwise). */
export async function waitForHttp(
  url: string,
  options: { timeoutMs?: number; process?: Managed; accept?: (status: number) => boolean } = {},
) {
  const deadline = Date.now() + (options.timeoutMs ?? 60_000);
  const accept = options.accept ?? ((s: number) => s < 500);
  let last = "no answer";
  while (Date.now() < deadline) {
    if (options.process && options.process.child.exitCode !== null) {
      throw new Error(`${options.process.name} exited (code ${options.process.child.exitCode}) before ${url} answered`);
    }
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2_000) });
      if (accept(res.status)) return;
      last = `HTTP ${res.status}`;
    } catch (err) {
      last = err instanceof Error ? err.message : String(err);
    }
    await sleep(250);
  }
  throw new Error(`${url} did not answer within ${(options.timeoutMs ?? 60_000) / 1000} s (${last})`);
}

/**
 * Runs `cleanup` once on Ctrl-C / SIGTERM / a fatal error, then exits. Returns a function that
 * runs it explicitly.
 */
export function onShutdown(cleanup: () => Promise<void>) {
  let running: Promise<void> | undefined;
  const run = () => (running ??= cleanup());
  const exitAfter = (code: number) => () => {
    run().finally(() => process.exit(code));
  };
  // `on`, not `once`: under `npm start` Ctrl-C arrives twice (from the terminal and relayed by
  // npm/tsx), and a second signal without a listener would kill us mid-cleanup.
  process.on("SIGINT", exitAfter(130));
  process.on("SIGTERM", exitAfter(143));
  process.on("SIGHUP", exitAfter(129));
  return run;
}
