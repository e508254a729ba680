/**
 * Structure of a stored version, computed by the domain's analyseStructure (the same function the
 * CLI's `analyse --json` uses) and remembered by content hash: a version never changes, so
 * neither does its structure.
 */
import { analyseStructure, networkLimitProblems, type NetworkFileProblem, type NetworkStructure, parseNetworkCsv, tryParseNetworkCsv } from "@domain/network/index";
import { massActionTerms, type SpeciesOde } from "@domain/steady-state/ode-terms";
import { contentHash } from "./networks.server";

export type CsvAnalysis = { ok: true; structure: NetworkStructure } | { ok: false; problems: readonly NetworkFileProblem[] };

const cache = new Map<string, NetworkStructure>();
const CACHE_LIMIT = 500;

export function analyseCsv(csv: string): CsvAnalysis {
  const hash = contentHash(csv);
  const hit = cache.get(hash);
  if (hit) return { ok: true, structure: hit };
  const parsed = tryParseNetworkCsv(csv);
  if (!parsed.ok) return { ok: false, problems: parsed.problems };
  // Cheap size checks before any algebra: structure grows much faster than the file.
  const tooLarge = networkLimitProblems(parsed.network);
  if (tooLarge.length > 0) return { ok: false, problems: tooLarge };
  const structure = analyseStructure(parsed.network);
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!);
  cache.set(hash, structure);
  return { ok: true, structure };
}

/** For stored versions, which were validated on the way in. */
export function structureOf(csv: string): NetworkStructure {
  const result = analyseCsv(csv);
  if (!result.ok) throw new Error(`stored network version does not parse: ${result.problems[0]?.message}`);
  return result.structure;
}

/** The mass-action ODEs of a stored version, from the domain's one builder (rate constants symbolic). */
export function odesOf(csv: string): SpeciesOde[] {
  return massActionTerms(parseNetworkCsv(csv));
}

/** The few numbers the lab's list shows and filters on. */
export interface StructureSummary {
  species: string[];
  speciesCount: number;
  reactionCount: number;
  deficiency: number;
  weaklyReversible: boolean;
}

export function summaryOf(csv: string): StructureSummary {
  const s = structureOf(csv);
  return { species: s.species, speciesCount: s.species.length, reactionCount: s.reactions, deficiency: s.deficiency, weaklyReversible: s.weaklyReversible };
}
