import { equals as equalsPoly, fromTerms, isZeroPoly, mul, neg, scale, terms } from "../algebra/index";
import { polynomialTex } from "../algebra/format-tex";
import { div } from "../algebra/rational";
import type { QPoly } from "./kinetics";
import { exactQuotient, isNonZeroConstant, primitive, signPattern, substituteFraction, totalDegreeIn } from "../algebra/poly-tools";

/** A quotient of polynomials of the kinetics ring; den ≠ 0, den primitive with positive leading coefficient. */
export interface RationalExpression {
  readonly num: QPoly;
  readonly den: QPoly;
}

/**
 * Cancels the common monomial factor, any of the `candidates` that divide both parts (exactly, by
 * multivariate division), and normalises the denominator. No multivariate gcd is attempted: the
 * candidates are the factors introduced by the substitutions, which is where common factors come from.
 * Example: simplifyFraction(k1*k2*x, k2*k3*x^2 + k2*k4*x^2) is k1/(k3*x + k4*x) (the monomial k2·x cancels).
 */
export function simplifyFraction(num: QPoly, den: QPoly, candidates: readonly QPoly[] = []): RationalExpression {
  const ring = num.ring;
  // A zero denominator is the caller's to judge (a pivot that vanished); keep it visible.
  if (isZeroPoly(den)) return { num, den };
  if (isZeroPoly(num)) return { num, den: ring.one() };
  const tn = terms(num);
  const td = terms(den);
  const shift = Array.from({ length: ring.n }, (_, k) => Math.min(...tn.map((t) => t.exponents[k]), ...td.map((t) => t.exponents[k])));
  if (shift.some((e) => e > 0)) {
    num = fromTerms(ring, tn.map((t) => ({ coeff: t.coeff, exponents: t.exponents.map((e, k) => e - shift[k]) })));
    den = fromTerms(ring, td.map((t) => ({ coeff: t.coeff, exponents: t.exponents.map((e, k) => e - shift[k]) })));
  }
  for (const c of candidates) {
    if (c.coeffs.length <= 1) continue;
    for (;;) {
      const qd = exactQuotient(den, c);
      if (!qd) break;
      const qn = exactQuotient(num, c);
      if (!qn) break;
      num = qn;
      den = qd;
    }
  }
  const whole = den.coeffs.length > 1 ? exactQuotient(num, den) : null;
  if (whole) return { num: whole, den: ring.one() };
  const p = primitive(den);
  // primitive(den) = s·den, so num/den = (s·num)/primitive(den).
  const s = div(p.coeffs[0], den.coeffs[0]);
  return { num: scale(num, s), den: p };
}

/** True when numerator and denominator each have coefficients of one sign and the quotient is positive. */
export function isPositiveExpression(e: RationalExpression): boolean {
  const n = signPattern(e.num);
  const d = signPattern(e.den);
  return (n === "positive" && d === "positive") || (n === "negative" && d === "negative");
}

/**
 * Text in the CLI's polynomial syntax: `num`, `num/den` or `(num)/(den)`. With `factors` (e.g. the
 * elimination pivots), each part is written as monomial · product of the factors that divide it ·
 * rest, which keeps enzyme-kinetics expressions readable.
 * Example: (k1*k3*k11*S0*E + k1*k3*k12*S0*E)/(k2 + k3) with factor k11 + k12 prints
 * S0*E*k1*k3*(k11 + k12)/(k2 + k3).
 */
export function formatExpression(e: RationalExpression, factors: readonly QPoly[] = []): string {
  const num = factoredText(factorise(e.num, factors));
  const den = factoredText(factorise(e.den, factors));
  if (den.text === "1") return num.text;
  // "5/8/E" would need the reader to know that / groups to the left: a numerator that is itself a
  // fraction is bracketed too.
  const wrappedNum = num.sum || num.text.includes("/") ? `(${num.text})` : num.text;
  // a/b*c would read as (a/b)*c, so a denominator is bare only when it is one variable or one integer.
  const bareDen = /^[A-Za-z_][A-Za-z0-9_]*$|^\d+$/.test(den.text);
  return `${wrappedNum}/${bareDen ? den.text : `(${den.text})`}`;
}

/**
 * The same expression in TeX, written with the same factors: `\frac{num}{den}` (or the numerator
 * alone over 1), each part as rest · monomial · (factor)… like the text.
 * Example: (k1*S0*E)/(k2 + k3) gives `\frac{\mathrm{S0}\cdot\mathrm{E}\cdot\mathrm{k1}}{\mathrm{k2}+\mathrm{k3}}`.
 */
export function expressionTex(e: RationalExpression, factors: readonly QPoly[] = []): string {
  const num = factoredTex(factorise(e.num, factors));
  if (isOne(e.den)) return num;
  return `\\frac{${num}}{${factoredTex(factorise(e.den, factors))}}`;
}

/**
 * Total degree in the variables `among` of the numerator or the denominator, whichever is larger
 * (the usual degree of a rational function). Example: S0·E²·k1/(F·l3) in S0, E, F has degree 3.
 */
