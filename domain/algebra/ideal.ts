import { AlgebraError } from "./errors";
import { divide } from "./division";
import { ringOf } from "./groebner";
import { fieldCoefficients } from "./groebner/coefficients";
import { fromEngine, toEngine } from "./groebner/convert";
import { scaleFreeEngine } from "./groebner/engine-for-ring";
import type { LimitOptions } from "./groebner/limits";
import { Limits } from "./groebner/limits";
import { updatePairs } from "./groebner/pairs";
import type { BasisEntry, CriticalPair } from "./groebner/pairs";
import { ReductionKernel, toReducer } from "./groebner/reduce";
import { divides, divInto, isCoprime, lcm } from "./monomial";
import type { Polynomial } from "./polynomial";
import { add, equals, isZeroPoly, makeMonic, mul, mulTerm, sub, zeroPoly } from "./polynomial";

/**
 * Normal form of f modulo G: full reduction by the leading terms of G (the remainder of
 * division, Cox, Little, O'Shea, ch. 2 §6, Proposition 1 — unique when G is a Gröbner basis).
 * Example (lex x > y, G = [x - y^2, y^3 - 1]): normalForm(x^2 + y, G) is 2*y (x^2 → y^4 → y).
 */
export function normalForm<C>(f: Polynomial<C>, G: readonly Polynomial<C>[]): Polynomial<C> {
  const ring = f.ring;
  for (const g of G) if (g.ring !== ring) throw new AlgebraError("ring", "normalForm: polynomials from different rings");
  const K = fieldCoefficients(ring.field);
  const kernel = new ReductionKernel(K, ring.n, ring.cmp, undefined, false);
  const reducers = G.filter((g) => !isZeroPoly(g)).map((g) => toReducer(toEngine(makeMonic(g)), ring.n));
  return fromEngine(ring, kernel.reduce(toEngine(f), reducers, true));
}

/**
 * Buchberger's criterion (Cox, Little, O'Shea, ch. 2 §6, Theorem 6): G is a Gröbner basis iff
 * every S-polynomial reduces to zero; pairs with coprime leading monomials are skipped
 * (ibid. ch. 2 §9, Proposition 4). Example: isGroebner([x^2, x*y, y^2 - 1/2*x]) in grlex is true.
 */
export function isGroebner<C>(G: readonly Polynomial<C>[], options: LimitOptions = {}): boolean {
  const polys = G.filter((g) => !isZeroPoly(g));
  if (polys.length === 0) return true;
  const ring = ringOf(polys, "isGroebner");
  const n = ring.n;
  const limits = new Limits(options, "isGroebner");
  const { K, toEngine: toE } = scaleFreeEngine(ring);
  const kernel = new ReductionKernel(K, n, ring.cmp, () => limits.checkTime());
  const E = polys.map((p) => toE(p));
  const reducers = E.map((p) => toReducer(p, n));
  for (let i = 0; i < E.length; i++) {
    for (let j = i + 1; j < E.length; j++) {
      limits.checkTime();
      if (isCoprime(E[i].exps, 0, E[j].exps, 0, n)) continue;
      const l = lcm(E[i].exps, 0, E[j].exps, 0, n);
      const head = shift(E[i], l, n);
      // Top reduction suffices: the normal form is zero iff the head reductions end in zero.
      if (kernel.reduce(head, reducers, false, E[j]).coeffs.length !== 0) return false;
    }
  }
  return true;
}

function shift<C>(f: { coeffs: C[]; exps: Int32Array }, l: Int32Array, n: number) {
  const S = n + 1, len = f.coeffs.length;
  const exps = new Int32Array(len * S);
  for (let t = 0; t < len; t++) for (let k = 0; k < S; k++) exps[t * S + k] = f.exps[t * S + k] + l[k] - f.exps[k];
  return { coeffs: f.coeffs, exps };
}

/**
 * Reducedness (Cox, Little, O'Shea, ch. 2 §7, Definition 4): every element monic and no
 * monomial of any element lies in the ideal of the other elements' leading terms.
 * (Combine with isGroebner for "reduced Gröbner basis".)
 */
export function isReduced<C>(G: readonly Polynomial<C>[]): boolean {
  const n = G[0]?.ring.n ?? 0;
  for (const g of G) if (isZeroPoly(g) || !g.ring.field.isOne(g.coeffs[0])) return false;
  for (let i = 0; i < G.length; i++) {
    const S = G[i].ring.stride;
    for (let j = 0; j < G.length; j++) {
      if (i === j) continue;
      for (let t = 0; t < G[i].coeffs.length; t++) if (divides(G[j].exps, 0, G[i].exps, t * S, n)) return false;
    }
  }
  return true;
}

