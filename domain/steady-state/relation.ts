import { divide } from "../algebra/index";
import { QQ } from "../algebra/index";
import { groebnerBasis, type GroebnerOptions } from "../algebra/index";
import { fromTerms, mul, sub, terms } from "../algebra/index";
import { PolynomialRing } from "../algebra/index";
import { mapToRing, monomialOf, saturate } from "./ideal";
import type { KineticsRing, QPoly } from "./kinetics";

export interface RelationResult {
  readonly expression: string;
  /** The expression lies in the saturated steady-state ideal (remainder zero). */
  readonly inIdeal: boolean;
  /** It vanishes on every (complex) point of the saturated variety: radical membership. */
  readonly vanishes: boolean;
  /** Normal form modulo the saturated ideal's Gröbner basis ("0" when in the ideal). */
  readonly remainder: string;
}

/**
 * Relation test: does an expression in species and rate constants vanish at every positive steady
 * state? The steady-state ideal is saturated by the product of the species and of the rate symbols
 * (both positive), then ideal membership by the remainder of division by its Gröbner basis, and
 * radical membership by the Rabinowitsch trick: g ∈ √I ⇔ 1 ∈ I + ⟨1 − y·g⟩ (Cox, Little & O'Shea,
 * "Ideals, Varieties, and Algorithms", 4th ed. 2015, ch. 4 §2, Proposition 8). Membership does not
 * depend on the order, so grevlex (fast) is used.
 * Example: for A + B -> 2B (k1), B -> A (k2), the relation k1*A − k2 is in the ideal.
 */
export function testRelation(text: string, kin: KineticsRing, odeRows: readonly QPoly[], options: GroebnerOptions): RelationResult {
  const ring = kin.ring.withOrder("grevlex");
  const g = ring.parse(text);
  const params = kin.rateParameters.map((p) => ring.indexOf(p));
  const saturator = monomialOf(ring, [...kin.species.map((_, i) => i), ...params]);
  const basis = saturate(odeRows.map((p) => mapToRing(p, ring)), saturator, options);
  const remainder = basis.length > 0 ? divide(g, basis).remainder : g;
  const inIdeal = remainder.coeffs.length === 0;
  let vanishes = inIdeal;
  if (!inIdeal) {
    let y = "_y";
    while (ring.indexOf(y) >= 0) y = `_${y}`;
    const big = new PolynomialRing([...ring.vars, y], QQ, "grevlex");
    const lift = (p: QPoly) => fromTerms(big, terms(p).map((t) => ({ coeff: t.coeff, exponents: [...t.exponents, 0] })));
    const probe = groebnerBasis([...basis.map(lift), sub(big.one(), mul(big.variable(y), lift(g)))], options);
    vanishes = probe.length === 1 && probe[0].coeffs.length === 1 && probe[0].exps.every((e) => e === 0);
  }
  return { expression: ring.format(g), inIdeal, vanishes, remainder: ring.format(remainder) };
}
