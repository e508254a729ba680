import { type Rational, div as divQ, fromInt, mul as mulQ, ONE } from "../rational";
import { type IntPoly, type UPoly, derivative, subInt, toIntegerPrimitive, toRationalCoefficients } from "./dense";
import type { RunLimits } from "./budget";
import { divExactInt } from "./division";
import { UnivariateError } from "./errors";
import { gcd } from "./gcd";

/**
 * Square-free part: the product of the distinct irreducible factors, in integer primitive form.
 * Example: squareFreePart((x - 1)^2 (x + 2)) is x^2 + x - 2.
 * Classical p / gcd(p, p') over a field of characteristic 0 (common practice).
 */
export function squareFreePart(p: UPoly, limits?: RunLimits): IntPoly {
  const a = toIntegerPrimitive(p);
  if (a.length <= 1) return a;
  return divExactInt(a, gcd(a, derivative(a), limits));
}

/** One factor of a square-free factorisation with its multiplicity. */
export interface SquareFreeFactor {
  readonly factor: IntPoly;
  readonly multiplicity: number;
}

/**
 * Square-free factorisation p = constant · Π factor_i^multiplicity_i with the factors square-free,
 * pairwise coprime, of positive degree, integer primitive with positive leading coefficient, and
 * listed by increasing multiplicity.
 * Example: 2(x - 1)^2 (x + 2) gives constant 2 and factors [(x + 2, 1), (x - 1, 2)].
 * Follows Yun 1976, "On square-free decomposition algorithms" (SYMSAC '76).
 */
export function squareFreeFactorization(
  p: UPoly,
  limits?: RunLimits,
): { constant: Rational; factors: SquareFreeFactor[] } {
  const q = toRationalCoefficients(p);
  if (q.length === 0) throw new UnivariateError("zero-polynomial", "squareFreeFactorization: the zero polynomial has no factorisation");
  const a = toIntegerPrimitive(p);
  const factors: SquareFreeFactor[] = [];
  if (a.length > 1) {
    const da = derivative(a);
    const a0 = gcd(a, da, limits);
    // Quotients by primitive divisors stay integral (Gauss's lemma), so Yun runs over Z.
    let b = divExactInt(a, a0);
    let c = divExactInt(da, a0);
    let d = subInt(c, derivative(b));
    for (let i = 1; b.length > 1; i++) {
      const ai = gcd(b, d, limits);
      if (ai.length > 1) factors.push({ factor: ai, multiplicity: i });
      b = divExactInt(b, ai);
      c = divExactInt(d, ai);
      d = subInt(c, derivative(b));
    }
  }
  let leadOfProduct: Rational = ONE;
  for (const f of factors) leadOfProduct = mulQ(leadOfProduct, fromInt(f.factor[f.factor.length - 1] ** BigInt(f.multiplicity)));
  return { constant: divQ(q[q.length - 1], leadOfProduct), factors };
}
