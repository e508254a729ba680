/**
 * The rows each analysis chart draws, as tables for its CSV export (app/charts/plot-table.ts):
 * one column per axis, named as the axis is labelled, one row per drawn point.
 * Example: timeCourseTable of a course with species [X] at t = 0, 1 is
 * { columns: ["time", "X"], rows: [{ time: 0, X: … }, { time: 1, X: … }] }.
 */
import type { PlotTable } from "~/charts/plot-table";
import type { ScanResult, TimeCourseResult } from "./result-types";
import type { BranchChart, ExactBranchChart } from "./scan-branches";

/** The scan parameter as an axis name: the rate constant, or `X(0)` for an initial concentration. */
export function scanParameterName(scan: ScanResult): string {
  return scan.parameter.kind === "rate" ? scan.parameter.name : `${scan.parameter.name}(0)`;
}

export const COUNT_COLUMN = "positive steady states";

export function timeCourseTable(course: TimeCourseResult): PlotTable {
  return {
    columns: ["time", ...course.species],
    rows: course.t.map((t, i) => Object.fromEntries([["time", t], ...course.species.map((s, j) => [s, course.y[i]![j]!])])),
  };
}

/** Steady states on the grid scan's branches: parameter, branch, stability verdict, the species. */
export function scanBranchTable(scan: ScanResult, species: string, chart: BranchChart): PlotTable {
  const x = scanParameterName(scan);
  return {
    columns: [x, "branch", "stability", species],
    rows: chart.points.map((p) => ({ [x]: p.x, branch: p.branch, stability: p.verdict, [species]: p.y })),
  };
}

/** The exact scan's curves as drawn: each run of one stability along a branch, fold points included. */
export function exactBranchTable(scan: ScanResult, species: string, chart: ExactBranchChart): PlotTable {
  const x = scanParameterName(scan);
  return {
    columns: [x, "branch", "stability", species],
    rows: chart.segments.flatMap((seg) => seg.data.map((p) => ({ [x]: p.x, branch: seg.branch + 1, stability: seg.stable ? "stable" : "unstable", [species]: p.y }))),
  };
}

/** The number of positive steady states at each grid point (empty where the point has no result). */
export function scanCountTable(scan: ScanResult, chart: BranchChart): PlotTable {
  const x = scanParameterName(scan);
  return { columns: [x, COUNT_COLUMN], rows: chart.counts.map((c) => ({ [x]: c.value, [COUNT_COLUMN]: c.count })) };
}

/** The exact count on each open window between fold points. */
export function exactCountTable(scan: ScanResult): PlotTable {
  const x = scanParameterName(scan);
  const from = `${x} from`, to = `${x} to`;
  return { columns: [from, to, COUNT_COLUMN], rows: (scan.exact?.windows ?? []).map((w) => ({ [from]: w.from, [to]: w.to, [COUNT_COLUMN]: w.count })) };
}
