import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { computeJob } from "~/jobs/compute";
import { simulateTimeCourse } from "~/jobs/time-course";
import { exactBranches, scanBranches } from "~/analyses/scan-branches";
import { scanCsv } from "~/analyses/exports";
import { parseProgress } from "~/jobs/progress";
import type { ScanResult, TimeCourseResult } from "~/analyses/result-types";
import { analysisParams, fixtureCsv } from "./fixtures";

const CUBIC = fixtureCsv("cubic-autocatalysis");

describe("job computations (what the child process runs)", () => {
  it("a scan of the inflow constant finds the bistable window of the cubic autocatalytic network", () => {
    // dX/dt = k1 - 11X + 6X^2 - X^3 (fixture values, k1 scanned). Three positive roots exactly when k1
    // lies between the cubic's local extreme values, 6 ± 2/(3√3) ≈ 5.615 … 6.385 (derived by hand: the
    // critical points are X = 2 ± 1/√3).
    const parent = analysisParams({ initial: { X: "1" } });
    const scan = computeJob({ kind: "scan", csv: CUBIC, parent, params: { parameter: { kind: "rate", name: "k1" }, from: 5, to: 7, points: 11, spacing: "linear", timeLimitSeconds: 60 } }, { engineTimeoutMs: 60_000 }) as unknown as ScanResult;
    const counts = scan.points.map((p) => p.states?.length);
    // Grid 5, 5.2, …, 7: only 5.8, 6.0 and 6.2 lie inside the window.
    expect(counts).toEqual([1, 1, 1, 1, 3, 3, 3, 1, 1, 1, 1]);
    const middle = scan.points[5]!.states!; // k1 = 6: roots 1, 2, 3
    expect(middle.map((s) => s.concentrations.X)).toEqual([1, 2, 3]);
    expect(middle.map((s) => s.verdict)).toEqual(["stable", "unstable", "stable"]);
    const chart = scanBranches(scan, "X");
    expect(chart.multistable.map((m) => [m.from.toFixed(6), m.to.toFixed(6), m.count])).toEqual([["5.800000", "6.200000", 3]]);
    expect(chart.branches).toBeGreaterThanOrEqual(2);
    const unstable = chart.rows.filter((r) => Object.entries(r).some(([k, v]) => k.startsWith("u") && v !== null)).length;
    expect(unstable).toBeGreaterThanOrEqual(3);
    const csv = scanCsv(scan).split("\n");
    expect(csv[0]).toBe("k1,state,count,verdict,X");
    expect(csv.filter((l) => l.startsWith("6,"))).toEqual(["6,1,3,stable,1", "6,2,3,unstable,2", "6,3,3,stable,3"]);
  }, 60_000);

  it("a scan carries the exact folds and windows, and its branches are continuous curves joined at the folds", () => {
    // Folds at k1 = 6 ± 2√3/9 (hand computation from the discriminant −(27k1² − 324k1 + 968) of X³ − 6X² + 11X − k1).
    const parent = analysisParams({ initial: { X: "1" } });
    const scan = computeJob({ kind: "scan", csv: CUBIC, parent, params: { parameter: { kind: "rate", name: "k1" }, from: 5, to: 7, points: 11, spacing: "linear", timeLimitSeconds: 60 } }, { engineTimeoutMs: 60_000 }) as unknown as ScanResult;
    expect(scan.exact!.folds.map((f) => f.value)).toEqual([5.615099821, 6.384900179]);
    expect(scan.exact!.windows.map((w) => w.count)).toEqual([1, 3, 1]);
    const chart = exactBranches(scan.exact!, "X");
    expect(chart.multistable).toEqual([{ from: expect.closeTo(5.6150998, 6), to: expect.closeTo(6.3849002, 6), count: 3 }]);
    expect(chart.foldMarkers.map((m) => m.x)).toEqual([5.615099821, 6.384900179]);
    // The S-curve: X at the folds is 2 ± 1/√3 (double roots, by hand).
    expect(chart.foldMarkers.map((m) => m.y).sort((a, b) => a - b)).toEqual([expect.closeTo(2 - 1 / Math.sqrt(3), 2), expect.closeTo(2 + 1 / Math.sqrt(3), 2)]);
    const unstable = chart.segments.filter((s) => !s.stable);
    expect(unstable).toHaveLength(1);
    // The unstable middle branch runs from one fold to the other, between X = 2 − 1/√3 and 2 + 1/√3.
    const mid = unstable[0]!.data;
    expect(mid[0]!.x).toBe(5.615099821);
    expect(mid[mid.length - 1]!.x).toBe(6.384900179);
    for (const p of mid) expect(p.y > 2 - 1 / Math.sqrt(3) - 1e-3 && p.y < 2 + 1 / Math.sqrt(3) + 1e-3).toBe(true);
    // Each stable run is monotone increasing in X along k1 (dX/dk1 > 0 on stable branches).
    for (const s of chart.segments.filter((x) => x.stable)) for (let i = 1; i < s.data.length; i++) expect(s.data[i]!.y).toBeGreaterThanOrEqual(s.data[i - 1]!.y - 1e-9);
  }, 60_000);

  it("a log-spaced scan gets a log-spaced exact curve with points beside each fold", () => {
    const parent = analysisParams({ initial: { X: "1" } });
    const scan = computeJob({ kind: "scan", csv: CUBIC, parent, params: { parameter: { kind: "rate", name: "k1" }, from: 1, to: 100, points: 5, spacing: "log", timeLimitSeconds: 60 } }, { engineTimeoutMs: 60_000 }) as unknown as ScanResult;
    const xs = scan.exact!.curve.map((p) => p.value);
    // 41 log-spaced values 10^(2i/40): the second is 10^0.05 ≈ 1.122; plus 3 points on each side of both folds.
    expect(xs[1]).toBeCloseTo(10 ** 0.05, 9);
    expect(xs).toHaveLength(41 + 12);
    expect(scan.exact!.windows.map((w) => w.count)).toEqual([1, 3, 1]);
  }, 60_000);

  it("a relation test in a numeric run accepts rate constants (k1 - 60) and totals", () => {
    const parent = analysisParams({ initial: { X: "1" } });
    const r = computeJob({ kind: "relation", csv: CUBIC, parent, params: { expression: "k1 - 60", timeLimitSeconds: 10 } }, { engineTimeoutMs: 10_000 });
    expect(r.relation).toMatchObject({ expression: "-54", inIdeal: false, vanishes: false });
    const mm = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,1,3\n";
    const t = computeJob({ kind: "relation", csv: mm, parent: analysisParams({ initial: { A: "4" } }), params: { expression: "A - 3*T1/4", timeLimitSeconds: 10 } }, { engineTimeoutMs: 10_000 });
    expect(t.relation).toMatchObject({ inIdeal: true });
  });

  it("an analysis result carries the multistationarity verdict with its witness", () => {
    const r = computeJob({ kind: "analysis", csv: CUBIC, params: analysisParams({ initial: { X: "1" } }) }, { engineTimeoutMs: 30_000 }) as { multistationarity: { verdict: string; witness: { steadyStates: unknown[] } } };
    expect(r.multistationarity.verdict).toBe("multistationary");
    expect(r.multistationarity.witness.steadyStates.length).toBeGreaterThanOrEqual(2);
  }, 60_000);

  it("a relation test gives the exact verdict and remainder", () => {
    const parent = analysisParams({ rateMode: "symbolic" });
    const csv = "reaction,rate\nA + B -> 2B,k1\nB -> A,k2\n";
    const yes = computeJob({ kind: "relation", csv, parent, params: { expression: "k1*A - k2", timeLimitSeconds: 10 } }, { engineTimeoutMs: 10_000 });
    expect(yes.relation).toMatchObject({ inIdeal: true, remainder: "0" });
    const no = computeJob({ kind: "relation", csv, parent, params: { expression: "A - B", timeLimitSeconds: 10 } }, { engineTimeoutMs: 10_000 });
    expect(no.relation).toMatchObject({ inIdeal: false });
    expect((no.relation as { remainder: string }).remainder).not.toBe("0");
  });

  it("a time course of A -> B follows exp(-k t) and ends at the steady state", () => {
    const network = parseNetworkCsv("reaction,rate,rate_value\nA -> B,k,2\n");
    const course = simulateTimeCourse(network, { A: "1" }, 5, { engineTimeoutMs: 10_000 }) as unknown as TimeCourseResult;
    expect(course.completed).toBe(true);
    const last = course.y[course.y.length - 1]!;
    expect(last[0]).toBeCloseTo(Math.exp(-10), 4);
    expect(last[0]! + last[1]!).toBeCloseTo(1, 9);
    const mid = course.t.findIndex((t) => t > 0.5);
    expect(course.y[mid]![0]).toBeCloseTo(Math.exp(-2 * course.t[mid]!), 4);
    expect(course.t.length).toBeLessThanOrEqual(400);
  });

  it("time courses of the cubic network settle on the stable steady state of their side of the unstable one", () => {
    const parent = analysisParams({ initial: { X: "1" } });
    const end = (x0: string) => {
      const c = computeJob({ kind: "timecourse", csv: CUBIC, parent, parentResult: null, params: { endTime: 20, initial: { X: x0 }, timeLimitSeconds: 10 } }, { engineTimeoutMs: 10_000 }) as unknown as TimeCourseResult;
      return c.y[c.y.length - 1]![0]!;
    };
    // Steady states 1 (stable), 2 (unstable), 3 (stable): see the fixture's header.
    expect(end("1.9")).toBeCloseTo(1, 5);
    expect(end("2.1")).toBeCloseTo(3, 5);
  });

  it("symbolic mode drops the file's rate values; numeric overrides replace them", () => {
    const sym = computeJob({ kind: "analysis", csv: CUBIC, params: analysisParams({ rateMode: "symbolic" }) }, { engineTimeoutMs: 20_000 });
    expect((sym.parameters as { rateConstants: string[] }).rateConstants).toEqual(["k1", "k2", "k3", "k4"]);
    const num = computeJob({ kind: "analysis", csv: CUBIC, params: analysisParams({ rateValues: { k1: "5" }, initial: { X: "1" } }) }, { engineTimeoutMs: 20_000 });
    expect((num.parameters as { values: Record<string, string> }).values.k1).toBe("5");
    expect((num.steadyStates as unknown[]).length).toBe(1);
  });

  it("the form's suggested order is the one the engine uses", async () => {
    const { suggestedOrder } = await import("~/analyses/suggested-order");
    const csv = fixtureCsv("two-site-phosphorylation");
    const r = computeJob({ kind: "analysis", csv, params: analysisParams({ rateMode: "symbolic" }) }, { engineTimeoutMs: 3000 }) as { order: { species: string[]; reason: string } };
    const s = suggestedOrder(parseNetworkCsv(csv));
    expect(s.order).toEqual(r.order.species);
    expect(s.reason).toBe(r.order.reason);
  }, 30_000);

  it("reads the engine's progress lines", () => {
    expect(parseProgress({ phase: "groebner", message: "Gröbner basis: 12 polynomials, 40 pairs left, degree 5" }, 7)).toEqual({
      stage: "groebner", message: "Gröbner basis: 12 polynomials, 40 pairs left, degree 5", elapsedMs: 7, basisSize: 12, pairsLeft: 40, degree: 5,
    });
  });
});
