/**
 * Stage 4, triangular form: the reduced lex basis of the saturated steady-state ideal (with
 * totals), only where it is the answer (no parametrisation), the route to a numeric class's
 * steady states, or asked for; then what the basis says at once: its generic conditions, the whole
 * ring (no positive steady state), polynomials in the parameters alone.
 */
import { isNonZeroConstant } from "../../algebra/poly-tools";
import type { AnalyseOptions, SteadyStateAnalysis } from "../analyse";
import { type Budget, isOutOfBudget } from "../budget";
import { monomialOf, saturate } from "../ideal";
import type { QPoly } from "../kinetics";
import { genericConditions, leadingSpecies } from "../triangular";
import type { ParametrisationPart } from "./parametrisation";
import { stageReport, type StageReport } from "./stage";
import type { SystemPart } from "./system";

export interface TriangularPart {
  /** The basis, or null when skipped or out of budget. */
  readonly basis: QPoly[] | null;
  readonly basisStatus: SteadyStateAnalysis["groebnerBasisStatus"];
  /** The basis is [1]: no positive steady state. */
  readonly wholeRing: boolean;
}

/** Whether the full basis is wanted (decided after the parametrisation, which may make it unnecessary). */
export function wantsFullBasis(options: AnalyseOptions, sys: SystemPart, p: ParametrisationPart): boolean {
  return !options.skipFullBasis && (options.fullBasis === true || sys.numericClass || !p.param?.parametrisation);
}

export function triangularStage(options: AnalyseOptions, sys: SystemPart, p: ParametrisationPart, wantBasis: boolean, budget: Budget): TriangularPart & StageReport {
  const { withTotals, kinT } = sys;
  const report = stageReport();
  let basis: QPoly[] | null = null;
  let basisStatus: TriangularPart["basisStatus"] = "skipped";
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
      report.ranOut("groebner", e);
      report.warnings.push(
        `The lex Gröbner basis of the full steady-state system was not finished within the budget (${(e as Error).message}); ` +
          (p.param?.parametrisation ? "the parametrisation from linear elimination describes the steady states instead." : "try another order or fewer symbolic constants."),
      );
    }
  } else if (!options.skipFullBasis)
    report.warnings.push("The full lex Gröbner basis was not computed: the parametrisation from linear elimination already describes every positive steady state (ask for the full basis to see it).");

  const conditions = basis ? genericConditions(basis, kinT) : [];
  if (conditions.length > 0)
    report.warnings.push(
      `The basis holds for generic parameter values: these leading coefficients must not vanish: ${conditions.join("; ")} (one with all coefficients of one sign never vanishes for positive parameters).`,
    );
  const wholeRing = basis !== null && basis.length === 1 && isNonZeroConstant(basis[0]);
  const parameterOnly = basis && !wholeRing ? basis.filter((g) => leadingSpecies(g, kinT) === null) : [];
  if (wholeRing) report.warnings.push("The saturated steady-state ideal is the whole ring (its basis is [1]): there is no positive steady state.");
  if (parameterOnly.length > 0)
    report.warnings.push(
      `The saturated ideal contains polynomials in the parameters alone (${parameterOnly.map((g) => kinT.ring.format(g)).join("; ")}): for parameter values where they do not vanish there is no positive steady state.`,
    );
  return { basis, basisStatus, wholeRing, warnings: report.warnings, unfinished: report.unfinished };
}
