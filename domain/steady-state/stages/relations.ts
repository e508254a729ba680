/**
 * Stage 7, relations: each expression the user gave, tested at the positive steady states
 * (see ../relation.ts). A relation that does not parse is bad input (typed SteadyStateInputError).
 */
import { AlgebraError } from "../../algebra/index";
import type { Network } from "../../network/index";
import type { AnalyseOptions } from "../analyse";
import { type Budget, isOutOfBudget } from "../budget";
import { kineticsRing } from "../kinetics";
import { SteadyStateInputError } from "../order";
import { testRelation, type RelationResult } from "../relation";
import { stageReport, type StageReport } from "./stage";
import type { StructurePart } from "./structure";
import type { SystemPart } from "./system";

export interface RelationsPart {
  readonly relations: RelationResult[];
}

export function relationsStage(network: Network, options: AnalyseOptions, s: StructurePart, sys: SystemPart, budget: Budget): RelationsPart & StageReport {
  const report = stageReport();
  const relations: RelationResult[] = [];
  const { laws } = s;
  const { totals } = sys;
  for (const text of options.relations ?? []) {
    try {
      budget.progress("relations", `testing ${text}`);
      const totalNames = kineticsRing(network, { speciesOrder: s.species, totalCount: laws.length }).totals;
      const relationTotals = laws.length > 0 ? { names: totalNames, laws: s.noTotals.conservationLaws, values: totals && totals.length > 0 ? totals : null } : undefined;
      relations.push(testRelation(text, s.kin, s.odeRows, budget.groebner(0.5, "relations"), relationTotals));
    } catch (e) {
      if (e instanceof AlgebraError && e.code === "parse") throw new SteadyStateInputError({ kind: "relation-syntax", relation: text, detail: e.message });
      if (!isOutOfBudget(e)) throw e;
      report.ranOut("relations", e);
      report.warnings.push(`Relation ${text} not decided: ${(e as Error).message}.`);
    }
  }
  return { relations, warnings: report.warnings, unfinished: report.unfinished };
}
