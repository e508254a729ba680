import type { NetworkStructure } from "../network/index";

/** The parts of an analysis that the consistency rules read. */
export interface ConsistencyInput {
  readonly structure: NetworkStructure;
  readonly steadyStates: readonly unknown[] | null;
  readonly steadyStateSet: "finite" | "continuum" | null;
  readonly positiveSteadyStatesExist: boolean | null;
  /** The class meets the positive orthant (all initial concentrations positive, or no conservation law). */
  readonly positiveClass: boolean;
  /** Rate constants are all numeric (theorems "for any positive rate constants" then apply to these). */
  readonly numericRates: boolean;
  /** The class's saturated steady-state ideal was proven zero-dimensional (no parameters left). */
  readonly zeroDimensionalBasis: boolean;
}

/**
 * Contradictions between an analysis and the theorems it cites; empty for a correct result. Each
 * rule is a theorem applied to what was computed:
 * - deficiency zero, weakly reversible ⇒ exactly one positive steady state in every positive class
 *   (Feinberg, "Chemical reaction network structure and the stability of complex isothermal
 *   reactors I", Chem. Eng. Sci. 42, 1987; Horn & Jackson 1972);
 * - deficiency zero, not weakly reversible ⇒ no positive steady state (same source);
 * - deficiency one theorem ⇒ at most one positive steady state per class, exactly one when weakly
 *   reversible (Feinberg, "The existence and uniqueness of steady states for a class of chemical
 *   reaction networks", Arch. Rational Mech. Anal. 132, 1995);
 * - a zero-dimensional basis ⇒ finitely many solutions (Cox, Little & O'Shea ch. 5 §3, Theorem 6),
 *   so never a continuum.
 * Example: a δ = 0 weakly reversible network reported with steadyStateSet "continuum" gives one problem.
 */
export function consistencyProblems(r: ConsistencyInput): string[] {
  const problems: string[] = [];
  const zero = r.structure.deficiencyZeroTheorem;
  const one = r.structure.deficiencyOneTheorem;
  const count = r.steadyStateSet === "finite" && r.steadyStates ? r.steadyStates.length : null;
  if (zero.applies && r.structure.weaklyReversible && r.numericRates && r.positiveClass) {
    if (r.steadyStateSet === "continuum") problems.push("deficiency zero theorem (weakly reversible): exactly one positive steady state per class, but the result reports a continuum");
    if (count !== null && count !== 1) problems.push(`deficiency zero theorem (weakly reversible): exactly one positive steady state per class, but the result lists ${count}`);
    if (r.positiveSteadyStatesExist === false) problems.push("deficiency zero theorem (weakly reversible): a positive steady state exists in every positive class, but the result says none exists");
  }
  if (zero.applies && !r.structure.weaklyReversible) {
    if (count !== null && count > 0) problems.push(`deficiency zero theorem (not weakly reversible): no positive steady state, but the result lists ${count}`);
    if (r.positiveSteadyStatesExist === true) problems.push("deficiency zero theorem (not weakly reversible): no positive steady state, but the result says one exists");
  }
  if (one.applies && r.numericRates && count !== null && count > 1)
    problems.push(`deficiency one theorem: at most one positive steady state per class, but the result lists ${count}`);
  if (one.applies && r.structure.weaklyReversible && r.numericRates && r.positiveClass && (count === 0 || r.steadyStateSet === "continuum"))
    problems.push("deficiency one theorem (weakly reversible): exactly one positive steady state per class, but the result reports " + (count === 0 ? "none" : "a continuum"));
  if (r.zeroDimensionalBasis && r.steadyStateSet === "continuum") problems.push("the class's basis is zero-dimensional (finitely many solutions), but the result reports a continuum");
  if (r.steadyStateSet === "finite" && r.steadyStates === null) problems.push("steadyStateSet is \"finite\" but no list of steady states is given");
  if (r.steadyStateSet === "continuum" && r.steadyStates !== null) problems.push("steadyStateSet is \"continuum\" but a list of steady states is given");
  if (count !== null && r.positiveSteadyStatesExist !== null && r.positiveSteadyStatesExist !== count > 0)
    problems.push(`positiveSteadyStatesExist is ${r.positiveSteadyStatesExist} but the complete list has ${count} state(s)`);
  return problems;
}
