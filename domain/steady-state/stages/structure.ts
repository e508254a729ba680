/**
 * Stage 1, structure: the network's structure (complexes, deficiency, conservation laws), the
 * elimination order, and the kinetics ring with the mass-action ODEs without totals. Checks the
 * user's order and initial concentrations against the species (typed SteadyStateInputError).
 */
import { analyseStructure, type Network, type NetworkStructure } from "../../network/index";
import type { AnalyseOptions } from "../analyse";
import { kineticsRing, type KineticsRing, type QPoly } from "../kinetics";
import { defaultOrder, resolveOrder, SteadyStateInputError } from "../order";
import { steadyStateSystem, type SteadyStateSystem } from "../system";
import type { StageReport } from "./stage";

export interface StructurePart {
  readonly structure: NetworkStructure;
  readonly suggested: ReturnType<typeof defaultOrder>;
  /** The elimination order in force (the user's, completed by the default). */
  readonly species: string[];
  /** Conservation laws as integer vectors aligned with network.species. */
  readonly laws: bigint[][];
  /** The ring without total symbols; rate constants with values are substituted. */
  readonly kin: KineticsRing;
  /** The steady-state system without totals (the ODEs and which rows are kept). */
  readonly noTotals: SteadyStateSystem;
  /** The kept ODE rows: what the parametrisation, ACR and relation tests work on. */
  readonly odeRows: QPoly[];
}

export function structureStage(network: Network, options: AnalyseOptions): StructurePart & StageReport {
  const structure = analyseStructure(network);
  const suggested = defaultOrder(network, structure.conservationLaws);
  const species = options.order ? resolveOrder(options.order, suggested.order) : suggested.order;
  if (options.initial)
    for (const s of options.initial.keys())
      if (!network.species.includes(s)) throw new SteadyStateInputError({ kind: "unknown-species", input: "initial", name: s, species: network.species });
  const laws = structure.conservationLaws.map((law) => network.species.map((s) => BigInt(law[s] ?? 0)));
  const kin = kineticsRing(network, { speciesOrder: species });
  const noTotals = steadyStateSystem(network, kin, laws, null);
  const odeRows = noTotals.keptRows.map((i) => noTotals.odes[i]);
  return { structure, suggested, species, laws, kin, noTotals, odeRows, warnings: [...structure.warnings], unfinished: [] };
}
