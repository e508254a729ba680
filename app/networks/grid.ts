import Papa from "papaparse";
import { NETWORK_COLUMNS, type NetworkColumn, type NetworkFileProblem, tryParseNetworkCsv } from "@domain/network/index";
import { readCsvTable } from "@domain/network/csv-table";
import { CONSTANT_DIRECTIVE } from "@domain/network/constant-species";
import { INITIAL_DIRECTIVE } from "@domain/network/initial-values";

/**
 * The editor's form grid and its round trip to our CSV format. Runs in the browser (preview)
 * and on the server; validation is always the domain parser on the CSV the grid writes, so the
 * browser and the server report the same problems. The grid writes the header on line 1 and
 * grid row i on line i + 2, which is how problems are mapped back to rows. The constant species
 * (one text field, `A = 2, ATP`) are written as a `# constant:` line after the last row, so they
 * shift no row's line; their problems are reported apart (column `constant`). The initial values
 * (`X = 1, Y = 1/2`) likewise, as a `# initial:` line (column `initial`).
 */

export type GridCells = Record<NetworkColumn, string>;
export interface GridRow extends GridCells {
  /** Stable React key. */
  key: string;
  /** Line in the uploaded file this row came from, if any. */
  sourceLine?: number;
}

/** Largest network file accepted, in bytes (browser and server). */
export const MAX_CSV_BYTES = 256 * 1024;
export const MAX_CSV_LABEL = "256 KB";

let counter = 0;
const nextKey = () => `r${Date.now().toString(36)}${(counter++).toString(36)}`;

export function emptyRow(): GridRow {
  return { key: nextKey(), reaction: "", label: "", rate: "", reverse_rate: "", rate_value: "", reverse_rate_value: "" };
}

/** Cells are single-line inputs; a pasted newline would shift every later line number. */
const oneLine = (s: string) => s.replace(/[\r\n]+/g, " ").trim();

/**
 * CSV text of the grid: header with the columns in use (always `reaction`), one line per row, then
 * the constant species' declaration and the initial values when given. Example: rows [A + X -> 2X],
 * constants "A = 2" and initial "X = 1" give `reaction` / `A + X -> 2X` / `# constant: A = 2` / `# initial: X = 1`.
 */
export function gridToCsv(rows: readonly GridCells[], constants = "", initial = ""): string {
  const used = NETWORK_COLUMNS.filter((c) => c === "reaction" || rows.some((r) => oneLine(r[c]) !== ""));
  const data = rows.map((r) => used.map((c) => oneLine(r[c])));
  const declaration = oneLine(constants) === "" ? "" : `# constant: ${oneLine(constants)}\n`;
  const start = oneLine(initial) === "" ? "" : `# initial: ${oneLine(initial)}\n`;
  return Papa.unparse({ fields: [...used], data }, { newline: "\n" }) + "\n" + declaration + start;
}

export interface LoadedGrid {
  rows: GridRow[];
  /** The entries of every `# constant:` line, joined by `, ` (e.g. `A = 2, ATP`), or "". */
  constants: string;
  /** The entries of every `# initial:` line, joined by `, ` (e.g. `X = 1, Y = 1/2`), or "". */
  initial: string;
  /** Things the grid could not keep (unknown columns, unreadable header), in plain words. */
  notices: string[];
  /**
   * Data of the file the grid has no place for: each unknown column by name (its cells would be
   * lost, e.g. rate names under `rate_constant`), or the extra cells of a file without a header.
   * The editor refuses such a file rather than load it without them.
   */
  dropped: NetworkFileProblem[];
}

/**
 * Reads a file's text into grid rows, keeping each row's line in the file. Unknown columns are
 * left out with a notice; bad cells are kept as written so the person can fix them in the grid.
 */
