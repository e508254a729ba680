import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { effectiveOrder, parseAnalysisParams, parseScanParams, scanGrid, decimalText } from "~/analyses/params";

const net = parseNetworkCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nE + S <-> C,kon,koff,2,1\nC -> E + P,kcat,,3,\n");
const limits = { maxTimeLimitSeconds: 300, maxBasisSize: 5000 };

describe("parseAnalysisParams", () => {
  it("fills defaults: suggested order, numeric rates from the file, 120 s", () => {
    const r = parseAnalysisParams({}, net, limits);
    expect(r).toEqual({ ok: true, value: { order: null, free: [], rateMode: "numeric", rateValues: {}, initial: null, timeLimitSeconds: 120, maxBasisSize: 2000, maxTerms: 20000, notify: false } });
  });

  it("reads the form's strings and the API's objects alike", () => {
    const a = parseAnalysisParams({ order: "C,E", free: ["S"], initial: "E=1/10, S=1", rateValues: { kon: "5/2" } }, net, limits);
    const b = parseAnalysisParams({ order: ["C", "E"], free: "S", initial: { E: "1/10", S: "1" }, rateValues: "kon=5/2" }, net, limits);
    expect(a).toEqual(b);
    expect(a.ok && a.value.initial).toEqual({ E: "1/10", S: "1" });
  });

  it("reports every problem with its field", () => {
    const r = parseAnalysisParams({ order: "C,Q,C", initial: { E: "-1", Z: "1" }, rateValues: { kx: "1", kon: "0" }, timeLimitSeconds: "301", maxBasisSize: "0" }, net, limits);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems.map((p) => p.field)).toEqual(["order", "order", "rateValues.kx", "rateValues.kon", "initial.E", "initial.Z", "timeLimitSeconds", "maxBasisSize"]);
    expect(r.problems.find((p) => p.field === "timeLimitSeconds")!.message).toMatch(/at most 300 s in this lab/);
  });

  it("refuses numeric steady states with symbolic rate constants", () => {
    const r = parseAnalysisParams({ rateMode: "symbolic", initial: { E: "1" } }, net, limits);
    expect(!r.ok && r.problems[0]!.field).toBe("initial");
  });
});

describe("effectiveOrder", () => {
  it("moves free species last and completes a partial order with the suggestion", () => {
    expect(effectiveOrder({ order: ["P"], free: ["E"] }, ["C", "E", "S", "P"])).toEqual(["P", "C", "S", "E"]);
    expect(effectiveOrder({ order: null, free: [] }, ["C", "E"])).toBeUndefined();
  });
});

describe("scans", () => {
  it("grids are linear or logarithmic with both ends included", () => {
    expect(scanGrid({ from: 1, to: 3, points: 3, spacing: "linear" })).toEqual([1, 2, 3]);
    const log = scanGrid({ from: 0.1, to: 10, points: 3, spacing: "log" });
    expect(log[1]).toBeCloseTo(1, 12);
    expect(log[2]).toBeCloseTo(10, 12);
  });

  it("decimalText keeps 12 significant digits without exponent notation", () => {
    expect(decimalText(1 / 3)).toBe("0.333333333333");
    expect(decimalText(1e-7)).toBe("0.0000001");
  });

  it("needs a numeric parent analysis and a known parameter", () => {
    const parent = parseAnalysisParams({ initial: { E: "1", S: "1" } }, net, limits);
    if (!parent.ok) throw new Error("setup");
    expect(parseScanParams({ parameterKind: "rate", parameter: "kon", from: "0.5", to: "5" }, net, parent.value, limits).ok).toBe(true);
    const bad = parseScanParams({ parameterKind: "rate", parameter: "kz", from: "5", to: "1", spacing: "log", points: "1" }, net, { ...parent.value, initial: null }, limits);
    expect(!bad.ok && bad.problems.map((p) => p.field)).toEqual(["parameter", "parameter", "to", "points"]);
  });
});
