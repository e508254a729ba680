import { gcdBig } from "../algebra/rational";
import type { Matrix } from "./matrix";
import { primitiveOfIntegers } from "./primitive";
import { LinearBudgetError } from "./errors";

export interface ExtremeRayOptions {
  /** Largest number of intermediate generators allowed before giving up (default 20 000). */
  readonly maxRays?: number;
}

interface Generator {
  readonly v: bigint[];
  readonly support: bigint; // bit i set ⇔ v[i] ≠ 0
}

const supportOf = (v: readonly bigint[]): bigint =>
  v.reduce((mask, x, i) => (x !== 0n ? mask | (1n << BigInt(i)) : mask), 0n);

const dot = (a: readonly bigint[], b: readonly bigint[]): bigint => {
  let s = 0n;
  for (let i = 0; i < a.length; i++) if (a[i] !== 0n && b[i] !== 0n) s += a[i] * b[i];
  return s;
};

/** Column j of `a`, scaled to integers (same hyperplane). */
function integerColumn(a: Matrix, j: number): bigint[] {
  let den = 1n;
  for (let i = 0; i < a.rows; i++) {
    const d = a.entries[i][j].den;
    den = (den / gcdBig(den, d)) * d;
  }
  return a.entries.map((row) => (row[j].num * den) / row[j].den);
}

/**
 * Extreme rays of the pointed cone {y ≥ 0 : yᵀA = 0}, as primitive non-negative integer vectors.
 * For a stoichiometric matrix A these are the minimal semi-positive conservation laws: the
 * non-negative left-kernel vectors of minimal support (Schuster & Höfer, "Determining all extreme
 * semi-positive conservation relations in chemical reaction systems", J. Chem. Soc. Faraday
 * Trans. 87 (1991)).
 *
 * Method: double description (Motzkin et al. 1953; Fukuda & Prodon, "Double description method
 * revisited", 1996). Start from the unit vectors spanning the orthant, intersect with one
 * hyperplane yᵀa_j = 0 at a time, combining each positive with each negative generator when they
 * are adjacent. Adjacency uses the combinatorial test: no third generator has support inside the
 * union of the two supports (valid because every generator is an extreme ray of a pointed cone).
 *
 * Example: for A = [[-1], [1]] (the reaction X → Y) the only ray is (1, 1).
 */
export function nonNegativeLeftKernelRays(a: Matrix, options: ExtremeRayOptions = {}): bigint[][] {
  const maxRays = options.maxRays ?? 20_000;
  let gens: Generator[] = [];
  for (let i = 0; i < a.rows; i++) {
    const v = new Array<bigint>(a.rows).fill(0n);
    v[i] = 1n;
    gens.push({ v, support: 1n << BigInt(i) });
  }
  const pending = Array.from({ length: a.cols }, (_, j) => integerColumn(a, j)).filter((c) => c.some((x) => x !== 0n));

  while (pending.length > 0) {
    // Heuristic (common practice): next take the hyperplane creating the fewest candidate pairs.
    let best = 0;
    let bestCost = Infinity;
    pending.forEach((col, k) => {
      let pos = 0;
      let negs = 0;
      for (const g of gens) {
        const d = dot(g.v, col);
        if (d > 0n) pos++;
        else if (d < 0n) negs++;
      }
      if (pos * negs < bestCost) {
        bestCost = pos * negs;
        best = k;
      }
    });
    const col = pending.splice(best, 1)[0];
    gens = intersectWithHyperplane(gens, col, maxRays);
  }

  const rays = gens.map((g) => g.v);
  rays.sort(compareRays);
  return rays;
}

function intersectWithHyperplane(gens: Generator[], col: readonly bigint[], maxRays: number): Generator[] {
  const values = gens.map((g) => dot(g.v, col));
  const next: Generator[] = gens.filter((_, k) => values[k] === 0n);
  const positive = gens.map((_, k) => k).filter((k) => values[k] > 0n);
  const negative = gens.map((_, k) => k).filter((k) => values[k] < 0n);
  for (const p of positive) {
    for (const n of negative) {
      const union = gens[p].support | gens[n].support;
      let adjacent = true;
      for (let r = 0; r < gens.length && adjacent; r++) {
        if (r !== p && r !== n && (gens[r].support & ~union) === 0n) adjacent = false;
      }
      if (!adjacent) continue;
      // (a·p)·n − (a·n)·p lies on the hyperplane and stays non-negative.
      const vp = values[p];
      const vn = values[n];
      const v = primitiveOfIntegers(gens[p].v.map((x, i) => vp * gens[n].v[i] - vn * x));
      next.push({ v, support: supportOf(v) });
      if (next.length > maxRays) {
        throw new LinearBudgetError(
          `extreme rays: more than ${maxRays} intermediate generators; the network is too large for this budget`,
          maxRays,
        );
      }
    }
  }
  return next;
}

/** Order rays by their support (lowest species index first), then by entries. */
function compareRays(x: readonly bigint[], y: readonly bigint[]): number {
  const sx = x.map((v, i) => (v !== 0n ? i : -1)).filter((i) => i >= 0);
  const sy = y.map((v, i) => (v !== 0n ? i : -1)).filter((i) => i >= 0);
  for (let k = 0; k < Math.min(sx.length, sy.length); k++) if (sx[k] !== sy[k]) return sx[k] - sy[k];
  if (sx.length !== sy.length) return sx.length - sy.length;
  for (let i = 0; i < x.length; i++) if (x[i] !== y[i]) return x[i] < y[i] ? -1 : 1;
  return 0;
}
