/**
 * Steady-state branches of a scan for plotting: states at neighbouring parameter values are
 * joined greedily to the nearest branch (in the chosen species), and each branch is split into
 * stable and unstable pieces so the chart can draw them solid and dashed. Transition points are
 * repeated in both pieces so the line stays connected. (Common practice for bifurcation sketches.)
 * Example: counts 1, 3, 1 along k give a lower, a middle (unstable) and an upper branch.
 */
import type { ExactScan, ScanResult } from "./result-types";

export interface BranchChart {
  rows: Record<string, number | null>[];
  branches: number;
  /** Every drawn point: parameter value, branch (1-based), the species' value and the state's verdict. */
  points: { x: number; branch: number; y: number; verdict: string }[];
  counts: { value: number; count: number | null }[];
  /** Parameter intervals where more than one positive steady state exists. */
  multistable: { from: number; to: number; count: number }[];
}

export function scanBranches(scan: ScanResult, species: string): BranchChart {
  type Branch = { last: number; lastX: number; values: Map<number, { y: number; stable: boolean; verdict: string }> };
  const branches: Branch[] = [];
  scan.points.forEach((p, xi) => {
    if (!p.states) return;
    const ys = p.states.map((s) => ({ y: s.concentrations[species] ?? NaN, stable: s.verdict === "stable", verdict: s.verdict })).sort((a, b) => a.y - b.y);
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
  const points = branches.flatMap((b, bi) =>
    [...b.values].sort(([i], [j]) => i - j).map(([xi, st]) => ({ x: scan.points[xi]!.value, branch: bi + 1, y: st.y, verdict: st.verdict })),
  );
  return { rows, branches: branches.length, points, counts, multistable };
}

type CurvePoint = ExactScan["curve"][number];

export interface ExactBranchChart {
  /** One polyline per run of equal stability along a tracked branch; neighbouring runs share their end point. */
  segments: { branch: number; stable: boolean; data: { x: number; y: number }[] }[];
  /** Where two branches meet (a fold), in the chosen species. */
  foldMarkers: { x: number; y: number }[];
  branches: number;
  /** Exact windows with more than one positive steady state. */
  multistable: { from: number; to: number; count: number }[];
  counts: { value: number; count: number }[];
}

/** Distance of two steady states over every species, relative to their size (so small and large species weigh alike). */
function distance(a: Record<string, number>, b: Record<string, number>): number {
  let d = 0;
  for (const k of Object.keys(a)) {
    const x = a[k]!, y = b[k] ?? NaN;
    d += ((x - y) / (Math.abs(x) + Math.abs(y) + 1e-300)) ** 2;
  }
  return d;
}

/**
 * Branches of an exact scan as continuous curves. Between folds the number of states is constant
 * and each state is joined to the nearest state of the previous point in all species (greedy on
 * the sorted pairwise distances — adequate because points are dense and are added beside each
 * fold). Where states disappear or appear, the two branches involved are paired by closeness and
 * joined at the fold value, which gives the turning point of an S-shaped curve. Stable runs are
 * drawn solid and unstable dashed; an undecided point keeps the stability of its neighbours.
 * Example: the cubic switch scanned through its window gives a lower stable, a middle unstable and
 * an upper stable run, joined pairwise at the two folds.
 */
export function exactBranches(exact: ExactScan, species: string): ExactBranchChart {
  type Node = { x: number; c: Record<string, number>; stable: boolean | null };
  const branches: Node[][] = [];
  let active: number[] = [];
  const folds = exact.folds.map((f) => f.value);
  const foldBetween = (a: number, b: number) => folds.find((f) => f > Math.min(a, b) && f < Math.max(a, b)) ?? (a + b) / 2;
  const markers: { x: number; y: number }[] = [];
  const points: CurvePoint[] = [...exact.curve].sort((a, b) => a.value - b.value);
  let prevX = points[0]?.value ?? 0;
  for (const p of points) {
    const states = p.steadyStates.map((s) => ({ c: s.concentrations, stable: s.stable }));
    const pairs: { b: number; s: number; d: number }[] = [];
    for (const b of active) {
      const last = branches[b]![branches[b]!.length - 1]!;
      states.forEach((s, si) => pairs.push({ b, s: si, d: distance(last.c, s.c) }));
    }
    pairs.sort((u, v) => u.d - v.d);
    const usedB = new Set<number>(), usedS = new Set<number>();
    const keep = Math.min(active.length, states.length);
    for (const q of pairs) {
      if (usedB.size >= keep) break;
      if (usedB.has(q.b) || usedS.has(q.s)) continue;
      usedB.add(q.b);
      usedS.add(q.s);
      branches[q.b]!.push({ x: p.value, ...states[q.s]! });
    }
    const fx = foldBetween(prevX, p.value);
    // Branches that end here meet in pairs at the fold.
    const ended = active.filter((b) => !usedB.has(b));
    joinPairs(ended.map((b) => branches[b]![branches[b]!.length - 1]!), (i, j, node) => {
      branches[ended[i]!]!.push(node);
      branches[ended[j]!]!.push(node);
    }, fx, markers, species);
    // States with no branch start new ones, paired at the fold too.
    const born = states.map((_, si) => si).filter((si) => !usedS.has(si));
    const fresh = born.map((si) => {
      branches.push([{ x: p.value, ...states[si]! }]);
      return branches.length - 1;
    });
    if (active.length > 0)
      joinPairs(fresh.map((b) => branches[b]![0]!), (i, j, node) => {
        branches[fresh[i]!]!.unshift(node);
        branches[fresh[j]!]!.unshift(node);
      }, fx, markers, species);
    active = [...active.filter((b) => usedB.has(b)), ...fresh];
    prevX = p.value;
  }
  const segments: ExactBranchChart["segments"] = [];
  branches.forEach((nodes, bi) => {
    let run: { stable: boolean; data: { x: number; y: number }[] } | null = null;
    nodes.forEach((n, i) => {
      const stable = n.stable ?? nodes.slice(i + 1).find((m) => m.stable !== null)?.stable ?? run?.stable ?? true;
      const pt = { x: n.x, y: n.c[species] ?? NaN };
      if (!run || run.stable !== stable) {
        const last = run?.data[run.data.length - 1];
        run = { stable, data: last ? [last] : [] };
        segments.push({ branch: bi, ...run });
      }
      run.data.push(pt);
    });
  });
  return {
    segments,
    foldMarkers: markers,
    branches: branches.length,
    multistable: exact.windows.filter((w) => w.count > 1).map((w) => ({ from: w.from, to: w.to, count: w.count })),
    counts: exact.windows.flatMap((w) => [{ value: w.from, count: w.count }, { value: w.to, count: w.count }]),
  };
}

/** Pairs the given branch ends by closeness and hands each pair a shared node at the fold value x. */
function joinPairs(
  ends: { x: number; c: Record<string, number>; stable: boolean | null }[],
  join: (i: number, j: number, node: { x: number; c: Record<string, number>; stable: null }) => void,
  x: number,
  markers: { x: number; y: number }[],
  species: string,
) {
  const left = ends.map((_, i) => i);
  while (left.length >= 2) {
    let best: [number, number, number] | null = null;
    for (let a = 0; a < left.length; a++)
      for (let b = a + 1; b < left.length; b++) {
        const d = distance(ends[left[a]!]!.c, ends[left[b]!]!.c);
        if (!best || d < best[2]) best = [a, b, d];
      }
    const [a, b] = best!;
    const i = left[a]!, j = left[b]!;
    const c: Record<string, number> = {};
    for (const k of Object.keys(ends[i]!.c)) c[k] = (ends[i]!.c[k]! + ends[j]!.c[k]!) / 2;
    join(i, j, { x, c, stable: null });
    markers.push({ x, y: c[species] ?? NaN });
    left.splice(b, 1);
    left.splice(a, 1);
  }
}
