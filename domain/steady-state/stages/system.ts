/**
 * Stage 2, steady-state system: the class (fixed by the initial concentrations, or the whole
 * space when nothing is conserved) and the square steady-state system with its conservation
 * equations, numeric totals or total symbols.
 */
import type { Network } from "../../network/index";
import type { AnalyseOptions } from "../analyse";
import { kineticsRing, type KineticsRing } from "../kinetics";
import { steadyStateSystem, totalsFromInitial, type SteadyStateSystem } from "../system";
import type { StageReport } from "./stage";
import type { StructurePart } from "./structure";

export interface SystemPart {
  /** Every rate constant (and constant species) has a value. */
  readonly numericRates: boolean;
  /** The totals of the class, or null when they stay symbolic. */
  readonly totals: ReturnType<typeof totalsFromInitial> | null;
  readonly classGiven: boolean;
  readonly numericClass: boolean;
  /** The ring with the total symbols when the totals are symbolic (else the stage-1 ring). */
  readonly kinT: KineticsRing;
  readonly withTotals: SteadyStateSystem;
}

export function systemStage(network: Network, options: AnalyseOptions, s: StructurePart): SystemPart & StageReport {
  const { kin, laws, species } = s;
  const warnings = [
    "Only positive steady states are analysed: the steady-state ideal is saturated by the product of the species, which removes every solution with a zero concentration.",
  ];
  // An open network's steady states do not depend on where it starts: no law, no totals to give.
  const numericRates = kin.rateParameters.length === 0;
  const totals = options.initial ? totalsFromInitial(laws, network.species, options.initial) : laws.length === 0 ? [] : null;
  const classGiven = totals !== null;
  const numericClass = classGiven && numericRates;
  const kinT = totals ? kin : kineticsRing(network, { speciesOrder: species, totalCount: laws.length });
  const withTotals = steadyStateSystem(network, kinT, laws, totals);
  return { numericRates, totals, classGiven, numericClass, kinT, withTotals, warnings, unfinished: [] };
}
