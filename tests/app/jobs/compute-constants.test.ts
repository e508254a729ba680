import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { computeJob, networkFor } from "~/jobs/compute";
import { fileRateValues, parseScanParams, rateSymbols } from "~/analyses/params";
import type { ScanResult } from "~/analyses/result-types";
import { analysisParams } from "./fixtures";

// Schlögl's fed switch (Z. Physik 253, 1972), feed A symbolic in the file, waste B at 3:
// with A = 2, dX/dt = −(X − 1)(X − 2)(X − 3) (expanded by hand).
const FED = "# constant: A, B = 3\nreaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + 2X <-> 3X,k1,k2,3,1\nX <-> B,k3,k4,11,2\n";

describe("constant species in analysis jobs", () => {
  it("are parameters of a run after the rate symbols, with the file's concentrations as values", () => {
    const net = parseNetworkCsv(FED);
    expect(rateSymbols(net)).toEqual(["k1", "k2", "k3", "k4", "A", "B"]);
    expect(fileRateValues(net)).toMatchObject({ B: "3" });
    expect(fileRateValues(net).A).toBeUndefined();
  });

  it("a numeric run sets a symbolic feed; symbolic mode drops a given concentration", () => {
    const numeric = networkFor(FED, { rateMode: "numeric", rateValues: { A: "2" } });
    expect(numeric.constants?.map((c) => [c.name, c.value ?? null])).toEqual([
      ["A", { num: 2n, den: 1n }],
      ["B", { num: 3n, den: 1n }],
    ]);
    const symbolic = networkFor(FED, { rateMode: "symbolic", rateValues: {} });
    expect(symbolic.constants?.every((c) => c.value === undefined)).toBe(true);
    const r = computeJob({ kind: "analysis", csv: FED, params: analysisParams({ rateValues: { A: "2" }, initial: { X: "1" } }) }, { engineTimeoutMs: 20_000 }) as {
      steadyStates: { concentrations: Record<string, number> }[];
    };
    expect(r.steadyStates.map((s) => s.concentrations.X)).toEqual([1, 2, 3]);
  });

  it("a scan can vary the feed concentration: three states only inside the window", () => {
    // f(X) = 3A·X² − X³ − 11X + 6 (by hand): at A = 2 the roots are 1, 2, 3. At A = 1 and A = 3/2,
    // f'(X) = −3X² + 6A·X − 11 has discriminant 36A² − 132 < 0, so f decreases from f(0) = 6 > 0:
    // exactly one positive root.
    const parent = analysisParams({ rateValues: { A: "2" }, initial: { X: "1" } });
    const parsed = parseScanParams({ parameterKind: "rate", parameter: "A", from: "1", to: "2", points: "3" }, parseNetworkCsv(FED), parent, { maxTimeLimitSeconds: 60, maxBasisSize: 20_000 });
    expect(parsed.ok).toBe(true);
    const scan = computeJob(
      { kind: "scan", csv: FED, parent, params: { parameter: { kind: "rate", name: "A" }, from: 1, to: 2, points: 3, spacing: "linear", timeLimitSeconds: 60 } },
      { engineTimeoutMs: 60_000 },
    ) as unknown as ScanResult;
    expect(scan.points.map((p) => p.states?.length)).toEqual([1, 1, 3]);
  }, 60_000);
});
