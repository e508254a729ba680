import type { Rational } from "../algebra/index";
import type { Network, NetworkStructure } from "../network/index";
import type { AcrSpecies } from "./acr";
import { assemble } from "./analyse-result";
import { Budget, type BudgetOptions } from "./budget";
import type { NumericSteadyState } from "./numeric-steady-states";
import type { RelationResult } from "./relation";
import { parametrisationStage, type ParametrisationPart } from "./stages/parametrisation";
import { relationsStage, type RelationsPart } from "./stages/relations";
import { robustnessNeedsBases, robustnessStage, type RobustnessPart } from "./stages/robustness";
import type { StageReport } from "./stages/stage";
import { steadyStatesStage, type SteadyStatesPart } from "./stages/steady-states";
import { structureStage } from "./stages/structure";
import { systemStage } from "./stages/system";
import { triangularStage, wantsFullBasis, type TriangularPart } from "./stages/triangular";

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
  /**
   * The formulas above in TeX, written from the exact values (never parsed back from the text):
   * each triangular block's polynomials, each parametrisation expression (null without one), each
   * ACR value, keyed by species.
   */
  readonly tex: {
    readonly triangularForm: string[][];
    readonly parametrisation: Record<string, string> | null;
    readonly acr: Record<string, string>;
  };
  /** Each parametrisation expression's degree in the free species (of numerator or denominator, the larger); null without one. */
  readonly parametrisationDegrees: Record<string, number> | null;
  /** The variables each parametrisation expression depends on (species and parameters, in the ring's order); null without one. */
  readonly parametrisationVariables: Record<string, string[]> | null;
}

/**
 * The whole steady-state analysis of a network, pure and budgeted (safe for a web worker):
 * structure; mass-action ODEs; steady-state system with conservation equations; parametrisation
 * by linear elimination first (Feliu & Wiuf 2012) and lex bases only on what remains; the lex
 * basis of the saturated ideal in a block order with its generic-parameter conditions and
 * triangular form; ACR species (Shinar & Feinberg 2010); relation tests; and, with initial
 * concentrations, every positive steady state of the class with its stability.
 * Phases that run out of time or size become warnings; cancellation (AbortSignal) throws.
 * The stages are in stages/ (structure, steady-state system, parametrisation, triangular form,
 * steady states, robustness, relations), each returning its typed part with its warnings and
 * unfinished phases; this function runs them in order and sends the partial results between them.
 *
 * Example: analyseNetwork(parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n")).parametrisation
 * is { free: ["B"], expressions: { A: "B*k2/k1" }, positive: true }.
 */
export function analyseNetwork(network: Network, options: AnalyseOptions = {}): SteadyStateAnalysis {
  const budget = new Budget(options);
  const warnings: string[] = [];
  const unfinished: UnfinishedStage[] = [];
  const take = <T extends StageReport>(r: T): T => {
    warnings.push(...r.warnings);
    unfinished.push(...r.unfinished);
    return r;
  };

  budget.progress("structure", "structure of the network");
  const structure = take(structureStage(network, options));
  const system = take(systemStage(network, options, structure));

  // What the later stages produce, empty until they ran, so a partial result can be assembled after any of them.
  let param: ParametrisationPart = { param: null };
  let triangular: TriangularPart = { basis: null, basisStatus: "skipped", wholeRing: false };
  let states: SteadyStatesPart = { steadyStates: null, steadyStatesReason: null, eliminant: null, steadyStateSet: null, zeroDimensionalBasis: false, positivePoint: null };
  let robust: RobustnessPart = { acr: [] };
  let related: RelationsPart = { relations: [] };

  // The stages still to run, for partial results. Before the parametrisation only the stages that
  // surely follow are known; the plan is settled after it.
  const relationsPlanned = (options.relations ?? []).length > 0;
  const listsStates = system.numericRates && system.classGiven;
  let plan: AnalysisStage[] = ["parametrisation", ...(listsStates ? (["steady-states"] as const) : []), ...(relationsPlanned ? (["relations"] as const) : [])];
  const assembleNow = (extraUnfinished: UnfinishedStage[]) =>
    assemble({
      network, options, ...structure, ...system, ...param, ...triangular, ...states, ...robust, ...related,
      unfinished: [...unfinished, ...extraUnfinished],
      warnings: [...warnings],
    });
  const partial = (done: AnalysisStage | null) => {
    // Only while some stage is still to come: after the last one the result itself follows.
    const pending = done === null ? plan : plan.slice(plan.indexOf(done) + 1);
    if (!options.onPartial || pending.length === 0) return;
    options.onPartial(assembleNow(pending.filter((st) => !unfinished.some((u) => u.stage === st)).map((stage) => ({ stage, reason: NOT_REACHED }))));
  };
  // The structure, ODEs and steady-state system are in: the first partial result.
  partial(null);

  param = take(parametrisationStage(structure, budget));
  const wantBasis = wantsFullBasis(options, system, param);
  plan = [
    "parametrisation",
    ...(system.withTotals.equations.length > 0 && wantBasis ? (["groebner"] as const) : []),
    ...(listsStates && !param.param?.infeasible ? (["steady-states"] as const) : []),
    ...(robustnessNeedsBases(param) ? (["acr"] as const) : []),
    ...(relationsPlanned ? (["relations"] as const) : []),
  ];
  partial("parametrisation");

  triangular = take(triangularStage(options, system, param, wantBasis, budget));
  if (plan.includes("groebner")) partial("groebner");

  states = take(steadyStatesStage(network, options, structure, system, param, triangular, budget));
  if (plan.includes("steady-states")) partial("steady-states");

  robust = take(robustnessStage(network, structure, param, budget));
  if (plan.includes("acr")) partial("acr");

  related = take(relationsStage(network, options, structure, system, budget));
  return assembleNow([]);
}
