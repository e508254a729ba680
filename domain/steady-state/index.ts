/**
 * Steady states of mass-action networks: ODEs, the steady-state system, parametrisation by linear
 * elimination and lex Gröbner bases, ACR, relation tests, and all positive steady states of a
 * stoichiometric class with their stability. `analyseNetwork` is the one entry point the CLI and the
 * web worker call.
 */
export { analyseNetwork, type AnalyseOptions, type SteadyStateAnalysis } from "./analyse";
export { type AnalysisProgress, type BudgetOptions } from "./budget";
export { SteadyStateInputError, inputProblemText, PLAIN_INPUT_NAMES, defaultOrder, resolveOrder, nonInteractingSpecies, type SteadyStateInputProblem, type InputName } from "./order";
export { kineticsRing, massActionOdes, type KineticsRing, type QPoly, type QRing } from "./kinetics";
export { massActionTerms, type OdeTerm, type SpeciesOde } from "./ode-terms";
export { odeJulia, odePython, type OdeCodeOptions } from "./ode-code";
export { steadyStateSystem, totalsFromInitial, type SteadyStateSystem } from "./system";
export { linearElimination, type LinearEliminationResult, type EliminatedSpecies } from "./linear-elimination";
export { computeParametrisation, type Parametrisation, type ParametrisationResult } from "./parametrisation";
export { positiveSolutions, isZeroDimensional, type ZeroDimensionalSolution } from "./zero-dimensional";
export { numericSteadyStates, type NumericSteadyState } from "./numeric-steady-states";
export { acrSpecies, acrByGroebner, acrText, type AcrSpecies, type AcrFinding } from "./acr";
export { testRelation, type RelationResult } from "./relation";
export { saturate } from "./ideal";
export { triangularForm, genericConditions } from "./triangular";
export { formatExpression, expressionTex, expressionDegree, type RationalExpression } from "./rational-expression";
