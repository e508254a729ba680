import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { computeJob } from "~/jobs/compute";
import { simulateTimeCourse } from "~/jobs/time-course";
import { scanBranches } from "~/analyses/scan-branches";
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
