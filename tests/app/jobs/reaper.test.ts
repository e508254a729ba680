import { spawn } from "node:child_process";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analysisParams } from "./fixtures";

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

/** Polls until `check` holds or about 20 s passed; returns whether it held (no timing asserted). */
async function eventually(check: () => boolean): Promise<boolean> {
  for (let i = 0; i < 200; i++) {
    if (check()) return true;
    await new Promise((r) => setTimeout(r, 100));
  }
  return check();
}

/** The job id the fake worker prints as "PID <n>". */
function pidFrom(worker: ReturnType<typeof spawn>): Promise<number> {
  return new Promise<number>((resolve, reject) => {
    let out = "";
    worker.stdout!.on("data", (d: Buffer) => {
      out += String(d);
      const m = /PID (\d+)/.exec(out);
      if (m) resolve(Number(m[1]));
    });
    worker.once("exit", (code) => reject(new Error(`worker exited early (${code}): ${out}`)));
  });
}

/**
 * A "worker" process forks a "job" that computes without ever yielding (a busy loop, like a long
 * Gröbner step), registers the reaper, and prints the job's id. Killing the worker with SIGKILL
 * (no cleanup runs) must still end the job (issue 16 #8).
 */
describe("a job's process dies with its worker", () => {
  it("SIGKILL on the worker ends the busy child too", async () => {
    const workerCode = `
      const { spawn } = await import("node:child_process");
      const { reapWithParent } = await import(${JSON.stringify(new URL("../../../app/jobs/reaper.server.ts", import.meta.url).pathname)});
      const child = spawn(process.execPath, ["-e", "for (;;) {}"], { stdio: "ignore" });
      reapWithParent(child.pid);
      console.log("PID " + child.pid);
      setInterval(() => {}, 1000);
    `;
    const worker = spawn(process.execPath, ["--import", "tsx", "--input-type=module", "-e", workerCode], { stdio: ["ignore", "pipe", "inherit"] });
    const childPid = await pidFrom(worker);
    expect(alive(childPid)).toBe(true);
    worker.kill("SIGKILL");
    const gone = await eventually(() => !alive(childPid));
    if (!gone) process.kill(childPid, "SIGKILL");
    expect(gone).toBe(true);
  });

  it("the job process that runInChild forks dies when its worker is SIGKILLed mid-computation", async () => {
    // Slow by construction: 3^10 positive steady states to list (see the fixture's header).
    const csv = readFileSync("tests/fixtures/networks/ten-switches.csv", "utf8");
    const payload = { kind: "analysis", csv, params: analysisParams({ timeLimitSeconds: 120 }) };
    const workerCode = `
      const { runInChild } = await import(${JSON.stringify(new URL("../../../app/jobs/run-child.server.ts", import.meta.url).pathname)});
      const run = runInChild(${JSON.stringify(payload)}, { engineTimeoutMs: 120000, onProgress: () => {} });
      console.log("PID " + run.pid);
      setInterval(() => {}, 1000);
    `;
    const worker = spawn(process.execPath, ["--import", "tsx", "--input-type=module", "-e", workerCode], { stdio: ["ignore", "pipe", "inherit"] });
    const childPid = await pidFrom(worker);
    await new Promise((r) => setTimeout(r, 1500)); // let the child get into the computation
    expect(alive(childPid)).toBe(true);
    // Model a step that never returns to the event loop: the child cannot run any handler at all
    // (not "disconnect", not a progress check) until it is signalled from outside.
    process.kill(childPid, "SIGSTOP");
    worker.kill("SIGKILL");
    const gone = await eventually(() => !alive(childPid));
    if (!gone) process.kill(childPid, "SIGKILL");
    expect(gone).toBe(true);
  }, 60_000);

  it("leaves the child alone while the worker lives", async () => {
    const { reapWithParent } = await import("~/jobs/reaper.server");
    const child = spawn(process.execPath, ["-e", "setTimeout(() => {}, 60000)"], { stdio: "ignore" });
    reapWithParent(child.pid!);
    await new Promise((r) => setTimeout(r, 1500));
    expect(alive(child.pid!)).toBe(true);
    child.kill("SIGKILL");
  });
});
