import { AlgebraError } from "./errors";
import { fieldCoefficients } from "./groebner/coefficients";
import { toEngine } from "./groebner/convert";
import { Limits } from "./groebner/limits";
import type { LimitOptions } from "./groebner/limits";
import { ReductionKernel, toReducer } from "./groebner/reduce";
import { packMonomial } from "./monomial";
import type { Polynomial } from "./polynomial";
import { fromTerms, isZeroPoly } from "./polynomial";
import type { PolynomialRing } from "./ring";

/**
 * FGLM change of ordering for a zero-dimensional ideal (Faugère, Gianni, Lazard, Mora, "Efficient
 * computation of zero-dimensional Gröbner bases by change of ordering", J. Symbolic Comput. 16,
 * 1993; Cox, Little, O'Shea, "Using Algebraic Geometry", 2nd ed. 2005, ch. 2 §3). From the
 * reduced basis G in one order, walks the monomials of the target order upwards, writes each as a
 * vector in K[x]/I via multiplication matrices, and records a new basis element as soon as a
 * monomial depends linearly on the smaller standard monomials. Exact linear algebra over the field.
 *
 * Example: G = [y^2 - x, x^2 - 1] (grevlex x > y) to lex gives [y^4 - 1, x - y^2].
 */
export function fglm<C>(G: readonly Polynomial<C>[], target: PolynomialRing<C>, options: LimitOptions = {}): Polynomial<C>[] {
  if (G.length === 0) throw new AlgebraError("domain", "fglm: the zero ideal is not zero-dimensional");
  const src = G[0].ring;
  const F = src.field, n = src.n;
  if (target.n !== n || target.field !== F || target.vars.some((v, i) => v !== src.vars[i])) {
    throw new AlgebraError("ring", "fglm: the target ring must have the same variables and field");
  }
  const limits = new Limits(options, "FGLM");
  if (G.some((g) => g.exps[0] === 0)) return [target.one()];
  // Standard monomials of the source basis, by breadth-first search (finite iff zero-dimensional).
  const lms = G.map((g) => Array.from(g.exps.subarray(1, n + 1)));
  const divisible = (e: readonly number[]) => lms.some((l) => l.every((x, k) => x <= e[k]));
  for (let k = 0; k < n; k++) {
    if (!lms.some((l) => l[k] > 0 && l.every((x, j) => j === k || x === 0))) {
      throw new AlgebraError("domain", "fglm: the ideal is not zero-dimensional");
    }
  }
  const basis: number[][] = [new Array<number>(n).fill(0)];
  const index = new Map<string, number>([[basis[0].join(","), 0]]);
  for (let q = 0; q < basis.length; q++) {
    for (let k = 0; k < n; k++) {
      const e = basis[q].slice();
      e[k]++;
      const key = e.join(",");
      if (index.has(key) || divisible(e)) continue;
      index.set(key, basis.length);
      basis.push(e);
    }
  }
  const D = basis.length;
  // Normal forms of x_k * b as dense vectors, computed on demand (column b of multiplication matrix k).
  const kernel = new ReductionKernel(fieldCoefficients(F), n, src.cmp, () => limits.checkTime(), false);
  const reducers = G.map((g) => toReducer(toEngine(g), n));
  const mulCache = new Map<string, C[]>();
  const normalVector = (e: number[]): C[] => {
    const key = e.join(",");
    const cached = mulCache.get(key);
    if (cached) return cached;
    const v = new Array<C>(D).fill(F.zero);
    const j = index.get(key);
    if (j !== undefined) v[j] = F.one;
    else {
      const nf = kernel.reduce({ coeffs: [F.one], exps: packMonomial(e) }, reducers, true);
      const S = n + 1;
      for (let t = 0; t < nf.coeffs.length; t++) {
        const k = index.get(Array.from(nf.exps.subarray(t * S + 1, t * S + S)).join(","));
        if (k === undefined) throw new Error("fglm: normal form outside the standard monomials");
        v[k] = nf.coeffs[t];
      }
    }
    mulCache.set(key, v);
    return v;
  };
  // Vector of a monomial m = x_k * m' from the vector of m': v(m) = Σ_b v(m')_b · NF(x_k b).
  const vectors = new Map<string, C[]>();
  const vectorOf = (e: number[], parent: number[] | null, k: number): C[] => {
    if (parent === null) return normalVector(e);
    const pv = vectors.get(parent.join(","))!;
    const out = new Array<C>(D).fill(F.zero);
    for (let b = 0; b < D; b++) {
      if (F.isZero(pv[b])) continue;
      limits.checkTime(); // D² products of possibly huge rationals per candidate
      const eb = basis[b].slice();
      eb[k]++;
      const col = normalVector(eb);
      for (let r = 0; r < D; r++) if (!F.isZero(col[r])) out[r] = F.add(out[r], F.mul(pv[b], col[r]));
    }
    return out;
  };

  // Echelon form of the vectors of the new standard monomials, each row with its combination.
  const rows: { pivot: number; vec: C[]; comb: C[] }[] = [];
  const newStd: number[][] = [];
  const result: Polynomial<C>[] = [];
  const resultLms: number[][] = [];
  const tcmp = (a: number[], b: number[]) => target.cmp(packMonomial(a), 0, packMonomial(b), 0);
  const queued = new Set<string>();
  const candidates: { e: number[]; parent: number[] | null; k: number }[] = [{ e: new Array<number>(n).fill(0), parent: null, k: -1 }];
  queued.add(candidates[0].e.join(","));
  while (candidates.length > 0) {
    limits.checkTime();
    let best = 0;
    for (let c = 1; c < candidates.length; c++) if (tcmp(candidates[c].e, candidates[best].e) < 0) best = c;
    const { e, parent, k } = candidates.splice(best, 1)[0];
    if (resultLms.some((l) => l.every((x, j) => x <= e[j]))) continue;
    const raw = vectorOf(e, parent, k);
    const v = raw.slice();
    const comb = new Array<C>(newStd.length + 1).fill(F.zero);
    comb[newStd.length] = F.one;
    for (const row of rows) {
      const c = v[row.pivot];
      if (F.isZero(c)) continue;
      limits.checkTime();
      for (let r = 0; r < D; r++) if (!F.isZero(row.vec[r])) v[r] = F.sub(v[r], F.mul(c, row.vec[r]));
      for (let r = 0; r < row.comb.length; r++) if (!F.isZero(row.comb[r])) comb[r] = F.sub(comb[r], F.mul(c, row.comb[r]));
    }
    const pivot = v.findIndex((x) => !F.isZero(x));
    if (pivot < 0) {
      // comb · (newStd..., e) ↦ 0: the polynomial e + Σ comb_j b_j lies in the ideal, with leading monomial e.
      const terms = [{ coeff: F.one, exponents: e }];
      newStd.forEach((b, j) => { if (!F.isZero(comb[j])) terms.push({ coeff: comb[j], exponents: b }); });
      result.push(fromTerms(target, terms));
      resultLms.push(e);
      continue;
    }
    const inv = F.inv(v[pivot]);
    rows.push({ pivot, vec: v.map((x) => F.mul(x, inv)), comb: comb.map((x) => F.mul(x, inv)) });
    newStd.push(e);
    vectors.set(e.join(","), raw);
    for (let j = 0; j < n; j++) {
      const m = e.slice();
      m[j]++;
      const key = m.join(",");
      if (queued.has(key)) continue;
      queued.add(key);
      candidates.push({ e: m, parent: e, k: j });
    }
  }
  if (newStd.length !== D) throw new Error(`fglm: found ${newStd.length} standard monomials, expected ${D}`);
  result.sort((a, b) => target.cmp(a.exps, 0, b.exps, 0));
  return result.filter((p) => !isZeroPoly(p));
}
