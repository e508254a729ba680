import { divide } from "./division";
import type { Polynomial } from "./polynomial";
import { add as addPoly, fromTerms, mul, pow, scale, terms } from "./polynomial";
import type { Rational } from "./rational";
import { gcdBig, rational } from "./rational";

type QPoly = Polynomial<Rational>;

/**
 * Helpers on polynomials over Q for the steady-state layer: coefficients in one variable,
 * contents, sign patterns, exact quotients. They live here, beside the packed exponent layout
 * they read, so that no module outside the algebra reads `exps` directly.
 */

/** Is p a non-zero constant? A basis [c] with c ≠ 0 generates the whole ring. */
export function isNonZeroConstant<C>(p: Polynomial<C>): boolean {
  return p.coeffs.length === 1 && p.exps.every((e) => e === 0);
}

/** Degree of p in variable k (−1 for the zero polynomial). Example: degreeIn(x^2*y + y, x) = 2. */
export function degreeIn(p: QPoly, k: number): number {
  const S = p.ring.stride;
  let d = -1;
  for (let i = 0; i < p.coeffs.length; i++) d = Math.max(d, p.exps[i * S + 1 + k]);
  return d;
}

/**
 * Total degree of p in the variables `among` (the others count as coefficients); −1 for zero.
 * Example: totalDegreeIn(x^2*y*k + k^3, [x, y]) = 3.
 */
export function totalDegreeIn(p: QPoly, among: readonly number[]): number {
  const S = p.ring.stride;
  let d = -1;
  for (let i = 0; i < p.coeffs.length; i++) {
    let t = 0;
    for (const k of among) t += p.exps[i * S + 1 + k];
    d = Math.max(d, t);
  }
  return d;
}

/** The variables (0-based indices) that occur in p. */
export function variablesOf(p: QPoly): Set<number> {
  const S = p.ring.stride;
  const out = new Set<number>();
  for (let i = 0; i < p.coeffs.length; i++) for (let k = 0; k < p.ring.n; k++) if (p.exps[i * S + 1 + k] > 0) out.add(k);
  return out;
}

/**
 * p as a polynomial in variable k: entry j is the coefficient of x_k^j (free of x_k).
 * Example: coefficientsIn(x^2*y + 3*x + y, x) = [y, 3, y].
 */
export function coefficientsIn(p: QPoly, k: number): QPoly[] {
  const d = degreeIn(p, k);
  const buckets: { coeff: Rational; exponents: number[] }[][] = Array.from({ length: Math.max(d + 1, 0) }, () => []);
  for (const t of terms(p)) {
    const j = t.exponents[k];
    const e = [...t.exponents];
    e[k] = 0;
    buckets[j].push({ coeff: t.coeff, exponents: e });
  }
  return buckets.map((b) => fromTerms(p.ring, b));
}

/**
 * Divides out the largest monomial in the variables `among` that divides every term, and makes the
 * coefficients coprime integers with a positive leading coefficient. Zeros at the boundary
 * (a species equal to 0) are exactly what saturation removes, so this is safe for positive steady states.
 * Example: normaliseEquation(2*x^2*y − 4*x*y, all) = x − 2.
 */
export function normaliseEquation(p: QPoly, among: (k: number) => boolean): QPoly {
  if (p.coeffs.length === 0) return p;
  const ts = terms(p);
  const n = p.ring.n;
  const minExp = Array.from({ length: n }, (_, k) => (among(k) ? Math.min(...ts.map((t) => t.exponents[k])) : 0));
  const shifted = minExp.some((e) => e > 0)
    ? fromTerms(p.ring, ts.map((t) => ({ coeff: t.coeff, exponents: t.exponents.map((e, k) => e - minExp[k]) })))
    : p;
  return primitive(shifted);
}

/** Scales p to coprime integer coefficients with a positive leading coefficient. Example: primitive(−x/2 + 1/3) = 3x − 2. */
export function primitive(p: QPoly): QPoly {
  if (p.coeffs.length === 0) return p;
  let den = 1n;
  for (const c of p.coeffs) den = (den / gcdBig(den, c.den)) * c.den;
  let g = 0n;
  for (const c of p.coeffs) g = gcdBig(g, (c.num * den) / c.den);
  const sign = p.coeffs[0].num < 0n ? -1n : 1n;
  return scale(p, rational(sign * den, g));
}

export type SignPattern = "positive" | "negative" | "mixed" | "zero";

/** Whether every coefficient is positive, every one negative, or neither. Example: signPattern(x + 2y) = "positive". */
export function signPattern(p: QPoly): SignPattern {
  if (p.coeffs.length === 0) return "zero";
  const pos = p.coeffs.every((c) => c.num > 0n);
  if (pos) return "positive";
  return p.coeffs.every((c) => c.num < 0n) ? "negative" : "mixed";
}

/**
 * p with every factor f removed: divides by f while f divides exactly. The zero polynomial and
 * constant f are returned unchanged (0 is divisible by everything, so a loop "divide while
 * exact" never ends on 0: the cause of an endless analysis once). At most deg(p) divisions.
 * Example: divideOut((x − 1)^2·(x + 1), x − 1) = x + 1; divideOut(0, x − 1) = 0.
 */
export function divideOut(p: QPoly, f: QPoly): QPoly {
  if (p.coeffs.length === 0 || f.coeffs.length <= 1 && (f.coeffs.length === 0 || [...variablesOf(f)].length === 0)) return p;
  for (;;) {
    const q = exactQuotient(p, f);
    if (!q || q.coeffs.length === 0 || q.coeffs.length === p.coeffs.length && equalTerms(q, p)) return p;
    p = q;
  }
}

function equalTerms(a: QPoly, b: QPoly): boolean {
  if (a.coeffs.length !== b.coeffs.length) return false;
  for (let i = 0; i < a.exps.length; i++) if (a.exps[i] !== b.exps[i]) return false;
  return a.coeffs.every((c, i) => c.num === b.coeffs[i].num && c.den === b.coeffs[i].den);
}

/** p / q when q divides p exactly, else null. Example: exactQuotient(x^2 − y^2, x + y) = x − y. */
export function exactQuotient(p: QPoly, q: QPoly): QPoly | null {
  if (q.coeffs.length === 0) return null;
  if (p.coeffs.length === 0) return p;
  const { quotients, remainder } = divide(p, [q]);
  return remainder.coeffs.length === 0 ? quotients[0] : null;
}

/**
 * Numerator of p after substituting x_k = num/den and multiplying by den^deg_k(p):
 * Σ_j c_j · num^j · den^(d−j). Example: x^2 + y with x = y/z gives y^2 + y·z^2.
 */
export function substituteFraction(p: QPoly, k: number, num: QPoly, den: QPoly): { value: QPoly; power: number } {
  const cs = coefficientsIn(p, k);
  const d = cs.length - 1;
  if (d <= 0) return { value: p, power: 0 };
  let acc = p.ring.zero();
  for (let j = 0; j <= d; j++) {
    if (cs[j].coeffs.length === 0) continue;
    acc = addPoly(acc, mul(cs[j], mul(pow(num, j), pow(den, d - j))));
  }
  return { value: acc, power: d };
}

/**
 * Whether saturating by p can remove anything at positive points: a monomial, or a polynomial whose
 * coefficients all have one sign, never vanishes when every variable is positive, so saturating by
 * it only removes non-positive components and costs time. Example: x*(y + 2*z) needs none; x − y does.
 */
export function mayVanishAtPositivePoints(p: QPoly): boolean {
  return signPattern(p) === "mixed";
}
