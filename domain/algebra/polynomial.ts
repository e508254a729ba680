import { AlgebraError } from "./errors";
import type { Exponents } from "./monomial";
import { mulInto, packMonomial } from "./monomial";
import type { PolynomialRing } from "./ring";

/**
 * Sparse polynomials (Cox, Little, O'Shea, "Ideals, Varieties, and Algorithms", 4th ed. 2015,
 * ch. 2 §2: terms ordered by a monomial order). Coefficients are stored apart from monomials:
 * `coeffs[i]` belongs to the packed monomial at `exps[i*stride .. i*stride+n]`.
 * Invariants (checked by `assertInvariants`): terms strictly decreasing in the ring's order
 * (so no duplicate monomials), no zero coefficients, cached degrees correct.
 * Values are immutable by convention: every operation returns a new polynomial.
 */
export interface Polynomial<C> {
  readonly ring: PolynomialRing<C>;
  readonly coeffs: readonly C[];
  readonly exps: Exponents;
}

/** A term as plain data, for building polynomials programmatically. */
export interface Term<C> {
  readonly coeff: C;
  readonly exponents: readonly number[];
}

export const numTerms = <C>(p: Polynomial<C>): number => p.coeffs.length;
export const isZeroPoly = <C>(p: Polynomial<C>): boolean => p.coeffs.length === 0;

export function zeroPoly<C>(ring: PolynomialRing<C>): Polynomial<C> {
  return { ring, coeffs: [], exps: new Int32Array(0) };
}

/**
 * Builds a polynomial from terms in any order, merging duplicates and dropping zeros.
 * Example: fromTerms(R, [{coeff: 2, exponents: [1,0]}, {coeff: 3, exponents: [1,0]}]) is 5*x.
 */
export function fromTerms<C>(ring: PolynomialRing<C>, terms: readonly Term<C>[]): Polynomial<C> {
  const S = ring.stride;
  const exps = new Int32Array(terms.length * S);
  terms.forEach((t, i) => {
    if (t.exponents.length !== ring.n) {
      throw new AlgebraError("ring", `term has ${t.exponents.length} exponents but the ring has ${ring.n} variables`);
    }
    exps.set(packMonomial(t.exponents), i * S);
  });
  return normalizeTerms(ring, terms.map((t) => t.coeff), exps);
}

/** Sorts (decreasing), merges equal monomials and drops zero coefficients. */
export function normalizeTerms<C>(ring: PolynomialRing<C>, coeffs: readonly C[], exps: Exponents): Polynomial<C> {
  const F = ring.field, S = ring.stride, cmp = ring.cmp;
  const idx = coeffs.map((_, i) => i);
  idx.sort((i, j) => cmp(exps, j * S, exps, i * S));
  const outC: C[] = [];
  const outE = new Int32Array(coeffs.length * S);
  let last = -1;
  for (const i of idx) {
    if (last >= 0 && cmp(exps, i * S, outE, last * S) === 0) {
      outC[last] = F.add(outC[last], coeffs[i]);
      continue;
    }
    if (last >= 0 && F.isZero(outC[last])) last--;
    last++;
    outC[last] = coeffs[i];
    outE.set(exps.subarray(i * S, i * S + S), last * S);
  }
  if (last >= 0 && F.isZero(outC[last])) last--;
  outC.length = last + 1;
  return { ring, coeffs: outC, exps: outE.slice(0, (last + 1) * S) };
}

export function constantPoly<C>(ring: PolynomialRing<C>, c: C): Polynomial<C> {
  if (ring.field.isZero(c)) return zeroPoly(ring);
  return { ring, coeffs: [c], exps: new Int32Array(ring.stride) };
}

/** The monomial x_i (0-based index). */
export function variablePoly<C>(ring: PolynomialRing<C>, i: number): Polynomial<C> {
  const e = new Int32Array(ring.stride);
  e[0] = 1;
  e[i + 1] = 1;
  return { ring, coeffs: [ring.field.one], exps: e };
}

