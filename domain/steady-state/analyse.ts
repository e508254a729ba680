import { AlgebraError } from "../algebra/index";
import type { Rational } from "../algebra/index";
import { analyseStructure, type NetworkStructure } from "../network/index";
import type { Network } from "../network/index";
import { acrByGroebner, acrSpecies, type AcrSpecies } from "./acr";
import { Budget, type BudgetOptions, isOutOfBudget } from "./budget";
import { monomialOf, saturate } from "./ideal";
import { kineticsRing, type QPoly } from "./kinetics";
import { numericSteadyStates, type NumericSteadyState } from "./numeric-steady-states";
import { defaultOrder, resolveOrder, SteadyStateInputError } from "./order";
import { computeParametrisation } from "./parametrisation";
import { formatExpression } from "./rational-expression";
import { testRelation, type RelationResult } from "./relation";
import { steadyStateSystem, totalsFromInitial } from "./system";
import { genericConditions, leadingSpecies, triangularForm } from "./triangular";
import { primitive, signPattern } from "./poly-tools";

export interface AnalyseOptions extends BudgetOptions {
  /** Elimination order: species eliminated first … species kept free last (partial lists allowed). */
  readonly order?: readonly string[];
  /** Initial concentrations (unlisted species are 0); give them for numeric steady states. */
  readonly initial?: ReadonlyMap<string, Rational>;
  /** Expressions in species and rate constants to test at the positive steady states. */
  readonly relations?: readonly string[];
  /** Skip the full lex basis of the steady-state system with totals (default false). */
  readonly skipFullBasis?: boolean;
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
  /** Reduced lex basis of the saturated steady-state ideal (with totals), or null when out of budget. */
  readonly groebnerBasis: string[] | null;
  readonly ordering: string;
  readonly genericConditions: string[];
  readonly triangularForm: { readonly species: string | null; readonly polynomials: string[] }[];
  readonly parametrisation: { readonly free: string[]; readonly expressions: Record<string, string>; readonly positive: boolean } | null;
  readonly rootsNeeded: { readonly species: string; readonly polynomial: string; readonly degree: number }[];
  readonly nonVanishing: string[];
  readonly acr: AcrSpecies[];
  readonly relations: RelationResult[];
  /** With initial concentrations and every rate value: all positive steady states of the class. */
  readonly steadyStates: NumericSteadyState[] | null;
  readonly eliminant: { readonly variable: string; readonly polynomial: string } | null;
  /** "finite": steadyStates lists every positive steady state of the class; "continuum": infinitely many complex solutions, none listed. */
  readonly steadyStateSet: "finite" | "continuum" | null;
  readonly positiveSteadyStatesExist: boolean | null;
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

  // Parametrisation (no totals).
  let param: ReturnType<typeof computeParametrisation> | null = null;
  try {
    param = computeParametrisation(kin, odeRows, budget);
    if (param.infeasible) warnings.push(`No positive steady state: ${param.infeasible}.`);
  } catch (e) {
    if (!isOutOfBudget(e)) throw e;
    warnings.push(`Parametrisation not finished: ${(e as Error).message}.`);
  }

  // Full lex basis of the system with totals (symbolic, or numeric from the initial concentrations).
  const numericRates = kin.rateParameters.length === 0;
  const totals = options.initial ? totalsFromInitial(laws, network.species, options.initial) : null;
  const kinT = totals ? kin : kineticsRing(network, { speciesOrder: species, totalCount: laws.length });
  const withTotals = steadyStateSystem(network, kinT, laws, totals);
  let basis: QPoly[] | null = null;
  if (!options.skipFullBasis && withTotals.equations.length > 0) {
    try {
      budget.progress("groebner", "lex Gröbner basis of the saturated steady-state ideal");
      basis = saturate(withTotals.equations, monomialOf(kinT.ring, kinT.species.map((_, i) => i)), budget.groebner(0.25));
    } catch (e) {
      if (!isOutOfBudget(e)) throw e;
      warnings.push(
        `The lex Gröbner basis of the full steady-state system was not finished within the budget (${(e as Error).message}); ` +
          (param?.parametrisation ? "the parametrisation from linear elimination describes the steady states instead." : "try another --order or fewer symbolic constants."),
      );
    }
  }
  if (withTotals.equations.length === 0) basis = [];
  const conditions = basis ? genericConditions(basis, kinT) : [];
  if (conditions.length > 0)
    warnings.push(`The basis holds for generic parameter values: these leading coefficients must not vanish: ${conditions.join("; ")} (one with all coefficients of one sign never vanishes for positive parameters).`);

  // A pivot whose coefficients all have one sign never vanishes at positive species and rate
  // constants; only the others restrict where the parametrisation is valid.
  const nonVanishing = param
    ? [...new Set(param.pivots.filter((p) => signPattern(p) === "mixed").map((p) => formatExpression({ num: primitive(p), den: kin.ring.one() }, param!.pivots)))]
    : [];
  const wholeRing = basis !== null && basis.length === 1 && basis[0].coeffs.length === 1 && basis[0].exps.every((e) => e === 0);
  const parameterOnly = basis && !wholeRing ? basis.filter((g) => leadingSpecies(g, kinT) === null) : [];
  if (wholeRing) warnings.push("The saturated steady-state ideal is the whole ring (its basis is [1]): there is no positive steady state.");
  if (parameterOnly.length > 0)
    warnings.push(
      `The saturated ideal contains polynomials in the parameters alone (${parameterOnly.map((g) => kinT.ring.format(g)).join("; ")}): for parameter values where they do not vanish there is no positive steady state.`,
    );

