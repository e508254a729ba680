import Papa from "papaparse";

/**
 * Escaping of user-chosen text for the formats we export. One place, so every download of a
 * network or an analysis (also through share links) gets the same treatment.
 */

/** Every line break TeX (or an editor) might honour, and the other control characters. */
const BREAKS_AND_CONTROLS = /[\u0000-\u001f\u007f\u0085\u2028\u2029]+/g;

/**
 * Text for a `%` comment line of a TeX file: line breaks and control characters become one space,
 * so nothing after the `%` can start a live line; `^^` (TeX's notation for arbitrary characters,
 * e.g. `^^J`) is split so it cannot spell one either.
 *
 *   texCommentText("Name\n\\input{secret}")   // "Name \\input{secret}"
 */
export function texCommentText(text: string): string {
  return text.replace(BREAKS_AND_CONTROLS, " ").replace(/\^\^/g, "^ ^");
}

/**
 * Plain text inside a LaTeX paragraph or heading: TeX's special characters escaped, line breaks
 * and control characters folded to a space (a blank line inside `\section*{…}` would end it).
 *
 *   latexText("50% & more")   // "50\\% \\& more"
 */
export function latexText(text: string): string {
  return text
    .replace(BREAKS_AND_CONTROLS, " ")
    .replace(/[\\{}&%$#_^~]/g, (ch) =>
      ch === "\\" ? "\\textbackslash{}" : ch === "^" ? "\\textasciicircum{}" : ch === "~" ? "\\textasciitilde{}" : `\\${ch}`,
    );
}

const PLAIN_NUMBER = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/;

/**
 * A CSV cell a spreadsheet will not execute. Cells starting with `=`, `+`, `-`, `@`, a tab or a
 * carriage return are read as formulas by common spreadsheet programs; such a cell gets a leading
 * apostrophe (the usual mitigation: the program shows the text, the apostrophe is not displayed).
 * Plain numbers such as `-1` or `+2.5e-3` are left alone; they are data, not formulas.
 *
 *   csvCell("=HYPERLINK(\"http://x\")")   // "'=HYPERLINK(\"http://x\")"
 *   csvCell("-1")                          // "-1"
 */
export function csvCell<T>(value: T): T | string {
  if (typeof value !== "string") return value;
  if (!/^[=+\-@\t\r]/.test(value) || PLAIN_NUMBER.test(value)) return value;
  return `'${value}`;
}

/** csvCell over every cell of a table (arrays of rows or objects keyed by column). */
export function csvRows<R extends readonly unknown[] | Record<string, unknown>>(rows: R[]): R[] {
  return rows.map((row) =>
    (Array.isArray(row) ? row.map(csvCell) : Object.fromEntries(Object.entries(row).map(([k, v]) => [k, csvCell(v)]))) as R,
  );
}

/**
 * A CSV table from rows keyed by column, header included, every cell through csvCell; one line
 * per row ending in "\n" (missing values are empty cells).
 *
 *   csvTable(["species", "value"], [{ species: "=A", value: -1 }])   // "species,value\n'=A,-1\n"
 */
export function csvTable(columns: readonly string[], rows: readonly Record<string, unknown>[]): string {
  const fields = columns.map((c) => String(csvCell(c)));
  const data = rows.map((row) => columns.map((c) => csvCell(row[c] ?? "")));
  return Papa.unparse({ fields, data }, { newline: "\n" }) + "\n";
}

/**
 * A whole CSV text with every cell passed through csvCell (for files another module formats,
 * such as the network file). Returns the text unchanged when no cell needs it.
 */
export function csvTextSafe(csv: string): string {
  const parsed = Papa.parse<string[]>(csv, { header: false, skipEmptyLines: false });
  const rows = parsed.data;
  if (!rows.some((row) => row.some((cell) => csvCell(cell) !== cell))) return csv;
  const trailing = csv.endsWith("\n") ? "\n" : "";
  const kept = trailing && rows.length > 0 && rows[rows.length - 1]!.length === 1 && rows[rows.length - 1]![0] === "" ? rows.slice(0, -1) : rows;
  return Papa.unparse(csvRows(kept), { newline: "\n" }) + trailing;
}
