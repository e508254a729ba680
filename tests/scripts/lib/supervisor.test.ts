import { describe, expect, it } from "vitest";
import { startProcess } from "../../../scripts/lib/processes";
import { supervise } from "../../../scripts/lib/supervisor";

describe("supervise", () => {
  it("restarts a child that dies on its own, and stops it for good on stop()", async () => {
    const starts: number[] = [];
    // First run crashes at once; later runs stay up (until stopped).
    const start = () => {
      starts.push(Date.now());
      const script = starts.length === 1 ? "process.exit(3)" : "setInterval(() => {}, 1000)";
      return startProcess("child", process.execPath, ["-e", script], { quiet: true });
    };
    const restarted: (number | null)[] = [];
    const supervised = await supervise("child", start, { backoffMs: 10, onRestart: (_n, code) => restarted.push(code) });
    while (supervised.restarts() < 1) await new Promise((r) => setTimeout(r, 20));
    expect(restarted).toEqual([3]);
    expect(supervised.child.exitCode).toBeNull();
    await supervised.stop();
    await supervised.exited;
    expect(starts).toHaveLength(2);
    expect(supervised.child.exitCode !== null || supervised.child.signalCode !== null).toBe(true);
  });

  it("gives up on a child that keeps crashing, so the caller can stop the rest", async () => {
    const supervised = await supervise("crashy", () => startProcess("crashy", process.execPath, ["-e", "process.exit(1)"], { quiet: true }), {
      backoffMs: 5,
      maxRestarts: 2,
    });
    expect(await supervised.exited).toBe(1);
    expect(supervised.restarts()).toBe(2);
  });
});
