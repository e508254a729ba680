/**
 * A network file checked cheaply (parse and size limits, linear in the file: what the web server
 * does on upload) and its structure by the domain's analyseStructure (the same function the CLI's
 * `analyse --json` uses: what the worker does, structure-store.server.ts).
 */
import {
  analyseStructure,
  type Network,
  networkLimitProblems,
  type NetworkFileProblem,
  type NetworkStructure,
  tryParseNetworkCsv,
} from "@domain/network/index";
import { LruMap } from "~/components/render-cache";
import { massActionTerms, type SpeciesOde } from "@domain/steady-state/ode-terms";
import { contentHash } from "./networks.server";

export type FileCheck = { ok: true; network: Network } | { ok: false; problems: readonly NetworkFileProblem[] };
export type CsvAnalysis = { ok: true; structure: NetworkStructure } | { ok: false; problems: readonly NetworkFileProblem[] };

const checked = new LruMap<FileCheck>(1000);

/**
 * Parses the file and checks the limits; no algebra (milliseconds even for the largest allowed
 * file). Remembered by content hash: the lab's list parses every network's newest version on each view.
 */
export function checkNetworkFile(csv: string): FileCheck {
  return checked.getOrCompute(contentHash(csv), () => checkUncached(csv));
}

function checkUncached(csv: string): FileCheck {
  const parsed = tryParseNetworkCsv(csv);
  if (!parsed.ok) return { ok: false, problems: parsed.problems };
  // Cheap size checks before any algebra: structure grows much faster than the file.
  const tooLarge = networkLimitProblems(parsed.network);
  if (tooLarge.length > 0) return { ok: false, problems: tooLarge };
  return { ok: true, network: parsed.network };
}

/** The structure of a file that passes checkNetworkFile. Up to about a second at the limits: the worker's job. */
export function analyseCsv(csv: string): CsvAnalysis {
  const checked = checkNetworkFile(csv);
  if (!checked.ok) return checked;
  return { ok: true, structure: analyseStructure(checked.network) };
}

const odes = new LruMap<SpeciesOde[]>(1000);

/**
 * The mass-action ODEs of a stored version, from the domain's one builder (rate constants
 * symbolic). Only writes the polynomials, no structure or elimination: cheap enough for the
 * request, and remembered by content hash like the file check.
 */
export function odesOf(csv: string): SpeciesOde[] {
  return odes.getOrCompute(contentHash(csv), () => {
    const file = checkNetworkFile(csv);
    if (!file.ok) throw new Error(`stored network version does not parse: ${file.problems[0]?.message}`);
    return massActionTerms(file.network);
  });
}

/** The few numbers the lab's list shows and filters on. */
export interface StructureSummary {
  species: string[];
  speciesCount: number;
  reactionCount: number;
  deficiency: number;
  weaklyReversible: boolean;
}

export function summaryOf(s: NetworkStructure): StructureSummary {
  return { species: s.species, speciesCount: s.species.length, reactionCount: s.reactions, deficiency: s.deficiency, weaklyReversible: s.weaklyReversible };
}