/** Checks the representation invariants; throws a descriptive Error on the first violation. */
export function assertInvariants<C>(p: Polynomial<C>): void {
  const { ring } = p;
  const S = ring.stride, n = ring.n, F = ring.field;
  if (p.exps.length !== p.coeffs.length * S) throw new Error(`invariant: exps length ${p.exps.length} != ${p.coeffs.length}*${S}`);
  for (let i = 0; i < p.coeffs.length; i++) {
    if (F.isZero(p.coeffs[i])) throw new Error(`invariant: zero coefficient at term ${i}`);
    let d = 0;
    for (let k = 1; k <= n; k++) {
      if (p.exps[i * S + k] < 0) throw new Error(`invariant: negative exponent at term ${i}`);
      d += p.exps[i * S + k];
    }
    if (d !== p.exps[i * S]) throw new Error(`invariant: cached degree ${p.exps[i * S]} != ${d} at term ${i}`);
    if (i > 0 && ring.cmp(p.exps, (i - 1) * S, p.exps, i * S) <= 0) {
      throw new Error(`invariant: terms ${i - 1} and ${i} not strictly decreasing`);
    }
  }
}

function checkSameRing<C>(p: Polynomial<C>, q: Polynomial<C>): void {
  if (p.ring !== q.ring) throw new AlgebraError("ring", "polynomials belong to different rings");
}

/** p + s·q by a sorted merge (s = 1 or -1 covers add/sub). */
function combine<C>(p: Polynomial<C>, q: Polynomial<C>, negateQ: boolean): Polynomial<C> {
  checkSameRing(p, q);
  const ring = p.ring, F = ring.field, S = ring.stride, cmp = ring.cmp;
  const np = p.coeffs.length, nq = q.coeffs.length;
  const outC: C[] = [];
  const outE = new Int32Array((np + nq) * S);
  let i = 0, j = 0, k = 0;
  while (i < np || j < nq) {
    const c = i >= np ? -1 : j >= nq ? 1 : cmp(p.exps, i * S, q.exps, j * S);
    if (c > 0) {
      outC.push(p.coeffs[i]);
      outE.set(p.exps.subarray(i * S, i * S + S), k * S);
      i++; k++;
    } else if (c < 0) {
      outC.push(negateQ ? F.neg(q.coeffs[j]) : q.coeffs[j]);
      outE.set(q.exps.subarray(j * S, j * S + S), k * S);
      j++; k++;
    } else {
      const s = negateQ ? F.sub(p.coeffs[i], q.coeffs[j]) : F.add(p.coeffs[i], q.coeffs[j]);
      if (!F.isZero(s)) {
        outC.push(s);
        outE.set(p.exps.subarray(i * S, i * S + S), k * S);
        k++;
      }
      i++; j++;
    }
  }
  return { ring, coeffs: outC, exps: outE.slice(0, k * S) };
}

export const add = <C>(p: Polynomial<C>, q: Polynomial<C>): Polynomial<C> => combine(p, q, false);
export const sub = <C>(p: Polynomial<C>, q: Polynomial<C>): Polynomial<C> => combine(p, q, true);

export function neg<C>(p: Polynomial<C>): Polynomial<C> {
  const F = p.ring.field;
  return { ring: p.ring, coeffs: p.coeffs.map((c) => F.neg(c)), exps: p.exps };
}

/** c·p. */
export function scale<C>(p: Polynomial<C>, c: C): Polynomial<C> {
  const F = p.ring.field;
  if (F.isZero(c)) return zeroPoly(p.ring);
  if (F.isOne(c)) return p;
  return { ring: p.ring, coeffs: p.coeffs.map((a) => F.mul(a, c)), exps: p.exps };
}

/** c·m·p where m is a packed monomial (`m[0]` = degree); order is preserved by monomial orders. */
export function mulTerm<C>(p: Polynomial<C>, c: C, m: Exponents, im = 0): Polynomial<C> {
  const F = p.ring.field, S = p.ring.stride, n = p.ring.n;
  if (F.isZero(c)) return zeroPoly(p.ring);
  const len = p.coeffs.length;
  const exps = new Int32Array(len * S);
  for (let i = 0; i < len; i++) mulInto(exps, i * S, p.exps, i * S, m, im, n);
  return { ring: p.ring, coeffs: F.isOne(c) ? p.coeffs.slice() : p.coeffs.map((a) => F.mul(a, c)), exps };
}

