import { equals as equalsPoly, fromTerms, isZeroPoly, mul, scale, terms } from "../algebra/index";
import { div } from "../algebra/rational";
import type { QPoly } from "./kinetics";
import { exactQuotient, primitive, signPattern, substituteFraction } from "../algebra/poly-tools";

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
  const num = formatFactored(e.num, factors);
  const den = formatFactored(e.den, factors);
  if (den.text === "1") return num.text;
  // "5/8/E" would need the reader to know that / groups to the left: a numerator that is itself a
  // fraction is bracketed too.
  const wrappedNum = num.sum || num.text.includes("/") ? `(${num.text})` : num.text;
  // a/b*c would read as (a/b)*c, so a denominator is bare only when it is one variable or one integer.
  const bareDen = /^[A-Za-z_][A-Za-z0-9_]*$|^\d+$/.test(den.text);
  return `${wrappedNum}/${bareDen ? den.text : `(${den.text})`}`;
}

/** Monomial content · dividing factors · rest; `sum` tells whether the text is a bare sum needing parentheses. */
function formatFactored(p: QPoly, factors: readonly QPoly[]): { text: string; sum: boolean } {
  const ring = p.ring;
  if (p.coeffs.length <= 1) return { text: ring.format(p), sum: false };
  const ts = terms(p);
  const shift = Array.from({ length: ring.n }, (_, k) => Math.min(...ts.map((t) => t.exponents[k])));
  let rest = fromTerms(ring, ts.map((t) => ({ coeff: t.coeff, exponents: t.exponents.map((x, k) => x - shift[k]) })));
  const parts: string[] = [];
  const mono = fromTerms(ring, [{ coeff: { num: 1n, den: 1n }, exponents: shift }]);
  if (shift.some((x) => x > 0)) parts.push(ring.format(mono));
  const seen = new Set<string>();
  for (const f of factors) {
    if (f.coeffs.length <= 1) continue;
    const key = ring.format(primitive(f));
    if (seen.has(key)) continue;
    seen.add(key);
    const g = primitive(f);
    for (;;) {
      if (rest.coeffs.length <= 1 || equalsPoly(rest, g)) break;
      const q = exactQuotient(rest, g);
      if (!q) break;
      parts.push(`(${key})`);
      rest = q;
    }
  }
  if (parts.length === 0) return { text: ring.format(p), sum: true };
  const restText = ring.format(rest);
  if (restText === "-1") return { text: `-${parts.join("*")}`, sum: false };
  if (restText !== "1") parts.unshift(rest.coeffs.length > 1 ? `(${restText})` : restText);
  return { text: parts.join("*"), sum: false };
}

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
