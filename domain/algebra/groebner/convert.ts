import type { Field } from "../field";
import { isPrimeField } from "../field";
import type { Polynomial } from "../polynomial";
import type { Rational } from "../rational";
import { gcdBig } from "../rational";
import type { PolynomialRing } from "../ring";
import type { EngineCoefficients } from "./coefficients";
import { fieldCoefficients, primeCoefficients } from "./coefficients";
import type { EPoly } from "./reduce";

export const toEngine = <C>(p: Polynomial<C>): EPoly<C> => ({ coeffs: p.coeffs.slice(), exps: p.exps });
export const fromEngine = <C>(ring: PolynomialRing<C>, p: EPoly<C>): Polynomial<C> => ({ ring, coeffs: p.coeffs, exps: p.exps });

/** Engine arithmetic for a ring's field: specialised numbers for Z/p, the field itself otherwise. */
export function coefficientsFor<C>(F: Field<C>): EngineCoefficients<C> {
  if (isPrimeField(F)) return primeCoefficients(F.p) as unknown as EngineCoefficients<C>;
  return fieldCoefficients(F);
}

/** A rational polynomial times the lcm of its denominators: an integer polynomial (same monomials). */
export function clearDenominators(p: EPoly<Rational>): EPoly<bigint> {
  let l = 1n;
  for (const c of p.coeffs) l = (l / gcdBig(l, c.den)) * c.den;
  return { coeffs: p.coeffs.map((c) => c.num * (l / c.den)), exps: p.exps };
}

/** Integer polynomial scaled to be monic over Q; `tick` (a deadline check) runs between coefficients. */
export function monicRational(p: EPoly<bigint>, tick?: () => void): EPoly<Rational> {
  const lc = p.coeffs[0];
  return {
    coeffs: p.coeffs.map((c) => {
      tick?.();
      let num = c, den = lc;
      if (den < 0n) { num = -num; den = -den; }
      const g = gcdBig(num, den);
      return g === 1n ? { num, den } : { num: num / g, den: den / g };
    }),
    exps: p.exps,
  };
}
