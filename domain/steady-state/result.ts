/**
 * The analysis result as plain JSON: one shape, declared once. The CLI prints it (`analyse
 * --json`), the worker stores it in `analyses.result`, and the pages and the API read it back.
 * Field types are taken from the domain's own types (indexed access), so a change there shows
 * here and in every reader at compile time instead of drifting in a hand-written copy.
 *
 * Polynomials and expressions travel as the domain's canonical text (parseable by the algebra
 * layer's parser) and, under `tex`, as TeX written from the same exact values, so no reader needs
 * to parse a formula; numbers from the numeric layer are floats, as everywhere for display.
 */
import type { NetworkStructure } from "../network/index";
import type { SteadyStateAnalysis } from "./analyse";
import type { MultistationarityResult } from "./multistationarity";
import type { NumericSteadyState } from "./numeric-steady-states";

/** One positive steady state, eigenvalues as plain { re, im } objects. */
export interface SteadyStateJson {
  concentrations: NumericSteadyState["concentrations"];
  stable: NumericSteadyState["stable"];
  verdict: NumericSteadyState["verdict"];
  eigenvalues: { re: number; im: number }[];
  residual: number;
}

type S = NetworkStructure;
type A = SteadyStateAnalysis;

/** Key order is the output order of `analyse --json` (a contract: keep it). */
export interface AnalysisResultJson {
  species: S["species"];
  /** Species held constant (the complexes and matrices are formed without them). */
  constants: S["constants"];
  complexes: S["complexes"];
  reactions: S["reactions"];
  rank: S["rank"];
  linkageClasses: S["linkageClasses"];
  deficiency: S["deficiency"];
  weaklyReversible: S["weaklyReversible"];
  conservationLaws: S["conservationLaws"];
  /** Empty when the basis was skipped or unfinished (see groebnerBasisStatus). */
  groebnerBasis: string[];
  parametrisation: A["parametrisation"];
  acr: A["acr"];
  steadyStates: SteadyStateJson[] | null;
  steadyStatesReason: A["steadyStatesReason"];
  warnings: A["warnings"];
  order: A["order"];
  ordering: A["ordering"];
  groebnerBasisComplete: boolean;
  groebnerBasisStatus: A["groebnerBasisStatus"];
  genericConditions: A["genericConditions"];
  triangularForm: A["triangularForm"];
  rootsNeeded: A["rootsNeeded"];
  nonVanishing: A["nonVanishing"];
  relations: A["relations"];
  eliminant: A["eliminant"];
  steadyStateSet: A["steadyStateSet"];
  positiveSteadyStatesExist: A["positiveSteadyStatesExist"];
  positiveSteadyStatesReason: A["positiveSteadyStatesReason"];
  unfinished: A["unfinished"];
  contradictions: A["contradictions"];
  odes: A["odes"];
  steadyStateSystem: A["steadyStateSystem"];
  parameters: A["parameters"];
  minimalSemiPositiveConservationLaws: S["minimalSemiPositiveConservationLaws"];
  deficiencyZeroTheorem: S["deficiencyZeroTheorem"];
  deficiencyOneTheorem: S["deficiencyOneTheorem"];
  /** Added after the keys above (older stored results lack them): the formulas in TeX, from the exact values. */
  tex: A["tex"];
  parametrisationDegrees: A["parametrisationDegrees"];
  /** Added after parametrisationDegrees. */
  parametrisationVariables: A["parametrisationVariables"];
}

/**
 * The JSON object of one analysis (structure keys from the network layer's analyseStructure).
 * Example: for `A <-> B,k1,k2` it has deficiency 0 and parametrisation
 * { free: ["B"], expressions: { A: "B*k2/k1" }, positive: true }.
 */
export function analysisResultJson(r: SteadyStateAnalysis): AnalysisResultJson {
  const s = r.structure;
  return {
    species: s.species,
    constants: s.constants,
    complexes: s.complexes,
    reactions: s.reactions,
    rank: s.rank,
    linkageClasses: s.linkageClasses,
    deficiency: s.deficiency,
    weaklyReversible: s.weaklyReversible,
    conservationLaws: s.conservationLaws,
    groebnerBasis: r.groebnerBasis ?? [],
    parametrisation: r.parametrisation,
    acr: r.acr,
    steadyStates:
      r.steadyStates?.map((x) => ({
        concentrations: x.concentrations,
        stable: x.stable,
        verdict: x.verdict,
        eigenvalues: x.eigenvalues.map((e) => ({ re: e.re, im: e.im })),
        residual: x.residual,
      })) ?? null,
    steadyStatesReason: r.steadyStatesReason,
    warnings: r.warnings,
    order: r.order,
    ordering: r.ordering,
    groebnerBasisComplete: r.groebnerBasis !== null,
    groebnerBasisStatus: r.groebnerBasisStatus,
    genericConditions: r.genericConditions,
    triangularForm: r.triangularForm,
    rootsNeeded: r.rootsNeeded,
    nonVanishing: r.nonVanishing,
    relations: r.relations,
    eliminant: r.eliminant,
    steadyStateSet: r.steadyStateSet,
    positiveSteadyStatesExist: r.positiveSteadyStatesExist,
    positiveSteadyStatesReason: r.positiveSteadyStatesReason,
    unfinished: r.unfinished,
    contradictions: r.contradictions,
    odes: r.odes,
    steadyStateSystem: r.steadyStateSystem,
    parameters: r.parameters,
    minimalSemiPositiveConservationLaws: s.minimalSemiPositiveConservationLaws,
    deficiencyZeroTheorem: s.deficiencyZeroTheorem,
    deficiencyOneTheorem: s.deficiencyOneTheorem,
    tex: r.tex,
    parametrisationDegrees: r.parametrisationDegrees,
    parametrisationVariables: r.parametrisationVariables,
  };
}

/** The multistationarity verdict as plain JSON (`multistationarity --json`; stored beside the analysis). */
export interface MultistationarityJson {
  verdict: MultistationarityResult["verdict"];
  method: MultistationarityResult["method"];
  reason: MultistationarityResult["reason"];
  witness?: NonNullable<MultistationarityResult["witness"]>;
  assumptions?: MultistationarityResult["assumptions"];
  sources?: MultistationarityResult["sources"];
}

export function multistationarityJson(r: MultistationarityResult): MultistationarityJson {
  return {
    verdict: r.verdict,
    method: r.method,
    reason: r.reason,
    ...(r.witness ? { witness: r.witness } : {}),
    assumptions: r.assumptions,
    sources: r.sources,
  };
}
