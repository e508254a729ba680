/**
 * Stage 6, robustness: species with absolute concentration robustness (Shinar & Feinberg 2010),
 * read off the elimination, and for the species it left as unknowns one block-order basis each.
 */
import type { Network } from "../../network/index";
import { acrByGroebner, acrSpecies, type AcrFinding } from "../acr";
import { type Budget, isOutOfBudget } from "../budget";
import type { ParametrisationPart } from "./parametrisation";
import { stageReport, type StageReport } from "./stage";
import type { StructurePart } from "./structure";

export interface RobustnessPart {
  /** In network species order. */
  readonly acr: AcrFinding[];
}

/** Whether the stage runs a Gröbner basis of its own (it is then a stage a partial result waits for). */
export function robustnessNeedsBases(p: ParametrisationPart): boolean {
  const { param } = p;
  return param !== null && param.complete && !param.parametrisation && !param.infeasible && param.unknowns.length > 0;
}

export function robustnessStage(network: Network, s: StructurePart, p: ParametrisationPart, budget: Budget): RobustnessPart & StageReport {
  const { param } = p;
  const report = stageReport();
  const acr = param ? acrSpecies(s.kin, param) : [];
  if (param && robustnessNeedsBases(p))
    for (const sp of param.unknowns) {
      try {
        budget.progress("acr", `testing ${sp} for absolute concentration robustness`);
        const found = acrByGroebner(s.kin, s.odeRows, sp, budget.groebner(0.2, "acr"));
        if (found) acr.push(found);
      } catch (e) {
        if (!isOutOfBudget(e)) throw e;
        report.ranOut("acr", e);
        report.warnings.push(`ACR of ${sp} not decided: ${(e as Error).message}.`);
      }
    }
  acr.sort((a, b) => network.species.indexOf(a.species) - network.species.indexOf(b.species));
  return { acr, warnings: report.warnings, unfinished: report.unfinished };
}