export function csvToGrid(text: string): LoadedGrid {
  const table = readCsvTable(text);
  const notices: string[] = [];
  const entriesOf = (directive: RegExp) =>
    table.comments
      .filter((c) => directive.test(c.text))
      .map((c) => c.text.replace(directive, "").trim())
      .filter((t) => t !== "")
      .join(", ");
  const constants = entriesOf(CONSTANT_DIRECTIVE);
  const initial = entriesOf(INITIAL_DIRECTIVE);
  // Other comments have no place in the grid: say so rather than lose them unseen.
  const commentNotices: string[] = [];
  for (const c of table.comments)
    if (!CONSTANT_DIRECTIVE.test(c.text) && !INITIAL_DIRECTIVE.test(c.text)) commentNotices.push(`The comment on line ${c.line} (\`${c.text.trim().slice(0, 80)}\`) is not kept by the grid.`);
  if (!table.header) return { rows: [emptyRow()], constants, initial, notices: ["The file is empty: start typing reactions below.", ...commentNotices], dropped: [] };
  const columnOf = new Map<number, NetworkColumn>();
  const dropped: NetworkFileProblem[] = [];
  const hasData = (j: number) => table.rows.some((r) => (r.cells[j] ?? "") !== "");
  table.header.cells.forEach((cell, j) => {
    const name = cell.toLowerCase();
    if ((NETWORK_COLUMNS as readonly string[]).includes(name) && ![...columnOf.values()].includes(name as NetworkColumn)) {
      columnOf.set(j, name as NetworkColumn);
    } else if (cell !== "" || hasData(j)) {
      const what = cell === "" ? "a column without a name" : `unknown column \`${cell}\``;
      notices.push(`Column \`${cell}\` (line ${table.header!.line}, column ${j + 1}) is not one of ${NETWORK_COLUMNS.join(", ")}; it was left out.`);
      dropped.push({ row: table.header!.line, columnIndex: j + 1, column: cell, message: `${what}: the grid has no place for its cells`, expected: `one of ${NETWORK_COLUMNS.join(", ")} (rename the column, or delete it if its cells are not needed)` });
    }
  });
  let rowsIn = table.rows;
  if (![...columnOf.values()].includes("reaction")) {
    // No usable header: read every line (the first included) as reaction text in column 1.
    notices.length = 0;
    dropped.length = 0;
    notices.push(`Line ${table.header.line} is not a header naming a \`reaction\` column; every line was read as a reaction in the first column.`);
    columnOf.clear();
    columnOf.set(0, "reaction");
    rowsIn = [table.header, ...table.rows];
    const extra = rowsIn.filter((l) => l.cells.slice(1).some((c) => c !== ""));
    if (extra.length > 0) {
      dropped.push({
        row: extra[0]!.line,
        columnIndex: 2,
        message: `the file has no header naming its columns, and ${extra.length === 1 ? "line" : "lines"} ${extra.slice(0, 5).map((l) => l.line).join(", ")}${extra.length > 5 ? ", …" : ""} ${extra.length === 1 ? "has" : "have"} cells after the reaction that could only be guessed at`,
        expected: `a first line naming the columns, such as \`${NETWORK_COLUMNS.slice(0, 3).join(",")}\``,
      });
    }
  }
  const rows = rowsIn.map((line) => {
    const row: GridRow = { ...emptyRow(), sourceLine: line.line };
    for (const [j, c] of columnOf) row[c] = line.cells[j] ?? "";
    return row;
  });
  for (const p of table.problems) notices.push(`Line ${p.row}: ${p.message}.`);
  return { rows: rows.length > 0 ? rows : [emptyRow()], constants, initial, notices: [...notices, ...commentNotices], dropped };
}

export interface GridCheck {
  ok: boolean;
  csv: string;
  /** Problems of the header or the whole table (not tied to one row). */
  general: NetworkFileProblem[];
  /** Problems per grid row index. */
  byRow: Map<number, NetworkFileProblem[]>;
  /** Problems of the constant species' declaration. */
  constants: NetworkFileProblem[];
  /** Problems of the initial values. */
  initial: NetworkFileProblem[];
  count: number;
}

/** Validates the grid with the domain parser and maps each problem to its grid row. */
export function checkGrid(rows: readonly GridCells[], constantsText = "", initialText = ""): GridCheck {
  const csv = gridToCsv(rows, constantsText, initialText);
  const result = tryParseNetworkCsv(csv);
  const general: NetworkFileProblem[] = [];
  const byRow = new Map<number, NetworkFileProblem[]>();
  const constants: NetworkFileProblem[] = [];
  const initial: NetworkFileProblem[] = [];
  if (!result.ok) {
    for (const p of result.problems) {
      const index = p.row - 2;
      if (p.column === "constant") constants.push(p);
      else if (p.column === "initial") initial.push(p);
      else if (index >= 0 && index < rows.length) byRow.set(index, [...(byRow.get(index) ?? []), p]);
      else general.push(p);
    }
  }
  return { ok: result.ok, csv, general, byRow, constants, initial, count: result.ok ? 0 : result.problems.length };
}

/** Moves row `from` to `to` (both indexes into the same array); returns a new array. */
export function moveRow<T>(rows: readonly T[], from: number, to: number): T[] {
  if (to < 0 || to >= rows.length || from === to) return [...rows];
  const next = [...rows];
  const [row] = next.splice(from, 1);
  next.splice(to, 0, row!);
  return next;
}
