import { describe, expect, it } from "vitest";
import { judgeAnalyse, judgeSingular, targetTable } from "../../../bench/lib/analyse-target";
import type { ProcessRun } from "../../../bench/lib/process";
import { phosphorylationTwoSiteSymbolicNetwork } from "../../../bench/lib/systems";

const run = (over: Partial<ProcessRun>): ProcessRun => ({ seconds: 1, exitCode: 0, timedOut: false, stdout: "", stderr: "", ...over });
const network = phosphorylationTwoSiteSymbolicNetwork();

describe("issue-4 target verdicts", () => {
  it("judgeAnalyse fails on timeouts, errors, non-JSON and a missing parametrisation", () => {
    expect(judgeAnalyse(run({ timedOut: true }), network)).toEqual({ ok: false, reason: "timed out" });
    expect(judgeAnalyse(run({ exitCode: 2, stderr: "error: bad\n" }), network)).toMatchObject({ ok: false, reason: /exit code 2: error: bad/ });
    expect(judgeAnalyse(run({ stdout: "not json" }), network)).toMatchObject({ ok: false });
    expect(judgeAnalyse(run({ stdout: JSON.stringify({ parametrisation: null }) }), network)).toMatchObject({ ok: false, reason: /no parametrisation/ });
  });
  it("judgeSingular counts the lines of the basis", () => {
    expect(judgeSingular(run({ stdout: "_[1]=x\n_[2]=y\n" }))).toEqual({ ok: true, basisSize: 2 });
    expect(judgeSingular(run({ timedOut: true }))).toEqual({ ok: false, reason: "timed out" });
  });
  it("targetTable shows medians, timeouts as bounds and failures", () => {
    const table = targetTable(
      [
        { program: "ours", command: "analyse", runs: [4, 5, 6], cpuRuns: [3, 3, 3], timedOut: false, outcome: "parametrisation checked", ok: true },
        { program: "Singular", command: "std", runs: [], cpuRuns: [], timedOut: true, outcome: "timed out", ok: false },
      ],
      120,
    );
    expect(table).toMatch(/ours .*5\.00 s .*3\.00 s .*parametrisation checked/);
    expect(table).toMatch(/Singular .*>120 s .*FAILED: timed out/);
  });
});
