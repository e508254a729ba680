import { fromTerms, leadingMonomial, terms } from "../algebra/index";
import { isNonZeroConstant } from "../algebra/poly-tools";
import type { KineticsRing, QPoly } from "./kinetics";

/** The highest species (ring order) in the leading monomial; null for an element in the parameters only. */
export function leadingSpecies(g: QPoly, kin: KineticsRing): string | null {
  const lm = leadingMonomial(g);
  for (let k = 0; k < kin.species.length; k++) if (lm[k] > 0) return kin.species[k];
  return null;
}

/**
 * The coefficient of the leading species monomial, a polynomial in the parameters: for parameter
 * values where it vanishes the basis need not specialise to a Gröbner basis (Cox, Little & O'Shea,
 * "Ideals, Varieties, and Algorithms", 4th ed. 2015, ch. 6 §3, and Kalkbrener 1997 on specialisation).
 * Example: for k1*x − k2 in Q[x, k1, k2] with species x it is k1.
 */
export function leadingCoefficientInSpecies(g: QPoly, kin: KineticsRing): QPoly {
  const ns = kin.species.length;
  const lm = leadingMonomial(g);
  const picked = terms(g)
    .filter((t) => t.exponents.slice(0, ns).every((e, k) => e === lm[k]))
    .map((t) => ({ coeff: t.coeff, exponents: t.exponents.map((e, k) => (k < ns ? 0 : e)) }));
  return fromTerms(g.ring, picked);
}

export interface TriangularBlock {
  /** Leading species, or null for the conditions on the parameters alone. */
  readonly species: string | null;
  readonly polynomials: readonly QPoly[];
}

/**
 * The lex basis grouped by leading species, from the last species (solved first) to the first:
 * the triangular form read bottom-up (Cox, Little & O'Shea, ch. 3 §1–2, the Extension Theorem).
 * Example: [y^2 − 2, x − y] (x > y) gives blocks y: [y^2 − 2], x: [x − y].
 */
export function triangularForm(basis: readonly QPoly[], kin: KineticsRing): TriangularBlock[] {
  const groups = new Map<string | null, QPoly[]>();
  for (const g of basis) {
    const s = leadingSpecies(g, kin);
    if (!groups.has(s)) groups.set(s, []);
    groups.get(s)!.push(g);
  }
  const rank = (s: string | null) => (s === null ? Infinity : kin.species.indexOf(s));
  return [...groups.entries()]
    .sort((a, b) => rank(b[0]) - rank(a[0]))
    .map(([species, polynomials]) => ({ species, polynomials }));
}

/** Non-constant leading coefficients (in the parameters) of the basis elements, deduplicated, as text. */
export function genericConditions(basis: readonly QPoly[], kin: KineticsRing): string[] {
  const out = new Set<string>();
  for (const g of basis) {
    const lc = leadingCoefficientInSpecies(g, kin);
    const isConstant = isNonZeroConstant(lc);
    if (!isConstant) out.add(kin.ring.format(lc));
  }
  return [...out];
}
