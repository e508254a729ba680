import { AlgebraError } from "../algebra/index";
import type { Rational } from "../algebra/index";
import { analyseStructure, type NetworkStructure } from "../network/index";
import type { Network } from "../network/index";
import { acrByGroebner, acrSpecies, type AcrSpecies } from "./acr";
import { Budget, type BudgetOptions, isOutOfBudget } from "./budget";
import { monomialOf, saturate } from "./ideal";
import { kineticsRing, type QPoly } from "./kinetics";
import { numericSteadyStates, steadyStatesFromBasis, type NumericSteadyState } from "./numeric-steady-states";
import { defaultOrder, resolveOrder, SteadyStateInputError } from "./order";
import { computeParametrisation } from "./parametrisation";
import { testRelation, type RelationResult } from "./relation";
import { steadyStateSystem, totalsFromInitial } from "./system";
import { genericConditions, leadingSpecies } from "./triangular";
import { assemble } from "./analyse-result";
import { signPattern, isNonZeroConstant } from "../algebra/poly-tools";

export interface AnalyseOptions extends BudgetOptions {
  /** Elimination order: species eliminated first … species kept free last (partial lists allowed). */
  readonly order?: readonly string[];
  /** Initial concentrations (unlisted species are 0); give them for numeric steady states. */
  readonly initial?: ReadonlyMap<string, Rational>;
  /** Expressions in species and rate constants to test at the positive steady states. */
  readonly relations?: readonly string[];
  /**
   * Skip the full lex basis of the steady-state system with totals (default false). Without it the
   * basis is computed only where it is the answer or the quickest route to one: no parametrisation
   * was found, or the steady states of a numeric class are wanted (see `fullBasis`).
   */
  readonly skipFullBasis?: boolean;
  /** Compute the full lex basis even when a parametrisation already describes the steady states. */
  readonly fullBasis?: boolean;
  /**
   * Called after each stage from the parametrisation on with the result so far: the stages not yet
   * run are in `unfinished` with the reason NOT_REACHED. A run stopped from outside (cancelled, or
   * killed at its time limit) keeps the last one.
   */
  readonly onPartial?: (partial: SteadyStateAnalysis) => void;
}

/** The reason given for a stage a partial result had not finished (the run was stopped from outside). */
export const NOT_REACHED = "not finished: the run stopped before or during this stage";

export type AnalysisStage = "parametrisation" | "groebner" | "steady-states" | "acr" | "relations";

/** A phase that ran out of time or size (or, in a partial result, was not reached): which stage, and why. */
export interface UnfinishedStage {
  readonly stage: AnalysisStage;
  readonly reason: string;
}

/** Plain, JSON-friendly result; the structure part is the network layer's own analysis. */
export interface SteadyStateAnalysis {
  readonly structure: NetworkStructure;
  readonly order: { readonly species: string[]; readonly suggested: string[]; readonly reason: string; readonly userGiven: boolean };
  readonly parameters: { readonly rateConstants: string[]; readonly totals: string[]; readonly values: Record<string, string> };
  /** Mass-action right-hand sides, one per species (network order). */
  readonly odes: { readonly species: string; readonly rhs: string }[];
  /** The square steady-state system: kept ODE rows and conservation equations. */
  readonly steadyStateSystem: { readonly equations: string[]; readonly replacedRows: string[] };
  /** Reduced lex basis of the saturated steady-state ideal (with totals), or null when skipped or out of budget. */
  readonly groebnerBasis: string[] | null;
  /** "complete"; "skipped" (a parametrisation answers; ask with fullBasis); "unfinished" (out of budget). */
  readonly groebnerBasisStatus: "complete" | "skipped" | "unfinished";
  readonly ordering: string;
  readonly genericConditions: string[];
  readonly triangularForm: { readonly species: string | null; readonly polynomials: string[] }[];
  readonly parametrisation: {
    readonly free: string[];
    readonly expressions: Record<string, string>;
    readonly positive: boolean;
    /** The species whose expression has numerator and denominator of one sign each (positive for positive inputs). */
    readonly positiveSpecies: string[];
  } | null;
  readonly rootsNeeded: { readonly species: string; readonly polynomial: string; readonly degree: number }[];
  readonly nonVanishing: string[];
  readonly acr: AcrSpecies[];
  readonly relations: RelationResult[];
  /**
   * Every positive steady state of the class (numeric rate constants; the class is given by the
   * initial concentrations, or is the whole space when there is no conservation law), or null when
   * none are listed; `steadyStatesReason` then says why.
   */
  readonly steadyStates: NumericSteadyState[] | null;
  readonly steadyStatesReason: string | null;
  readonly eliminant: { readonly variable: string; readonly polynomial: string } | null;
  /**
   * "finite": the class has finitely many positive steady states and steadyStates lists them all
   * (maybe none); "continuum": the class's saturated steady-state ideal has positive dimension
   * (proven from a Gröbner basis), so there is no finite list; null: not decided (no class, symbolic
   * constants, or out of budget).
   */
  readonly steadyStateSet: "finite" | "continuum" | null;
  /**
   * true: a positive steady state exists (in the class when one is given, else for some totals);
   * false: none exists (for these constants, or for any positive constants when infeasibility was proven);
   * null: not decided. `positiveSteadyStatesReason` says which argument decided it.
   */
  readonly positiveSteadyStatesExist: boolean | null;
  readonly positiveSteadyStatesReason: string | null;
  /** Phases that ran out of time or size, in the order they ran; the result holds what was finished. */
  readonly unfinished: UnfinishedStage[];
  /** Contradictions between the result and the theorems it cites (always empty unless there is a bug). */
  readonly contradictions: string[];
  readonly warnings: string[];
}

