/**
 * Stage 5, steady states: every positive steady state of the class (numeric rate constants and a
 * given class), from the basis when there is one, else from the parametrisation; or the reason
 * there is no list (symbolic constants, totals not given, a continuum, out of budget).
 */
import { AlgebraError } from "../../algebra/index";
import { signPattern } from "../../algebra/poly-tools";
import type { Network } from "../../network/index";
import type { AnalyseOptions, SteadyStateAnalysis } from "../analyse";
import { type Budget, isOutOfBudget } from "../budget";
import { numericSteadyStates, steadyStatesFromBasis, type NumericSteadyState } from "../numeric-steady-states";
import { computeParametrisation } from "../parametrisation";
import type { ParametrisationPart } from "./parametrisation";
import { stageReport, type StageReport } from "./stage";
import type { StructurePart } from "./structure";
import type { SystemPart } from "./system";
import type { TriangularPart } from "./triangular";

export interface SteadyStatesPart {
  readonly steadyStates: NumericSteadyState[] | null;
  readonly steadyStatesReason: string | null;
  readonly eliminant: SteadyStateAnalysis["eliminant"];
  readonly steadyStateSet: SteadyStateAnalysis["steadyStateSet"];
  /** The list came from a zero-dimensional basis (a theorem the consistency check can cite). */
  readonly zeroDimensionalBasis: boolean;
  /** A positive point on a continuum, isolated exactly, when one was found. */
  readonly positivePoint: Record<string, number> | null;
}

export function steadyStatesStage(
  network: Network,
  options: AnalyseOptions,
  s: StructurePart,
  sys: SystemPart,
  p: ParametrisationPart,
  t: TriangularPart,
  budget: Budget,
): SteadyStatesPart & StageReport {
  const { kin } = s;
  const { param } = p;
  const report = stageReport();
  const out: { -readonly [K in keyof SteadyStatesPart]: SteadyStatesPart[K] } = {
    steadyStates: null,
    steadyStatesReason: null,
    eliminant: null,
    steadyStateSet: null,
    zeroDimensionalBasis: false,
    positivePoint: null,
  };
  if (!sys.numericRates) {
    const heldSymbolic = (network.constants ?? []).some((c) => kin.rateParameters.includes(c.name));
    out.steadyStatesReason = `Listing steady states needs a value for every rate constant${heldSymbolic ? " and constant species" : ""}; missing: ${kin.rateParameters.join(", ")}.`;
    if (options.initial) report.warnings.push(out.steadyStatesReason);
  } else if (!sys.classGiven) {
    out.steadyStatesReason = `The steady states depend on the totals of the conservation laws (${s.structure.conservationLaws.map(lawText).join("; ")}): give the initial concentrations to fix them.`;
  } else if (param?.infeasible || t.wholeRing) {
    out.steadyStates = [];
    out.steadyStateSet = "finite";
  } else {
    try {
      let numeric: ReturnType<typeof steadyStatesFromBasis> | null = null;
      if (t.basis) numeric = steadyStatesFromBasis(network, sys.withTotals, t.basis, budget);
      else if (param) {
        // A pivot of mixed sign might vanish at a positive steady state, which the reduction would
        // then miss: for the complete list, eliminate only through pivots of one sign.
        const complete = param.pivots.some((q) => signPattern(q) === "mixed") ? computeParametrisation(kin, s.odeRows, budget, { definitePivotsOnly: true }) : param;
        numeric = numericSteadyStates(network, sys.withTotals, complete, budget);
      } else out.steadyStatesReason = "Not computed: neither the parametrisation nor the full basis was finished within the budget.";
      if (numeric) {
        out.zeroDimensionalBasis = t.basis !== null && numeric.status === "finite";
        out.steadyStateSet = numeric.status === "finite" ? "finite" : "continuum";
        out.steadyStates = numeric.status === "finite" ? numeric.states : null;
        out.eliminant = numeric.eliminant;
        out.positivePoint = numeric.positivePoint ?? null;
        report.warnings.push(...numeric.warnings);
        if (out.steadyStateSet === "continuum")
          out.steadyStatesReason = "The class's steady states form a continuum (its saturated steady-state ideal has positive dimension): there is no finite list.";
      }
    } catch (e) {
      if (!isOutOfBudget(e) && !(e instanceof AlgebraError && e.code === "domain")) throw e;
      report.ranOut("steady-states", e);
      out.steadyStatesReason = `Not finished: ${(e as Error).message}.`;
      report.warnings.push(`Numeric steady states not finished: ${(e as Error).message}.`);
    }
  }
  return { ...out, warnings: report.warnings, unfinished: report.unfinished };
}

/** "E + C" for a conservation law given as species → coefficient. */
function lawText(law: Record<string, number>): string {
  return Object.entries(law)
    .map(([sp, c], i) => `${c < 0 ? (i === 0 ? "-" : " - ") : i === 0 ? "" : " + "}${Math.abs(c) === 1 ? "" : Math.abs(c)}${sp}`)
    .join("");
}
