/**
 * Stage 3, parametrisation: linear elimination first, lex bases only on what remains (see
 * ../parametrisation.ts). Without totals, so one parametrisation serves every class.
 */
import { type Budget, isOutOfBudget } from "../budget";
import { computeParametrisation, type ParametrisationResult } from "../parametrisation";
import { stageReport, type StageReport } from "./stage";
import type { StructurePart } from "./structure";

export interface ParametrisationPart {
  /** null when the stage ran out of budget. */
  readonly param: ParametrisationResult | null;
}

export function parametrisationStage(s: StructurePart, budget: Budget): ParametrisationPart & StageReport {
  const report = stageReport();
  try {
    const param = computeParametrisation(s.kin, s.odeRows, budget);
    if (param.infeasible) report.warnings.push(`No positive steady state: ${param.infeasible}.`);
    if (!param.complete) report.unfinished.push({ stage: "parametrisation", reason: "the lex Gröbner basis after linear elimination was not finished" });
    return { param, warnings: report.warnings, unfinished: report.unfinished };
  } catch (e) {
    if (!isOutOfBudget(e)) throw e;
    report.ranOut("parametrisation", e);
    report.warnings.push(`Parametrisation not finished: ${(e as Error).message}.`);
    return { param: null, warnings: report.warnings, unfinished: report.unfinished };
  }
}
