/**
 * The analysis result object, assembled from what the stages of analyseNetwork produced so far:
 * the final result once every stage has run, or a partial one (AnalyseOptions.onPartial).
 */
import type { Network } from "../network/index";
import { acrText } from "./acr";
import type { AnalyseOptions, SteadyStateAnalysis, UnfinishedStage } from "./analyse";
import { consistencyProblems } from "./consistency";
import type { NumericSteadyState } from "./numeric-steady-states";
import type { computeParametrisation } from "./parametrisation";
import { primitive, signPattern } from "../algebra/poly-tools";
import { polynomialTex } from "../algebra/format-tex";
import { expressionDegree, expressionTex, expressionVariables, formatExpression, isPositiveExpression } from "./rational-expression";
import type { ParametrisationPart } from "./stages/parametrisation";
import type { RelationsPart } from "./stages/relations";
import type { RobustnessPart } from "./stages/robustness";
import type { SteadyStatesPart } from "./stages/steady-states";
import type { StructurePart } from "./stages/structure";
import type { SystemPart } from "./stages/system";
import type { TriangularPart } from "./stages/triangular";
import { genericConditions, triangularForm } from "./triangular";

/** Every stage's part (stages/), with the options and what the stages reported so far. */
export type Parts = StructurePart &
  SystemPart &
  ParametrisationPart &
  TriangularPart &
  SteadyStatesPart &
  RobustnessPart &
  RelationsPart & {
    network: Network;
    options: AnalyseOptions;
    unfinished: UnfinishedStage[];
    warnings: string[];
  };

/** The result object from what the stages produced so far (the whole result once every stage has run). */
export function assemble(x: Parts): SteadyStateAnalysis {
  const { network, options, structure, species, suggested, kin, kinT, noTotals, withTotals, laws, numericRates, classGiven, basis, param } = x;
  const fmt = (p: Parameters<typeof kin.ring.format>[0]) => kin.ring.format(p);
  const blocks = basis ? triangularForm(basis, kinT) : [];
  const expressions = param?.parametrisation?.expressions ?? null;
  const freeIndices = param?.parametrisation ? param.parametrisation.free.map((s) => kin.ring.indexOf(s)) : [];
  // A pivot whose coefficients all have one sign never vanishes at positive species and rate
  // constants; only the others restrict where the parametrisation is valid.
  const nonVanishing = param
    ? [...new Set(param.pivots.filter((p) => signPattern(p) === "mixed").map((p) => formatExpression({ num: primitive(p), den: kin.ring.one() }, param.pivots)))]
    : [];
  const existence = positiveExistence({
    param,
    wholeRing: x.wholeRing,
    steadyStates: x.steadyStates,
    steadyStateSet: x.steadyStateSet,
    classGiven,
    noLaws: laws.length === 0,
    numericRates,
    positivePoint: x.positivePoint,
  });
  const positiveClass = laws.length === 0 || (options.initial !== undefined && network.species.every((s) => (options.initial!.get(s)?.num ?? 0n) > 0n));
  const contradictions = consistencyProblems({
    structure,
    steadyStates: x.steadyStates,
    steadyStateSet: x.steadyStateSet,
    positiveSteadyStatesExist: existence.exists,
    positiveClass,
    numericRates,
    zeroDimensionalBasis: x.zeroDimensionalBasis,
  });
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
    groebnerBasisStatus: x.basisStatus,
    ordering: `${kinT.ring.vars.join(" > ")} (${kinT.ring.orderName})`,
    genericConditions: basis ? genericConditions(basis, kinT) : [],
    triangularForm: blocks.map((b) => ({ species: b.species, polynomials: b.polynomials.map((p) => kinT.ring.format(p)) })),
    parametrisation: param?.parametrisation
      ? {
          free: [...param.parametrisation.free],
          expressions: Object.fromEntries(param.parametrisation.expressions.map((e) => [e.species, formatExpression(e.expression, param.pivots)])),
          positive: param.parametrisation.positive,
          positiveSpecies: param.parametrisation.expressions.filter((e) => isPositiveExpression(e.expression)).map((e) => e.species),
        }
      : null,
    rootsNeeded: param ? param.rootsNeeded.map((r) => ({ species: r.species, polynomial: fmt(r.polynomial), degree: r.degree })) : [],
    nonVanishing,
    acr: x.acr.map(acrText),
    relations: [...x.relations],
    steadyStates: x.steadyStates,
    steadyStatesReason: x.steadyStatesReason,
    eliminant: x.eliminant,
    steadyStateSet: x.steadyStateSet,
    positiveSteadyStatesExist: existence.exists,
    positiveSteadyStatesReason: existence.reason,
    unfinished: [...x.unfinished],
    contradictions,
    warnings: [...x.warnings, ...(param?.notes ?? [])],
    tex: {
      triangularForm: blocks.map((b) => b.polynomials.map(polynomialTex)),
      parametrisation: expressions && Object.fromEntries(expressions.map((e) => [e.species, expressionTex(e.expression, param!.pivots)])),
      acr: Object.fromEntries(x.acr.map((a) => [a.species, expressionTex(a.value, a.factors)])),
    },
    parametrisationDegrees: expressions && Object.fromEntries(expressions.map((e) => [e.species, expressionDegree(e.expression, freeIndices)])),
    parametrisationVariables: expressions && Object.fromEntries(expressions.map((e) => [e.species, expressionVariables(e.expression)])),
  };
}

/**
 * Whether a positive steady state exists, and the argument that decides it: a proof of
 * infeasibility, the complete list of the class, a positive point proven on a continuum, or a positive parametrisation (every positive
 * value of the free species gives a positive steady state — in the class those values determine,
 * which is the given class when nothing is conserved).
 */
function positiveExistence(r: {
  param: ReturnType<typeof computeParametrisation> | null;
  wholeRing: boolean;
  steadyStates: readonly NumericSteadyState[] | null;
  steadyStateSet: SteadyStateAnalysis["steadyStateSet"];
  classGiven: boolean;
  noLaws: boolean;
  numericRates: boolean;
  positivePoint: Record<string, number> | null;
}): { exists: boolean | null; reason: string | null } {
  if (r.param?.infeasible)
    return { exists: false, reason: `No positive steady state${r.numericRates ? "" : " for any positive rate constants"}: ${r.param.infeasible}.` };
  if (r.wholeRing) return { exists: false, reason: "The saturated steady-state ideal is the whole ring." };
  if (r.steadyStateSet === "finite" && r.steadyStates)
    return { exists: r.steadyStates.length > 0, reason: `The complete list of the class's positive steady states has ${r.steadyStates.length}.` };
  const positive = r.param?.parametrisation?.positive === true;
  if (positive && (!r.classGiven || r.noLaws))
    return {
      exists: true,
      reason: r.classGiven
        ? "The parametrisation is positive and nothing is conserved: every positive value of the free species is a positive steady state."
        : "The parametrisation is positive: every positive value of the free species gives a positive steady state (of the class it lies in).",
    };
  if (r.steadyStateSet === "continuum" && r.positivePoint)
    return {
      exists: true,
      reason: `The continuum meets the positive orthant: for example ${Object.entries(r.positivePoint).map(([k, v]) => `${k} = ${v.toPrecision(6)}`).join(", ")} (a positive root of a finite slice, isolated exactly).`,
    };
  if (r.steadyStateSet === "continuum") return { exists: null, reason: "A continuum of complex solutions; whether it meets the positive orthant of this class is not decided." };
  return { exists: null, reason: null };
}