/**
 * The whole steady-state analysis of a network, pure and budgeted (safe for a web worker):
 * structure; mass-action ODEs; steady-state system with conservation equations; parametrisation
 * by linear elimination first (Feliu & Wiuf 2012) and lex bases only on what remains; the lex
 * basis of the saturated ideal in a block order with its generic-parameter conditions and
 * triangular form; ACR species (Shinar & Feinberg 2010); relation tests; and, with initial
 * concentrations, every positive steady state of the class with its stability.
 * Phases that run out of time or size become warnings; cancellation (AbortSignal) throws.
 *
 * Example: analyseNetwork(parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n")).parametrisation
 * is { free: ["B"], expressions: { A: "B*k2/k1" }, positive: true }.
 */
export function analyseNetwork(network: Network, options: AnalyseOptions = {}): SteadyStateAnalysis {
  const budget = new Budget(options);
  const warnings: string[] = [];
  const unfinished: UnfinishedStage[] = [];
  const ranOut = (stage: UnfinishedStage["stage"], e: unknown) => unfinished.push({ stage, reason: (e as Error).message });

  // Stage: structure and the steady-state system without totals.
  budget.progress("structure", "structure of the network");
  const structure = analyseStructure(network);
  warnings.push(...structure.warnings);
  const suggested = defaultOrder(network, structure.conservationLaws);
  const species = options.order ? resolveOrder(options.order, suggested.order) : suggested.order;
  if (options.initial)
    for (const s of options.initial.keys())
      if (!network.species.includes(s)) throw new SteadyStateInputError(`--initial: '${s}' is not a species of the network (species: ${network.species.join(", ")})`);
  const laws = structure.conservationLaws.map((law) => network.species.map((s) => BigInt(law[s] ?? 0)));
  const kin = kineticsRing(network, { speciesOrder: species });
  const noTotals = steadyStateSystem(network, kin, laws, null);
  const odeRows = noTotals.keptRows.map((i) => noTotals.odes[i]);
  const fmt = (p: Parameters<typeof kin.ring.format>[0]) => kin.ring.format(p);
  warnings.push(
    "Only positive steady states are analysed: the steady-state ideal is saturated by the product of the species, which removes every solution with a zero concentration.",
  );

  // The class: fixed by the initial concentrations, or the whole space when nothing is conserved
  // (an open network's steady states do not depend on where it starts).
  const numericRates = kin.rateParameters.length === 0;
  const totals = options.initial ? totalsFromInitial(laws, network.species, options.initial) : laws.length === 0 ? [] : null;
  const classGiven = totals !== null;
  const numericClass = classGiven && numericRates;
  const kinT = totals ? kin : kineticsRing(network, { speciesOrder: species, totalCount: laws.length });
  const withTotals = steadyStateSystem(network, kinT, laws, totals);

  // What the stages produce, declared up front so a partial result can be assembled after any of them.
  let basis: QPoly[] | null = null;
  let basisStatus: SteadyStateAnalysis["groebnerBasisStatus"] = "skipped";
  let wholeRing = false;
  let steadyStates: NumericSteadyState[] | null = null;
  let steadyStatesReason: string | null = null;
  let eliminant: SteadyStateAnalysis["eliminant"] = null;
  let steadyStateSet: SteadyStateAnalysis["steadyStateSet"] = null;
  let zeroDimensionalBasis = false;
  let positivePoint: Record<string, number> | null = null;
  let acr: AcrSpecies[] = [];
  const relations: RelationResult[] = [];
  let param: ReturnType<typeof computeParametrisation> | null = null;
  // The stages still to run, for partial results.
  // Before the parametrisation only the stages that surely follow are known; the plan is settled after it.
  let plan: AnalysisStage[] = [
    "parametrisation",
    ...(numericRates && classGiven ? (["steady-states"] as const) : []),
    ...((options.relations ?? []).length > 0 ? (["relations"] as const) : []),
  ];
  const planAfterParametrisation = (wantBasis: boolean): AnalysisStage[] => [
    ...(withTotals.equations.length > 0 && wantBasis ? (["groebner"] as const) : []),
    ...(numericRates && classGiven && !param?.infeasible ? (["steady-states"] as const) : []),
    ...(param && param.complete && !param.parametrisation && !param.infeasible && param.unknowns.length > 0 ? (["acr"] as const) : []),
    ...((options.relations ?? []).length > 0 ? (["relations"] as const) : []),
  ];
  const snapshot = (done: AnalysisStage | null): SteadyStateAnalysis => {
    const pending = done === null ? plan : plan.slice(plan.indexOf(done) + 1);
    return assemble({
      network, options, structure, species, suggested, kin, kinT, noTotals, withTotals, laws, numericRates, classGiven, basis, basisStatus, param,
      wholeRing, acr, relations, steadyStates, steadyStatesReason, eliminant, steadyStateSet, zeroDimensionalBasis, positivePoint,
      unfinished: [...unfinished, ...pending.filter((st) => !unfinished.some((u) => u.stage === st)).map((stage) => ({ stage, reason: NOT_REACHED }))],
      warnings: [...warnings],
    });
  };
  const partial = (done: AnalysisStage | null) => {
    // Only while some stage is still to come: after the last one the result itself follows.
    const left = done === null ? plan.length : plan.length - 1 - plan.indexOf(done);
    if (options.onPartial && left > 0) options.onPartial(snapshot(done));
  };
  // The structure, ODEs and steady-state system are in: the first partial result.
  partial(null);
  // Stage: parametrisation (no totals: one parametrisation serves every class).
  try {
    param = computeParametrisation(kin, odeRows, budget);
    if (param.infeasible) warnings.push(`No positive steady state: ${param.infeasible}.`);
    if (!param.complete) unfinished.push({ stage: "parametrisation", reason: "the lex Gröbner basis after linear elimination was not finished" });
  } catch (e) {
    if (!isOutOfBudget(e)) throw e;
    ranOut("parametrisation", e);
    warnings.push(`Parametrisation not finished: ${(e as Error).message}.`);
  }

  const wantBasis = !options.skipFullBasis && (options.fullBasis === true || numericClass || !param?.parametrisation);
  plan = ["parametrisation", ...planAfterParametrisation(wantBasis)];
  partial("parametrisation");

  // Stage: full lex basis, only where it is the answer (no parametrisation), the route to a numeric
  // class's steady states, or asked for.
  if (withTotals.equations.length === 0) {
    basis = [];
    basisStatus = "complete";
  } else if (wantBasis) {
    try {
      budget.progress("groebner", "lex Gröbner basis of the saturated steady-state ideal");
      basis = saturate(withTotals.equations, monomialOf(kinT.ring, kinT.species.map((_, i) => i)), budget.groebner(0.25));
      basisStatus = "complete";
    } catch (e) {
      if (!isOutOfBudget(e)) throw e;
      basisStatus = "unfinished";
      ranOut("groebner", e);
      warnings.push(
        `The lex Gröbner basis of the full steady-state system was not finished within the budget (${(e as Error).message}); ` +
          (param?.parametrisation ? "the parametrisation from linear elimination describes the steady states instead." : "try another order or fewer symbolic constants."),
      );
    }
  } else if (!options.skipFullBasis)
    warnings.push("The full lex Gröbner basis was not computed: the parametrisation from linear elimination already describes every positive steady state (ask for the full basis to see it).");
  if (plan.includes("groebner")) partial("groebner");
  const conditions = basis ? genericConditions(basis, kinT) : [];
  if (conditions.length > 0)
    warnings.push(`The basis holds for generic parameter values: these leading coefficients must not vanish: ${conditions.join("; ")} (one with all coefficients of one sign never vanishes for positive parameters).`);

  wholeRing = basis !== null && basis.length === 1 && isNonZeroConstant(basis[0]);
  const parameterOnly = basis && !wholeRing ? basis.filter((g) => leadingSpecies(g, kinT) === null) : [];
  if (wholeRing) warnings.push("The saturated steady-state ideal is the whole ring (its basis is [1]): there is no positive steady state.");
  if (parameterOnly.length > 0)
    warnings.push(
      `The saturated ideal contains polynomials in the parameters alone (${parameterOnly.map((g) => kinT.ring.format(g)).join("; ")}): for parameter values where they do not vanish there is no positive steady state.`,
    );

  // Stage: the positive steady states of the class.
  if (!numericRates) {
    const heldSymbolic = (network.constants ?? []).some((c) => kin.rateParameters.includes(c.name));
    steadyStatesReason = `Listing steady states needs a value for every rate constant${heldSymbolic ? " and constant species" : ""}; missing: ${kin.rateParameters.join(", ")}.`;
    if (options.initial) warnings.push(steadyStatesReason);
  } else if (!classGiven) {
    steadyStatesReason = `The steady states depend on the totals of the conservation laws (${structure.conservationLaws.map(lawText).join("; ")}): give the initial concentrations to fix them.`;
  } else if (param?.infeasible || wholeRing) {
    steadyStates = [];
    steadyStateSet = "finite";
  } else {
    try {
      let numeric: ReturnType<typeof steadyStatesFromBasis> | null = null;
      if (basis) numeric = steadyStatesFromBasis(network, withTotals, basis, budget);
      else if (param) {
        // A pivot of mixed sign might vanish at a positive steady state, which the reduction would
        // then miss: for the complete list, eliminate only through pivots of one sign.
        const complete = param.pivots.some((p) => signPattern(p) === "mixed")
          ? computeParametrisation(kin, odeRows, budget, { definitePivotsOnly: true })
          : param;
        numeric = numericSteadyStates(network, withTotals, complete, budget);
      } else steadyStatesReason = "Not computed: neither the parametrisation nor the full basis was finished within the budget.";
      if (numeric) {
        zeroDimensionalBasis = basis !== null && numeric.status === "finite";
        steadyStateSet = numeric.status === "finite" ? "finite" : "continuum";
        steadyStates = numeric.status === "finite" ? numeric.states : null;
        eliminant = numeric.eliminant;
        positivePoint = numeric.positivePoint ?? null;
        warnings.push(...numeric.warnings);
        if (steadyStateSet === "continuum")
          steadyStatesReason = "The class's steady states form a continuum (its saturated steady-state ideal has positive dimension): there is no finite list.";
      }
    } catch (e) {
      if (!isOutOfBudget(e) && !(e instanceof AlgebraError && e.code === "domain")) throw e;
      ranOut("steady-states", e);
      steadyStatesReason = `Not finished: ${(e as Error).message}.`;
      warnings.push(`Numeric steady states not finished: ${(e as Error).message}.`);
    }
  }

  if (plan.includes("steady-states")) partial("steady-states");

  // Stage: robustness (ACR).
  acr = param ? acrSpecies(kin, param) : [];
  // Species the elimination left as unknowns without a parametrisation: one block-order basis each.
  if (param && param.complete && !param.parametrisation && !param.infeasible)
    for (const s of param.unknowns) {
      try {
        budget.progress("acr", `testing ${s} for absolute concentration robustness`);
        const found = acrByGroebner(kin, odeRows, s, budget.groebner(0.2, "acr"));
        if (found) acr.push(found);
      } catch (e) {
        if (!isOutOfBudget(e)) throw e;
        ranOut("acr", e);
        warnings.push(`ACR of ${s} not decided: ${(e as Error).message}.`);
      }
    }
  acr.sort((a, b) => network.species.indexOf(a.species) - network.species.indexOf(b.species));
  if (plan.includes("acr")) partial("acr");

  // Stage: relation tests.
  for (const text of options.relations ?? []) {
    try {
      budget.progress("relations", `testing ${text}`);
      const totalNames = kineticsRing(network, { speciesOrder: species, totalCount: laws.length }).totals;
      const relationTotals = laws.length > 0 ? { names: totalNames, laws: noTotals.conservationLaws, values: totals && totals.length > 0 ? totals : null } : undefined;
      relations.push(testRelation(text, kin, odeRows, budget.groebner(0.5, "relations"), relationTotals));
    } catch (e) {
      if (e instanceof AlgebraError && e.code === "parse") throw new SteadyStateInputError(`relation '${text}': ${e.message}`);
      if (!isOutOfBudget(e)) throw e;
      ranOut("relations", e);
      warnings.push(`Relation ${text} not decided: ${(e as Error).message}.`);
    }
  }

  return assemble({
    network, options, structure, species, suggested, kin, kinT, noTotals, withTotals, laws, numericRates, classGiven, basis, basisStatus, param,
    wholeRing, acr, relations, steadyStates, steadyStatesReason, eliminant, steadyStateSet, zeroDimensionalBasis, positivePoint, unfinished, warnings,
  });
}

/** "E + C" for a conservation law given as species → coefficient. */
function lawText(law: Record<string, number>): string {
  return Object.entries(law)
    .map(([s, c], i) => `${c < 0 ? (i === 0 ? "-" : " - ") : i === 0 ? "" : " + "}${Math.abs(c) === 1 ? "" : Math.abs(c)}${s}`)
    .join("");
}
