import { readFileSync } from "node:fs";
import { getPriority } from "node:os";
import { describe, expect, it } from "vitest";
import { JOB_NICENESS, runInChild } from "~/jobs/run-child.server";
import { analysisParams } from "./fixtures";

describe("runInChild", () => {
  it("runs the job process below the worker's priority, so page views get the CPU first", async () => {
    // Slow by construction (3^10 positive steady states to list): it is still running when asked.
    const csv = readFileSync("tests/fixtures/networks/ten-switches.csv", "utf8");
    const run = runInChild({ kind: "analysis", csv, params: analysisParams({ timeLimitSeconds: 60 }) } as never, { engineTimeoutMs: 60_000 });
    try {
      expect(run.pid).toBeDefined();
      expect(getPriority(run.pid!)).toBe(Math.min(19, getPriority() + JOB_NICENESS));
    } finally {
      run.stop("test over");
      expect(await run.outcome).toEqual({ kind: "stopped", reason: "test over" });
    }
  }, 60_000);
});
