import { isZeroPoly, mul } from "../algebra/index";
import { type Budget, isOutOfBudget } from "./budget";
import { monomialOf, saturate } from "./ideal";
import type { KineticsRing, QPoly } from "./kinetics";
import { type EliminatedSpecies, linearElimination } from "./linear-elimination";
import { degreeIn, mayVanishAtPositivePoints, variablesOf, isNonZeroConstant } from "../algebra/poly-tools";
import { type RationalExpression, composeExpression, isPositiveExpression } from "./rational-expression";

export interface Parametrisation {
  /** Free species (with the rate constants, the only inputs). */
  readonly free: readonly string[];
  /** Every other species as a rational function of the free species and rate constants, in ring order. */
  readonly expressions: readonly { species: string; expression: RationalExpression }[];
  /** Every numerator and denominator has coefficients of one sign: positive inputs give positive outputs. */
  readonly positive: boolean;
}

export interface ParametrisationResult {
  readonly parametrisation: Parametrisation | null;
  /** Eliminated species as functions of `unknowns` (all of them when a parametrisation exists). */
  readonly eliminated: readonly EliminatedSpecies[];
  /** Species not eliminated (the free species when a parametrisation exists). */
  readonly unknowns: readonly string[];
  /** Equations left in the unknowns (empty when a parametrisation exists). */
  readonly remaining: readonly QPoly[];
  /** When no rational parametrisation was found: which species need roots of which polynomial. */
  readonly rootsNeeded: readonly { species: string; polynomial: QPoly; degree: number }[];
  /** Polynomials that must not vanish (pivots of the eliminations). */
  readonly pivots: readonly QPoly[];
  readonly infeasible: string | null;
  /** False when the Gröbner step after linear elimination ran out of budget. */
  readonly complete: boolean;
  readonly notes: string[];
}

/**
 * Parametrisation of the positive steady states by a few free species and the rate constants:
 * linear elimination first (Feliu & Wiuf 2012; Thomson & Gunawardena 2009), then — only if
 * equations remain — a lex Gröbner basis of what remains, saturated by the remaining species and
 * the elimination pivots, and a second round of linear elimination on that basis. Totals never
 * enter: the equations are the independent ODE rows only, so one parametrisation serves every class.
 * Example: A <-> B (k1, k2) in the order B, A gives free [A] and B = k1*A/k2 (positive); for E + S <-> C -> E + P it reports
 * that no positive steady state exists (dS/dt + dC/dt = −k3·C < 0 once C is eliminated).
 */
export function computeParametrisation(
  kin: KineticsRing,
  odeRows: readonly QPoly[],
  budget: Budget,
  options: { definitePivotsOnly?: boolean } = {},
): ParametrisationResult {
  const ring = kin.ring;
  const notes: string[] = [];
  budget.progress("linear-elimination", "eliminating species that enter linearly");
  const first = linearElimination(kin, odeRows, { check: () => budget.check("linear elimination"), ...options });
  const pivots = first.eliminated.map((e) => e.pivot);
  if (first.eliminated.length > 0)
    notes.push(`Linear elimination (Feliu & Wiuf 2012) solved ${first.eliminated.map((e) => e.species).join(", ")}.`);
  if (first.infeasible)
    return { parametrisation: null, eliminated: first.eliminated, unknowns: first.remainingSpecies, remaining: first.remaining, rootsNeeded: [], pivots, infeasible: first.infeasible, complete: true, notes };
  let eliminated = [...first.eliminated];
  let unknowns = first.remainingSpecies;
  let remaining = first.remaining;
  let infeasible: string | null = null;
  if (remaining.length > 0) {
    budget.progress("parametrisation", `lex Gröbner basis of the ${remaining.length} remaining equations`);
    const speciesIdx = unknowns.map((s) => ring.indexOf(s));
    let sat = monomialOf(ring, speciesIdx);
    // Pivots of one sign cannot vanish at positive points: saturating by them would only cost time.
    for (const p of pivots) if ([...variablesOf(p)].some((k) => k < kin.species.length) && mayVanishAtPositivePoints(p)) sat = mul(sat, p);
    let basis: QPoly[];
    try {
      basis = saturate(remaining, sat, budget.groebner(0.35));
    } catch (e) {
      if (!isOutOfBudget(e)) throw e;
      // Keep what linear elimination found: the numeric solver can still work from it.
      notes.push(`The lex Gröbner basis of the ${remaining.length} equation(s) left after linear elimination was not finished (${(e as Error).message}); no parametrisation.`);
      const rootsNeeded: ParametrisationResult["rootsNeeded"] = [];
      return { parametrisation: null, eliminated, unknowns, remaining, rootsNeeded, pivots, infeasible: null, complete: false, notes };
    }
    notes.push(`A lex Gröbner basis of the remaining ${remaining.length} equation(s), saturated by the species product and the pivots, has ${basis.length} element(s).`);
    const second = linearElimination(kin, basis, { check: () => budget.check("linear elimination"), ...options });
    if (second.infeasible)
      // Decided before composing: the later solutions may lie where an earlier pivot vanishes.
      return { parametrisation: null, eliminated, unknowns, remaining: second.remaining, rootsNeeded: [], pivots, infeasible: second.infeasible, complete: true, notes };
    let composed = eliminated;
    let degenerate: string | null = null;
    for (const later of second.eliminated) {
      const k = ring.indexOf(later.species);
      composed = composed.map((e) => ({ ...e, expression: composeExpression(e.expression, k, later.expression.num, later.expression.den, [...pivots, ...second.eliminated.map((x) => x.pivot)]) }));
      const vanished = composed.find((e) => isZeroPoly(e.expression.den));
      if (vanished) {
        degenerate = `substituting ${later.species} makes the denominator of ${vanished.species} vanish on the remaining solutions`;
        break;
      }
    }
    if (degenerate) {
      // The earlier expression becomes 0/0 there, not infeasible: keep the first round's
      // elimination and the saturated basis as the equations left in its unknowns.
      notes.push(`No rational parametrisation: ${degenerate}; the ${basis.length} basis polynomial(s) stay as equations in ${unknowns.join(", ")}.`);
      remaining = basis;
    } else {
      pivots.push(...second.eliminated.map((e) => e.pivot));
      eliminated = [...composed, ...second.eliminated];
      unknowns = second.remainingSpecies.filter((s) => first.remainingSpecies.includes(s));
      remaining = second.remaining;
    }
    if (basis.length === 1 && isNonZeroConstant(basis[0]))
      infeasible = "the saturated steady-state ideal is the whole ring: no positive steady state (for generic parameter values)";
  }
  const rootsNeeded = remaining
    .filter((p) => !isZeroPoly(p))
    .map((p) => {
      const k = Math.min(...[...variablesOf(p)].filter((i) => i < kin.species.length));
      return { species: ring.vars[k], polynomial: p, degree: degreeIn(p, k) };
    });
  const order = new Map(kin.species.map((s, i) => [s, i]));
  const parametrisation =
    remaining.length === 0 && !infeasible
      ? {
          free: unknowns,
          expressions: eliminated
            .map((e) => ({ species: e.species, expression: e.expression }))
            .sort((a, b) => order.get(a.species)! - order.get(b.species)!),
          positive: eliminated.every((e) => isPositiveExpression(e.expression)),
        }
      : null;
  return { parametrisation, eliminated, unknowns, remaining, rootsNeeded, pivots, infeasible, complete: true, notes };
}
