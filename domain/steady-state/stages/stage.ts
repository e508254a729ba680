/**
 * What every stage of the steady-state analysis hands back beside its typed part: the warnings it
 * raised and the phases it could not finish, in the order they happened. analyse.ts concatenates
 * them stage after stage, so the result lists them in the order the stages ran.
 */
import type { UnfinishedStage } from "../analyse";

export interface StageReport {
  readonly warnings: string[];
  readonly unfinished: UnfinishedStage[];
}

/** A fresh report for one stage, with `ranOut` recording a phase stopped by the budget. */
export function stageReport(): StageReport & { ranOut: (stage: UnfinishedStage["stage"], e: unknown) => void } {
  const warnings: string[] = [];
  const unfinished: UnfinishedStage[] = [];
  return { warnings, unfinished, ranOut: (stage, e) => unfinished.push({ stage, reason: (e as Error).message }) };
}
