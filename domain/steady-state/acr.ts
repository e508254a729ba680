import type { KineticsRing } from "./kinetics";
import type { ParametrisationResult } from "./parametrisation";
import { variablesOf } from "./poly-tools";
import { formatExpression } from "./rational-expression";

export interface AcrSpecies {
  readonly species: string;
  /** Its common value at every positive steady state, in the rate constants (text). */
  readonly value: string;
}

/**
 * Absolute concentration robustness (Shinar & Feinberg, "Structural sources of robustness in
 * biochemical reaction networks", Science 327, 2010): a species whose value is the same at every
 * positive steady state, whatever the totals. Read off the elimination: a species solved as a
 * function of the rate constants alone (no species left in its expression) is robust — the basis
 * then holds `species − value(rate constants)` after clearing the denominator.
 * Example: A + B -> 2B (k1), B -> A (k2) has ACR in A with value k2/k1.
 */
export function acrSpecies(kin: KineticsRing, param: ParametrisationResult): AcrSpecies[] {
  if (param.infeasible) return [];
  const isSpecies = (k: number) => k < kin.species.length;
  return param.eliminated
    .filter((e) => ![...variablesOf(e.expression.num), ...variablesOf(e.expression.den)].some(isSpecies))
    .map((e) => ({ species: e.species, value: formatExpression(e.expression) }))
    .sort((a, b) => kin.species.indexOf(a.species) - kin.species.indexOf(b.species));
}