export interface MembershipResult<C> {
  readonly member: boolean;
  /** f = Σ cofactors[i] · generators[i] (present when member; verified by expansion). */
  readonly cofactors?: Polynomial<C>[];
  /** Normal form of f modulo a Gröbner basis of the ideal (zero iff member). */
  readonly remainder: Polynomial<C>;
}

/**
 * Ideal membership with a certificate (Cox, Little, O'Shea, ch. 2 §6, Corollary 2, and ch. 2 §7:
 * tracking how each new basis element is built from the generators). Runs a Buchberger
 * computation that records, for every basis element g, cofactors with g = Σ c_j·f_j, divides f by
 * that basis and combines the quotients. The certificate is checked by expansion before returning.
 *
 * Example: idealMembership(x^2 - y^2, [x - y]) gives cofactors [x + y].
 */
export function idealMembership<C>(f: Polynomial<C>, generators: readonly Polynomial<C>[], options: LimitOptions = {}): MembershipResult<C> {
  const ring = ringOf([f, ...generators], "idealMembership");
  const { basis, cofactors } = trackedGroebner(generators, options);
  const { quotients, remainder } = divide(f, basis);
  if (!isZeroPoly(remainder)) return { member: false, remainder };
  let result = generators.map(() => zeroPoly(ring));
  quotients.forEach((q, k) => {
    if (isZeroPoly(q)) return;
    result = result.map((acc, j) => add(acc, mul(q, cofactors[k][j])));
  });
  const expanded = result.reduce((acc, c, j) => add(acc, mul(c, generators[j])), zeroPoly(ring));
  if (!equals(expanded, f)) throw new Error("idealMembership: internal error, certificate does not expand to f");
  return { member: true, cofactors: result, remainder };
}

/**
 * A (non-reduced) Gröbner basis with cofactor vectors: basis[k] = Σ_j cofactors[k][j]·generators[j].
 * Plain Buchberger with the Gebauer–Möller update; slower than groebnerBasis, meant for certificates.
 */
export function trackedGroebner<C>(generators: readonly Polynomial<C>[], options: LimitOptions = {}) {
  const ring = ringOf(generators, "trackedGroebner");
  const F = ring.field, n = ring.n, m = generators.length;
  const limits = new Limits(options, "ideal membership");
  const basis: Polynomial<C>[] = [];
  const cofactors: Polynomial<C>[][] = [];
  const entries: BasisEntry[] = [];
  let pairs: CriticalPair[] = [];
  const unitVector = (j: number) => generators.map((_, i) => (i === j ? ring.one() : zeroPoly(ring)));
  /** Reduce h (with cofactors) by the current basis, recording the quotients' contributions. */
  const reduceTracked = (h: Polynomial<C>, cof: Polynomial<C>[]) => {
    const { quotients, remainder } = divide(h, basis);
    let c = cof;
    quotients.forEach((q, k) => {
      if (!isZeroPoly(q)) c = c.map((acc, j) => sub(acc, mul(q, cofactors[k][j])));
    });
    return { h: remainder, c };
  };
  const addElement = (h: Polynomial<C>, c: Polynomial<C>[], sugar: number) => {
    const inv = F.inv(h.coeffs[0]);
    basis.push(makeMonic(h));
    cofactors.push(c.map((x) => mulTerm(x, inv, new Int32Array(n + 1))));
    entries.push({ lm: basis[basis.length - 1].exps.subarray(0, n + 1), sugar, live: true });
    pairs = updatePairs(entries, pairs, entries.length - 1, n);
    limits.checkSizes(basis.length, pairs.length);
  };
  for (let j = 0; j < m; j++) {
    limits.checkTime();
    const { h, c } = reduceTracked(generators[j], unitVector(j));
    if (!isZeroPoly(h)) addElement(h, c, h.exps[0]);
  }
  while (pairs.length > 0) {
    limits.checkTime();
    let best = 0;
    for (let k = 1; k < pairs.length; k++) if (pairs[k].sugar < pairs[best].sugar) best = k;
    const { i, j, lcm: l, sugar } = pairs[best];
    pairs.splice(best, 1);
    limits.progress({ pairsLeft: pairs.length, basisSize: basis.length, degree: l[0], reductions: 0 });
    const mi = new Int32Array(n + 1), mj = new Int32Array(n + 1);
    divInto(mi, 0, l, 0, basis[i].exps, 0, n);
    divInto(mj, 0, l, 0, basis[j].exps, 0, n);
    const s = sub(mulTerm(basis[i], F.one, mi), mulTerm(basis[j], F.one, mj));
    const sc = cofactors[i].map((ci, t) => sub(mulTerm(ci, F.one, mi), mulTerm(cofactors[j][t], F.one, mj)));
    const { h, c } = reduceTracked(s, sc);
    if (!isZeroPoly(h)) addElement(h, c, sugar);
  }
  return { basis, cofactors };
}
