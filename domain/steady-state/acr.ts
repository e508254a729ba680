import { type GroebnerOptions, PolynomialRing, QQ, neg } from "../algebra/index";
import { mapToRing, monomialOf, saturate } from "./ideal";
import type { KineticsRing, QPoly } from "./kinetics";
import type { ParametrisationResult } from "./parametrisation";
import { coefficientsIn, degreeIn, variablesOf } from "../algebra/poly-tools";
import { formatExpression, simplifyFraction, type RationalExpression } from "./rational-expression";

export interface AcrSpecies {
  readonly species: string;
  /** Its common value at every positive steady state, in the rate constants (text). */
  readonly value: string;
}

/** An ACR species with its value as an exact expression, and the factors to write it with (the pivots). */
export interface AcrFinding {
  readonly species: string;
  readonly value: RationalExpression;
  readonly factors: readonly QPoly[];
}

/** The finding as the result reports it: the value as text. */
export function acrText(f: AcrFinding): AcrSpecies {
  return { species: f.species, value: formatExpression(f.value, f.factors) };
}

/**
 * Absolute concentration robustness (Shinar & Feinberg, "Structural sources of robustness in
 * biochemical reaction networks", Science 327, 2010): a species whose value is the same at every
 * positive steady state, whatever the totals. Read off the elimination: a species solved as a
 * function of the rate constants alone (no species left in its expression) is robust — the basis
 * then holds `species − value(rate constants)` after clearing the denominator.
 * Example: A + B -> 2B (k1), B -> A (k2) has ACR in A with value k2/k1.
 */
export function acrSpecies(kin: KineticsRing, param: ParametrisationResult): AcrFinding[] {
  if (param.infeasible) return [];
  const isSpecies = (k: number) => k < kin.species.length;
  return param.eliminated
    .filter((e) => ![...variablesOf(e.expression.num), ...variablesOf(e.expression.den)].some(isSpecies))
    .map((e) => ({ species: e.species, value: e.expression, factors: param.pivots }))
    .sort((a, b) => kin.species.indexOf(a.species) - kin.species.indexOf(b.species));
}

/**
 * ACR test for one species by a Gröbner basis, for species the elimination left undecided: in the
 * block order (other species, grevlex) > x > (parameters), the saturated ideal of the steady-state
 * equations (no totals) contains a(k)·x − b(k) exactly when all positive steady states share
 * x = b/a for generic parameters (elimination theorem, Cox, Little & O'Shea ch. 3 §1; Shinar & Feinberg 2010).
 * Example: for A + B -> 2B (k1), B -> A (k2) and x = A it finds k1*A − k2.
 */
export function acrByGroebner(kin: KineticsRing, odeRows: readonly QPoly[], species: string, options: GroebnerOptions): AcrFinding | null {
  const ns = kin.species.length;
  const others = kin.species.filter((s) => s !== species);
  const params = kin.ring.vars.slice(ns);
  // Only the other species need eliminating: grevlex on them is an elimination order for the block
  // and much cheaper than lex on all species (Cox, Little & O'Shea ch. 3 §1, Exercise 6, elimination orders).
  const order = [
    ...(others.length > 0 ? [{ kind: "grevlex" as const, size: others.length }] : []),
    { kind: "lex" as const, size: 1 },
    ...(params.length > 0 ? [{ kind: "grevlex" as const, size: params.length }] : []),
  ];
  const ring = new PolynomialRing([...others, species, ...params], QQ, order);
  const x = ns - 1;
  const sat = monomialOf(ring, kin.species.map((_, i) => i));
  const basis = saturate(odeRows.map((p) => mapToRing(p, ring)), sat, options);
  for (const g of basis) {
    const vars = [...variablesOf(g)].filter((k) => k < ns);
    if (vars.length !== 1 || vars[0] !== x || degreeIn(g, x) !== 1) continue;
    const [b, a] = coefficientsIn(g, x);
    return { species, value: simplifyFraction(neg(b), a), factors: [] };
  }
  return null;
}
