import { describe, expect, it } from "vitest";
import { plotCsv } from "~/charts/plot-table";
import { exactBranchTable, exactCountTable, scanBranchTable, scanCountTable, timeCourseTable } from "~/analyses/plot-tables";
import { exactBranches, scanBranches } from "~/analyses/scan-branches";
import type { ScanResult, TimeCourseResult } from "~/analyses/result-types";

// An invented grid scan: one state at k = 1, three at k = 2 (lower stable, middle unstable, upper stable), none computed at k = 3.
const scan: ScanResult = {
  parameter: { kind: "rate", name: "k" },
  spacing: "linear",
  species: ["X", "Y"],
  points: [
    { value: 1, states: [{ concentrations: { X: 0.5, Y: 1 }, verdict: "stable" }] },
    {
      value: 2,
      states: [
        { concentrations: { X: 0.6, Y: 1 }, verdict: "stable" },
        { concentrations: { X: 2, Y: 1 }, verdict: "unstable" },
        { concentrations: { X: 4, Y: 1 }, verdict: "stable" },
      ],
    },
    { value: 3, states: null, note: "time limit" },
  ],
};

describe("plot tables: the CSV export holds the plotted rows", () => {
  it("writes the time course with one column per species under a header", () => {
    const course: TimeCourseResult = { species: ["A", "B"], endTime: 1, completed: true, note: null, method: "m", t: [0, 0.5, 1], y: [[1, 0], [0.6, 0.4], [0.37, 0.63]] };
    expect(plotCsv(timeCourseTable(course))).toBe("time,A,B\n0,1,0\n0.5,0.6,0.4\n1,0.37,0.63\n");
  });

  it("writes each grid-scan branch point with its stability, and the count at every point", () => {
    const chart = scanBranches(scan, "X");
    expect(plotCsv(scanBranchTable(scan, "X", chart))).toBe("k,branch,stability,X\n1,1,stable,0.5\n2,1,stable,0.6\n2,2,unstable,2\n2,3,stable,4\n");
    expect(plotCsv(scanCountTable(scan, chart))).toBe("k,positive steady states\n1,1\n2,3\n3,\n");
  });

  it("names an initial-concentration parameter X(0) and writes exact windows and curves", () => {
    const exactScan: ScanResult = {
      ...scan,
      parameter: { kind: "initial", name: "X" },
      exact: {
        folds: [],
        windows: [{ from: 0, to: 5, count: 1, sample: "1" }],
        curve: [
          { value: 1, steadyStates: [{ concentrations: { X: 1, Y: 2 }, stable: true }] },
          { value: 2, steadyStates: [{ concentrations: { X: 1.5, Y: 2 }, stable: true }] },
        ],
        eliminant: { variable: "X", polynomial: "X - 1" },
        assumptions: "",
        warnings: [],
      },
    };
    expect(plotCsv(exactCountTable(exactScan))).toBe("X(0) from,X(0) to,positive steady states\n0,5,1\n");
    expect(plotCsv(exactBranchTable(exactScan, "Y", exactBranches(exactScan.exact!, "Y")))).toBe("X(0),branch,stability,Y\n1,1,stable,2\n2,1,stable,2\n");
  });
});
