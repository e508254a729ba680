import { formatRational } from "../algebra/rational";
import {
  NETWORK_FORMATS,
  NetworkFileError,
  formatFromName,
  readNetworkDocument,
  sniffFormat,
  type NetworkDocument,
  type NetworkFormat,
} from "../network/index";
import { CliError, readInput, type CliIO } from "./io";

/** `--from` checked, else the extension, else the content decides. Example: ("m.xml", undefined, …) → "sbml". */
export function inputFormat(path: string, from: string | undefined, text: string): NetworkFormat {
  if (from !== undefined) {
    if (!(NETWORK_FORMATS as readonly string[]).includes(from)) throw new CliError(`--from expects one of ${NETWORK_FORMATS.join(", ")}, not '${from}'`);
    return from as NetworkFormat;
  }
  return formatFromName(path) ?? sniffFormat(text);
}

/** Reads a network file of any of our formats; every problem ends as one CliError listing them with their lines. */
export function readNetworkFile(io: CliIO, path: string, from?: string): NetworkDocument {
  const text = readInput(io, path);
  const format = inputFormat(path, from, text);
  const r = readNetworkDocument(text, format);
  if (!r.ok) {
    const notes = r.notes.length > 0 ? `\n${r.notes.map((n) => `  note: ${n}`).join("\n")}` : "";
    // CSV errors read as before; the other formats say which reader spoke.
    throw new CliError(`${format === "csv" ? "" : `${path} (${format === "sbml" ? "SBML" : "reaction list"}): `}${new NetworkFileError(r.problems).message}${notes}`);
  }
  return r.document;
}

/** `E=1, S=1/2` for a stderr note. */
export const formatInitial = (m: ReadonlyMap<string, { num: bigint; den: bigint }>): string =>
  [...m].map(([s, v]) => `${s}=${formatRational(v)}`).join(",");
