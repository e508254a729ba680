import { textFileProblem } from "./text-file";
import type { Rational } from "../algebra/rational";
import type { NetworkFileProblem } from "./errors";
import type { Network } from "./model";
import { tryParseNetworkCsv } from "./parse-csv";
import { parseReactionList } from "./reaction-list";
import { readSbml } from "./sbml/read-sbml";
import { formatNetworkCsv } from "./format-csv";
import { initialMapOf } from "./initial-values";

/** The file kinds a network can be read from and written to. */
export const NETWORK_FORMATS = ["csv", "sbml", "text"] as const;
export type NetworkFormat = (typeof NETWORK_FORMATS)[number];

/** A network read from any of our formats, with what that format carried beside it. */
export interface NetworkDocument {
  readonly format: NetworkFormat;
  readonly network: Network;
  /** The network as our CSV, the stored form of a version. */
  readonly csv: string;
  /** Initial concentrations: the network's `# initial:` values (from SBML: its initial concentrations or amounts). */
  readonly initial: ReadonlyMap<string, Rational>;
  /** Remarks on the reading (SBML: renamed local parameters, unused species, …). */
  readonly notes: readonly string[];
}

/**
 * The format a file name says: `.xml`/`.sbml` → sbml, `.txt` → text, `.csv` → csv; undefined otherwise.
 * Example: formatFromName("model.SBML") is "sbml".
 */
export function formatFromName(name: string): NetworkFormat | undefined {
  const ext = /\.([A-Za-z]+)$/.exec(name)?.[1]?.toLowerCase();
  if (ext === "xml" || ext === "sbml") return "sbml";
  if (ext === "txt") return "text";
  if (ext === "csv") return "csv";
  return undefined;
}

/**
 * The format of a text without a name: XML is SBML; a first line naming the `reaction` column
 * is our CSV; anything else is a reaction list. Example: sniffFormat("A -> B, k1") is "text".
 */
export function sniffFormat(text: string): NetworkFormat {
  const body = text.replace(/^\uFEFF/, "").trimStart();
  if (body.startsWith("<")) return "sbml";
  const first = body.split(/\r?\n/).find((l) => l.trim() !== "" && !l.trimStart().startsWith("#")) ?? "";
  return /^\s*"?reaction"?\s*([,;]|$)/i.test(first) ? "csv" : "text";
}

/**
 * Reads a network in the given format with that format's located problems (CSV: line and column;
 * reaction list: line and part; SBML: line, element and id). Every route into a network goes
 * through our CSV parser, so the same checks hold whatever the file.
 *
 * Example: readNetworkDocument("A -> B, k = 1\n", "text") gives the CSV "reaction,label,rate,rate_value\nA -> B,,k,1\n".
 */
export function readNetworkDocument(
  text: string,
  format: NetworkFormat,
): { ok: true; document: NetworkDocument } | { ok: false; format: NetworkFormat; problems: readonly NetworkFileProblem[]; notes: readonly string[] } {
  // Binary or mis-decoded text gets one problem, whatever the format (the CSV parser checks it itself).
  const notText = format === "csv" ? null : textFileProblem(text);
  if (notText) return { ok: false, format, problems: [notText], notes: [] };
  switch (format) {
    case "csv": {
      const r = tryParseNetworkCsv(text);
      return r.ok ? { ok: true, document: { format, network: r.network, csv: text, initial: initialMapOf(r.network), notes: [] } } : { ok: false, format, problems: r.problems, notes: [] };
    }
    case "text": {
      const r = parseReactionList(text);
      return r.ok ? { ok: true, document: { format, network: r.network, csv: formatNetworkCsv(r.network), initial: initialMapOf(r.network), notes: [] } } : { ok: false, format, problems: r.problems, notes: [] };
    }
    case "sbml": {
      const r = readSbml(text);
      if (r.problems.length > 0 || !r.network || r.csv === undefined) return { ok: false, format, problems: r.problems, notes: r.notes };
      return { ok: true, document: { format, network: r.network, csv: r.csv, initial: r.initial, notes: r.notes } };
    }
  }
}
