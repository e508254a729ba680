import { describe, expect, it } from "vitest";
import { cpuView, formatNumber, formatRatio, formatTiming, ratioOf, renderTable, type ToolSummary } from "../../../bench/lib/table";

const ok = (median: number): ToolSummary => ({ status: "ok", median, runs: [median] });
const timeout: ToolSummary = { status: "timeout" };

describe("timings and ratios", () => {
  it("formats seconds with about three significant digits", () => {
    expect(formatNumber(123.4)).toBe("123");
    expect(formatNumber(12.34)).toBe("12.3");
    expect(formatNumber(1.234)).toBe("1.23");
    expect(formatNumber(0.0012)).toBe("0.0012");
    expect(formatTiming(ok(0.5), 120)).toBe("0.50 s");
    expect(formatTiming(timeout, 120)).toBe(">120 s");
    expect(formatTiming({ status: "error", message: "boom" }, 120)).toBe("error");
    expect(formatTiming({ status: "n/a", reason: "missing" }, 120)).toBe("n/a");
  });
  it("divides ours by the reference", () => {
    expect(ratioOf(ok(2), ok(8), 120)).toEqual({ bound: "=", value: 0.25 });
    expect(formatRatio(ratioOf(ok(2), ok(8), 120))).toBe("0.25");
  });
  it("turns a timeout into a bound: at most ours/timeout, at least timeout/reference", () => {
    expect(formatRatio(ratioOf(ok(2), timeout, 120))).toBe("<0.017");
    expect(formatRatio(ratioOf(timeout, ok(6), 120))).toBe(">20.0");
    expect(formatRatio(ratioOf(timeout, timeout, 120))).toBe("–");
    expect(formatRatio(ratioOf({ status: "n/a", reason: "" }, ok(1), 120))).toBe("–");
  });
});

describe("cpuView", () => {
  it("swaps wall time for CPU time, and is n/a without a CPU measurement", () => {
    const t: ToolSummary = { status: "ok", median: 2, runs: [2, 3, 1], cpuRuns: [1, 1.5, 0.5], cpuMedian: 1 };
    expect(cpuView(t)).toEqual({ status: "ok", median: 1, runs: [1, 1.5, 0.5] });
    expect(cpuView(ok(2)).status).toBe("n/a");
    expect(cpuView(timeout)).toBe(timeout);
  });
  it("gives no ratio against a reference below the clock's resolution", () => {
    expect(ratioOf(ok(0.3), ok(0), 120)).toBeUndefined();
    expect(formatNumber(0)).toBe("0");
  });
});

describe("renderTable", () => {
  it("pads columns to the widest cell, right-aligning where asked", () => {
    const text = renderTable(["system", "time"], [["katsura-3", "0.52 s"], ["c4", ">120 s"]], [false, true]);
    expect(text.split("\n")).toEqual([
      "system       time",
      "---------  ------",
      "katsura-3  0.52 s",
      "c4         >120 s",
    ]);
  });
  it("counts a multi-byte character such as the en dash as one column", () => {
    const text = renderTable(["a", "b"], [["–", "x"]], [false, false]);
    expect(text.split("\n")[2]).toBe("–  x");
  });
});
