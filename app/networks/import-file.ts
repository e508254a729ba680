/**
 * Network files other than our CSV (SBML, reaction lists) turned into the CSV a version stores,
 * with the domain's readers. Runs in the browser (upload into the editor) and on the server
 * (the JSON API), so both give the same located problems.
 */
import { formatFromName, readNetworkDocument, type NetworkFileProblem, type NetworkFormat } from "@domain/network/index";
import { readSbml, type SbmlReactionReport } from "@domain/network/sbml/index";

export type ImportResult =
  | { ok: true; format: NetworkFormat; csv: string; notes: string[] }
  | { ok: false; format: NetworkFormat; message: string; problems: NetworkFileProblem[]; reactions?: SbmlReactionReport[]; notes: string[] };

const SBML_TYPES = ["application/sbml+xml", "application/xml", "text/xml"];

/**
 * Which reader a file needs: the extension (`.xml`/`.sbml`, `.txt`, `.csv`), else an XML content
 * type or text that starts with `<` means SBML; everything else stays our CSV (so a CSV without a
 * header still gets the CSV's own message). Example: importFormat("a.TXT", "", "A -> B") is "text".
 */
export function importFormat(fileName: string | undefined, contentType: string | undefined, text: string): NetworkFormat {
  const byName = fileName ? formatFromName(fileName) : undefined;
  if (byName) return byName;
  if (contentType && SBML_TYPES.some((t) => contentType.toLowerCase().startsWith(t))) return "sbml";
  return text.replace(/^\uFEFF/, "").trimStart().startsWith("<") ? "sbml" : "csv";
}

/**
 * Reads SBML or a reaction list into our CSV. Held species and initial concentrations travel in the
 * CSV's `# constant:` and `# initial:` lines, so nothing of the file's network is dropped.
 * Example: importNetworkText("A -> B, k = 2\n", "text") is { ok: true, csv: "reaction,label,rate,rate_value\nA -> B,,k,2\n", … }.
 */
export function importNetworkText(text: string, format: NetworkFormat): ImportResult {
  const r = readNetworkDocument(text, format);
  const what = format === "sbml" ? "SBML file" : format === "text" ? "reaction list" : "network file";
  if (!r.ok) {
    const n = r.problems.length;
    return {
      ok: false,
      format,
      message: `The ${what} has ${n} problem${n === 1 ? "" : "s"}; nothing was saved.`,
      problems: [...r.problems],
      ...(format === "sbml" ? { reactions: [...readSbml(text).reactions] } : {}),
      notes: [...r.notes],
    };
  }
  return { ok: true, format, csv: r.document.csv, notes: [...r.document.notes] };
}