/** p·q: every product term, then one sort-and-merge. */
export function mul<C>(p: Polynomial<C>, q: Polynomial<C>): Polynomial<C> {
  checkSameRing(p, q);
  const ring = p.ring, F = ring.field, S = ring.stride, n = ring.n;
  const np = p.coeffs.length, nq = q.coeffs.length;
  if (np === 0 || nq === 0) return zeroPoly(ring);
  if (np === 1) return mulTerm(q, p.coeffs[0], p.exps, 0);
  if (nq === 1) return mulTerm(p, q.coeffs[0], q.exps, 0);
  const coeffs: C[] = new Array(np * nq);
  const exps = new Int32Array(np * nq * S);
  let k = 0;
  for (let i = 0; i < np; i++) {
    for (let j = 0; j < nq; j++, k++) {
      coeffs[k] = F.mul(p.coeffs[i], q.coeffs[j]);
      mulInto(exps, k * S, p.exps, i * S, q.exps, j * S, n);
    }
  }
  return normalizeTerms(ring, coeffs, exps);
}

export function pow<C>(p: Polynomial<C>, e: number): Polynomial<C> {
  if (!Number.isInteger(e) || e < 0) throw new AlgebraError("domain", `power: exponent must be a non-negative integer, got ${e}`);
  let result = constantPoly(p.ring, p.ring.field.one);
  let base = p;
  while (e > 0) {
    if (e & 1) result = mul(result, base);
    e >>>= 1;
    if (e > 0) base = mul(base, base);
  }
  return result;
}

function requireNonZero<C>(p: Polynomial<C>, what: string): void {
  if (p.coeffs.length === 0) throw new AlgebraError("domain", `${what} of the zero polynomial`);
}

/** Leading coefficient (Cox–Little–O'Shea ch. 2 §2, Definition 7). */
export function leadingCoefficient<C>(p: Polynomial<C>): C {
  requireNonZero(p, "leading coefficient");
  return p.coeffs[0];
}

/** Leading monomial as a plain exponent vector. */
export function leadingMonomial<C>(p: Polynomial<C>): number[] {
  requireNonZero(p, "leading monomial");
  return Array.from(p.exps.subarray(1, 1 + p.ring.n));
}

/** Leading term as a one-term polynomial. */
export function leadingTerm<C>(p: Polynomial<C>): Polynomial<C> {
  requireNonZero(p, "leading term");
  return { ring: p.ring, coeffs: [p.coeffs[0]], exps: p.exps.slice(0, p.ring.stride) };
}

/** Total degree (max over terms); -1 for the zero polynomial. */
export function totalDegree<C>(p: Polynomial<C>): number {
  let d = -1;
  for (let i = 0; i < p.coeffs.length; i++) d = Math.max(d, p.exps[i * p.ring.stride]);
  return d;
}

/** The terms as plain data, in decreasing order. */
export function terms<C>(p: Polynomial<C>): Term<C>[] {
  const S = p.ring.stride, n = p.ring.n;
  return p.coeffs.map((coeff, i) => ({ coeff, exponents: Array.from(p.exps.subarray(i * S + 1, i * S + 1 + n)) }));
}

/** Coefficient of a monomial given as an exponent vector (zero if absent). */
export function coefficientOf<C>(p: Polynomial<C>, exponents: readonly number[]): C {
  const m = packMonomial(exponents);
  const S = p.ring.stride;
  for (let i = 0; i < p.coeffs.length; i++) if (p.ring.cmp(p.exps, i * S, m, 0) === 0) return p.coeffs[i];
  return p.ring.field.zero;
}

export function equals<C>(p: Polynomial<C>, q: Polynomial<C>): boolean {
  if (p.coeffs.length !== q.coeffs.length) return false;
  const F = p.ring.field;
  for (let i = 0; i < p.coeffs.length; i++) if (!F.eq(p.coeffs[i], q.coeffs[i])) return false;
  for (let i = 0; i < p.exps.length; i++) if (p.exps[i] !== q.exps[i]) return false;
  return true;
}

/** p / lc(p); the zero polynomial stays zero. */
export function makeMonic<C>(p: Polynomial<C>): Polynomial<C> {
  if (p.coeffs.length === 0) return p;
  const F = p.ring.field;
  return scale(p, F.inv(p.coeffs[0]));
}

/**
 * Value of p at a point (one field element per variable), by Horner-free direct powers.
 * Example: evaluate(x^2*y - 1, [2, 3]) is 11.
 */
