/**
 * Steady-state branches of a scan for plotting: states at neighbouring parameter values are
 * joined greedily to the nearest branch (in the chosen species), and each branch is split into
 * stable and unstable pieces so the chart can draw them solid and dashed. Transition points are
 * repeated in both pieces so the line stays connected. (Common practice for bifurcation sketches.)
 * Example: counts 1, 3, 1 along k give a lower, a middle (unstable) and an upper branch.
 */
import type { ScanResult } from "./result-types";

export interface BranchChart {
  rows: Record<string, number | null>[];
  branches: number;
  counts: { value: number; count: number | null }[];
  /** Parameter intervals where more than one positive steady state exists. */
  multistable: { from: number; to: number; count: number }[];
}

export function scanBranches(scan: ScanResult, species: string): BranchChart {
  type Branch = { last: number; lastX: number; values: Map<number, { y: number; stable: boolean }> };
  const branches: Branch[] = [];
  scan.points.forEach((p, xi) => {
    if (!p.states) return;
    const ys = p.states.map((s) => ({ y: s.concentrations[species] ?? NaN, stable: s.verdict === "stable" })).sort((a, b) => a.y - b.y);
    const free = new Set(branches.map((_, i) => i).filter((i) => branches[i]!.lastX === xi - 1));
    for (const s of ys) {
      let best = -1;
      for (const i of free) if (best < 0 || Math.abs(branches[i]!.last - s.y) < Math.abs(branches[best]!.last - s.y)) best = i;
      if (best >= 0) {
        free.delete(best);
        branches[best]!.last = s.y;
        branches[best]!.lastX = xi;
        branches[best]!.values.set(xi, s);
      } else branches.push({ last: s.y, lastX: xi, values: new Map([[xi, s]]) });
    }
  });
  const rows = scan.points.map((p, xi) => {
    const row: Record<string, number | null> = { x: p.value };
    branches.forEach((b, bi) => {
      const here = b.values.get(xi);
      const prev = b.values.get(xi - 1);
      const next = b.values.get(xi + 1);
      if (!here) {
        row[`s${bi}`] = null;
        row[`u${bi}`] = null;
        return;
      }
      const touches = (stable: boolean) => (prev !== undefined && prev.stable === stable) || (next !== undefined && next.stable === stable);
      row[`s${bi}`] = here.stable || touches(true) ? here.y : null;
      row[`u${bi}`] = !here.stable || touches(false) ? here.y : null;
    });
    return row;
  });
  const counts = scan.points.map((p) => ({ value: p.value, count: p.states ? p.states.length : null }));
  const multistable: BranchChart["multistable"] = [];
  for (const c of counts) {
    const last = multistable[multistable.length - 1];
    if (c.count !== null && c.count > 1) {
      if (last && last.count === c.count && last.to === counts[counts.indexOf(c) - 1]?.value) last.to = c.value;
      else multistable.push({ from: c.value, to: c.value, count: c.count });
    }
  }
  return { rows, branches: branches.length, counts, multistable };
}