export function expressionDegree(e: RationalExpression, among: readonly number[]): number {
  return Math.max(0, totalDegreeIn(e.num, among), totalDegreeIn(e.den, among));
}

/**
 * The variables (species and parameters) the expression depends on, in the ring's order: those
 * with a nonzero exponent in the numerator or the denominator. Example: k1*A/(k2 + A) in a ring
 * A, k1, k2 gives [A, k1, k2].
 */
export function expressionVariables(e: RationalExpression): string[] {
  const ring = e.num.ring, S = ring.n + 1;
  const used = new Array<boolean>(ring.n).fill(false);
  for (const p of [e.num, e.den])
    for (let t = 0; t < p.coeffs.length; t++) for (let k = 0; k < ring.n; k++) if (p.exps[t * S + 1 + k] !== 0) used[k] = true;
  return ring.vars.filter((_, k) => used[k]);
}

/**
 * A polynomial as written: either whole (`sum` when it is a bare sum that needs parentheses in a
 * product), or rest · monomial content · the dividing factors in the order found.
 */
type Factored =
  | { readonly kind: "whole"; readonly poly: QPoly; readonly sum: boolean }
  | { readonly kind: "product"; readonly rest: QPoly; readonly mono: QPoly | null; readonly factors: readonly QPoly[] };

function factorise(p: QPoly, factors: readonly QPoly[]): Factored {
  const ring = p.ring;
  if (p.coeffs.length <= 1) return { kind: "whole", poly: p, sum: false };
  const ts = terms(p);
  const shift = Array.from({ length: ring.n }, (_, k) => Math.min(...ts.map((t) => t.exponents[k])));
  let rest = fromTerms(ring, ts.map((t) => ({ coeff: t.coeff, exponents: t.exponents.map((x, k) => x - shift[k]) })));
  const mono = shift.some((x) => x > 0) ? fromTerms(ring, [{ coeff: { num: 1n, den: 1n }, exponents: shift }]) : null;
  const found: QPoly[] = [];
  const seen = new Set<string>();
  for (const f of factors) {
    if (f.coeffs.length <= 1) continue;
    const g = primitive(f);
    const key = ring.format(g);
    if (seen.has(key)) continue;
    seen.add(key);
    for (;;) {
      if (rest.coeffs.length <= 1 || equalsPoly(rest, g)) break;
      const q = exactQuotient(rest, g);
      if (!q) break;
      found.push(g);
      rest = q;
    }
  }
  if (!mono && found.length === 0) return { kind: "whole", poly: p, sum: true };
  return { kind: "product", rest, mono, factors: found };
}

/** The text of a factored polynomial; `sum` tells whether it is a bare sum needing parentheses. */
function factoredText(f: Factored): { text: string; sum: boolean } {
  if (f.kind === "whole") return { text: f.poly.ring.format(f.poly), sum: f.sum };
  const parts = [...(f.mono ? [f.mono.ring.format(f.mono)] : []), ...f.factors.map((g) => `(${g.ring.format(g)})`)];
  const restText = f.rest.ring.format(f.rest);
  if (restText === "-1") return { text: `-${parts.join("*")}`, sum: false };
  if (restText !== "1") parts.unshift(f.rest.coeffs.length > 1 ? `(${restText})` : restText);
  return { text: parts.join("*"), sum: false };
}

/** The TeX of a factored polynomial, factor for factor as factoredText writes it. */
function factoredTex(f: Factored): string {
  if (f.kind === "whole") return polynomialTex(f.poly);
  const parts = [...(f.mono ? [polynomialTex(f.mono)] : []), ...f.factors.map((g) => `\\left(${polynomialTex(g)}\\right)`)];
  if (isOne(f.rest)) return parts.join("\\cdot");
  if (isOne(neg(f.rest))) return `-${parts.join("\\cdot")}`;
  // A number leads with a thin space (2\,x); a sum is bracketed.
  if (f.rest.coeffs.length > 1) return [`\\left(${polynomialTex(f.rest)}\\right)`, ...parts].join("\\cdot");
  const restTex = polynomialTex(f.rest);
  return isNonZeroConstant(f.rest) ? `${restTex}\\,${parts.join("\\cdot")}` : [restTex, ...parts].join("\\cdot");
}

const isOne = (p: QPoly) => isNonZeroConstant(p) && p.coeffs[0].num === 1n && p.coeffs[0].den === 1n;

/**
 * Substitutes x_k = num/den into a rational expression, clearing the powers of den on both parts.
 * Example: (x + 1)/y with x = y/z gives (y + z)/(y·z).
 */
export function composeExpression(e: RationalExpression, k: number, num: QPoly, den: QPoly, candidates: readonly QPoly[] = []): RationalExpression {
  const pn = substituteFraction(e.num, k, num, den);
  const pd = substituteFraction(e.den, k, num, den);
  const p = Math.max(pn.power, pd.power);
  let sn = pn.value;
  let sd = pd.value;
  for (let i = pn.power; i < p; i++) sn = mul(sn, den);
  for (let i = pd.power; i < p; i++) sd = mul(sd, den);
  return simplifyFraction(sn, sd, [...candidates, den]);
}
