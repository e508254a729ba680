import { fromTerms, isZeroPoly, mul, scale, terms } from "../algebra/index";
import { div } from "../algebra/rational";
import type { QPoly } from "./kinetics";
import { exactQuotient, primitive, signPattern, substituteFraction } from "./poly-tools";

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

/** Text in the CLI's polynomial syntax: `num` or `(num)/(den)`, parentheses only where needed. */
export function formatExpression(e: RationalExpression): string {
  const ring = e.num.ring;
  const num = ring.format(e.num);
  if (e.den.coeffs.length === 1 && e.den.coeffs[0].num === 1n && e.den.coeffs[0].den === 1n && e.den.exps.every((x) => x === 0))
    return num;
  const den = ring.format(e.den);
  const wrappedNum = e.num.coeffs.length > 1 ? `(${num})` : num;
  // a/b*c would read as (a/b)*c, so a denominator is bare only when it is one variable or one integer.
  const bareDen = /^[A-Za-z_][A-Za-z0-9_]*$|^\d+$/.test(den);
  return `${wrappedNum}/${bareDen ? den : `(${den})`}`;
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