export function evaluate<C>(p: Polynomial<C>, point: readonly C[]): C {
  const { ring } = p;
  const F = ring.field, S = ring.stride, n = ring.n;
  if (point.length !== n) throw new AlgebraError("ring", `evaluate: expected ${n} values, got ${point.length}`);
  const powCache = point.map((v) => [F.one, v]);
  const power = (k: number, e: number): C => {
    const cache = powCache[k];
    while (cache.length <= e) cache.push(F.mul(cache[cache.length - 1], point[k]));
    return cache[e];
  };
  let acc = F.zero;
  for (let i = 0; i < p.coeffs.length; i++) {
    let t = p.coeffs[i];
    for (let k = 0; k < n; k++) {
      const e = p.exps[i * S + 1 + k];
      if (e !== 0) t = F.mul(t, power(k, e));
    }
    acc = F.add(acc, t);
  }
  return acc;
}

/**
 * Substitutes values (field elements or polynomials of the same ring) for some variables,
 * given as a map from 0-based variable index. The variables stay in the ring (their exponent
 * becomes 0). Example: substitute(x*y + z, {1: 2}) is 2*x + z.
 */
export function substitute<C>(p: Polynomial<C>, values: ReadonlyMap<number, C | Polynomial<C>>): Polynomial<C> {
  const { ring } = p;
  const S = ring.stride, n = ring.n;
  const asPoly = new Map<number, Polynomial<C>>();
  for (const [k, v] of values) {
    if (k < 0 || k >= n) throw new AlgebraError("ring", `substitute: no variable with index ${k}`);
    asPoly.set(k, isPolynomial(v) ? v : constantPoly(ring, v as C));
  }
  const powCache = new Map<string, Polynomial<C>>();
  const powerOf = (k: number, e: number) => {
    const key = `${k}^${e}`;
    let r = powCache.get(key);
    if (!r) powCache.set(key, (r = pow(asPoly.get(k)!, e)));
    return r;
  };
  let acc = zeroPoly(ring);
  const rest: C[] = [];
  const restE: number[] = [];
  for (let i = 0; i < p.coeffs.length; i++) {
    const m = new Int32Array(S);
    let factor: Polynomial<C> | null = null;
    for (let k = 0; k < n; k++) {
      const e = p.exps[i * S + 1 + k];
      if (e !== 0 && asPoly.has(k)) {
        const pk = powerOf(k, e);
        factor = factor ? mul(factor, pk) : pk;
      } else {
        m[k + 1] = e;
        m[0] += e;
      }
    }
    if (!factor) {
      rest.push(p.coeffs[i]);
      restE.push(...m);
    } else {
      acc = add(acc, mulTerm(factor, p.coeffs[i], m));
    }
  }
  return add(acc, normalizeTerms(ring, rest, Int32Array.from(restE)));
}

export function isPolynomial<C>(v: unknown): v is Polynomial<C> {
  return typeof v === "object" && v !== null && "exps" in v && "coeffs" in v && "ring" in v;
}

/** ∂p/∂x_k (0-based k). Example: ∂(x^2*y)/∂x is 2*x*y. */
export function partialDerivative<C>(p: Polynomial<C>, k: number): Polynomial<C> {
  const { ring } = p;
  const F = ring.field, S = ring.stride;
  if (k < 0 || k >= ring.n) throw new AlgebraError("ring", `derivative: no variable with index ${k}`);
  const coeffs: C[] = [];
  const exps: number[] = [];
  for (let i = 0; i < p.coeffs.length; i++) {
    const e = p.exps[i * S + 1 + k];
    if (e === 0) continue;
    const c = F.mul(p.coeffs[i], F.fromBigInt(BigInt(e)));
    if (F.isZero(c)) continue; // characteristic p
    coeffs.push(c);
    const m = Array.from(p.exps.subarray(i * S, i * S + S));
    m[0] -= 1;
    m[1 + k] -= 1;
    exps.push(...m);
  }
  // Order is preserved for graded orders but not in general (e.g. weighted): re-normalise.
  return normalizeTerms(ring, coeffs, Int32Array.from(exps));
}

/** Maps a polynomial into another ring with the same number of variables (e.g. Q -> Z/p, or a new order). */
export function mapPolynomial<C, D>(p: Polynomial<C>, target: PolynomialRing<D>, f: (c: C) => D): Polynomial<D> {
  if (target.n !== p.ring.n) throw new AlgebraError("ring", "mapPolynomial: variable counts differ");
  return normalizeTerms(target, p.coeffs.map(f), p.exps.slice());
}

/** Sum of c_i · p_i. */
export function linearCombination<C>(ring: PolynomialRing<C>, parts: readonly Polynomial<C>[]): Polynomial<C> {
  return parts.reduce((acc, q) => add(acc, q), zeroPoly(ring));
}