  // Numeric steady states.
  let steadyStates: NumericSteadyState[] | null = null;
  let eliminant: SteadyStateAnalysis["eliminant"] = null;
  let steadyStateSet: SteadyStateAnalysis["steadyStateSet"] = null;
  if (options.initial) {
    if (param?.infeasible) {
      steadyStates = [];
      steadyStateSet = "finite";
    }
    else if (!numericRates) warnings.push(`Numeric steady states need a value for every rate constant; missing: ${kin.rateParameters.join(", ")}.`);
    else if (param) {
      try {
        // A pivot of mixed sign might vanish at a positive steady state, which the reduction would
        // then miss: for the complete list, eliminate only through pivots of one sign.
        const complete = param.pivots.some((p) => signPattern(p) === "mixed")
          ? computeParametrisation(kin, odeRows, budget, { definitePivotsOnly: true })
          : param;
        const numeric = numericSteadyStates(network, withTotals, complete, budget);
        steadyStates = numeric.states;
        eliminant = numeric.eliminant;
        steadyStateSet = numeric.status === "finite" ? "finite" : "continuum";
        warnings.push(...numeric.warnings);
      } catch (e) {
        if (!isOutOfBudget(e) && !(e instanceof AlgebraError && e.code === "domain")) throw e;
        warnings.push(`Numeric steady states not finished: ${(e as Error).message}.`);
      }
    }
  }

  // ACR and relations.
  const acr = param ? acrSpecies(kin, param) : [];
  // Species the elimination left as unknowns without a parametrisation: one block-order basis each.
  if (param && param.complete && !param.parametrisation && !param.infeasible)
    for (const s of param.unknowns) {
      try {
        budget.progress("acr", `testing ${s} for absolute concentration robustness`);
        const found = acrByGroebner(kin, odeRows, s, budget.groebner(0.2));
        if (found) acr.push(found);
      } catch (e) {
        if (!isOutOfBudget(e)) throw e;
        warnings.push(`ACR of ${s} not decided: ${(e as Error).message}.`);
      }
    }
  acr.sort((a, b) => network.species.indexOf(a.species) - network.species.indexOf(b.species));
  const relations: RelationResult[] = [];
  for (const text of options.relations ?? []) {
    try {
      budget.progress("relations", `testing ${text}`);
      relations.push(testRelation(text, kin, odeRows, budget.groebner(0.5)));
    } catch (e) {
      if (e instanceof AlgebraError && e.code === "parse") throw new SteadyStateInputError(`relation '${text}': ${e.message}`);
      if (!isOutOfBudget(e)) throw e;
      warnings.push(`Relation ${text} not decided: ${(e as Error).message}.`);
    }
  }

  const order = { species, suggested: suggested.order, reason: suggested.reason, userGiven: options.order !== undefined };
  const values: Record<string, string> = {};
  for (const [k, v] of kin.rateValues) values[k] = v.den === 1n ? `${v.num}` : `${v.num}/${v.den}`;
  return {
    structure,
    order,
    parameters: { rateConstants: [...kin.rateParameters], totals: [...kinT.totals], values },
    odes: network.species.map((s) => ({ species: s, rhs: fmt(noTotals.odes[kin.species.indexOf(s)]) })),
    steadyStateSystem: {
      equations: withTotals.equations.map((p) => kinT.ring.format(p)),
      replacedRows: kin.species.filter((_, i) => !withTotals.keptRows.includes(i)),
    },
    groebnerBasis: basis ? basis.map((p) => kinT.ring.format(p)) : null,
    ordering: `${kinT.ring.vars.join(" > ")} (${kinT.ring.orderName})`,
    genericConditions: conditions,
    triangularForm: basis ? triangularForm(basis, kinT).map((b) => ({ species: b.species, polynomials: b.polynomials.map((p) => kinT.ring.format(p)) })) : [],
    parametrisation: param?.parametrisation
      ? {
          free: [...param.parametrisation.free],
          expressions: Object.fromEntries(param.parametrisation.expressions.map((e) => [e.species, formatExpression(e.expression, param!.pivots)])),
          positive: param.parametrisation.positive,
        }
      : null,
    rootsNeeded: param ? param.rootsNeeded.map((r) => ({ species: r.species, polynomial: fmt(r.polynomial), degree: r.degree })) : [],
    nonVanishing,
    acr,
    relations,
    steadyStates,
    eliminant,
    steadyStateSet,
    positiveSteadyStatesExist: param?.infeasible ? false : steadyStates && steadyStateSet === "finite" ? steadyStates.length > 0 : null,
    warnings: [...warnings, ...(param?.notes ?? [])],
  };
}
