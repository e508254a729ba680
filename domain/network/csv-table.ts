import Papa from "papaparse";
import type { NetworkFileProblem } from "./errors";

export interface CsvLine {
  /** 1-based line number where the row starts. */
  readonly line: number;
  readonly cells: readonly string[];
}

export interface CsvTable {
  readonly delimiter: "," | ";";
  /** The first row that is neither blank nor a comment, or null for an empty file. */
  readonly header: CsvLine | null;
  readonly rows: readonly CsvLine[];
  /** Comment lines (first non-blank character `#`), as written, e.g. the `# constant: …` declaration. */
  readonly comments: readonly { readonly line: number; readonly text: string }[];
  readonly problems: readonly NetworkFileProblem[];
}

/**
 * Splits CSV text into located rows with papaparse, keeping each row's line number. Accepts `,`
 * or `;` (chosen from the header line), quoted fields, a byte-order mark, CRLF, blank lines and
 * lines whose first non-blank character is `#` (comments). Cells are trimmed.
 *
 * Example: readCsvTable("# note\nreaction\nA -> B\n") has header line 2 and one row on line 3.
 */
export function readCsvTable(input: string): CsvTable {
  const text = input.startsWith("\uFEFF") ? input.slice(1) : input;
  const lineStarts = lineStartOffsets(text);
  const lineAt = (offset: number): number => {
    let lo = 0;
    let hi = lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (lineStarts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };
  const delimiter = detectDelimiter(text);
  const problems: NetworkFileProblem[] = [];
  const located: CsvLine[] = [];
  const comments: { line: number; text: string }[] = [];
  let start = 0;
  Papa.parse<string[]>(text, {
    delimiter,
    skipEmptyLines: false,
    step: (result) => {
      const cursor = result.meta.cursor;
      const rowStart = start;
      start = cursor;
      const line = lineAt(Math.min(rowStart, Math.max(text.length - 1, 0)));
      if (/^[ \t]*#/.test(text.slice(rowStart, rowStart + 200))) {
        // A comment is kept whole, as one line of text (papaparse may have split it at commas).
        const end = line < lineStarts.length ? lineStarts[line] : text.length;
        comments.push({ line, text: text.slice(rowStart, end).replace(/\r?\n$|\r$/, "") });
        return;
      }
      const cells = (result.data as string[]).map((c) => c.trim());
      for (const e of result.errors) {
        problems.push({
          row: line,
          message:
            e.code === "MissingQuotes"
              ? "a quoted field is not closed"
              : e.code === "InvalidQuotes"
                ? "stray double quote inside a field"
                : `unreadable CSV (${e.message})`,
          expected: 'fields quoted as "…" with inner quotes doubled ("")',
        });
      }
      if (cells.every((c) => c === "")) return;
      located.push({ line, cells });
    },
  });
  const [header = null, ...rows] = located;
  return { delimiter, header, rows, comments, problems };
}

function lineStartOffsets(text: string): number[] {
  const starts = [0];
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === "\n") starts.push(i + 1);
    else if (ch === "\r" && text[i + 1] !== "\n") starts.push(i + 1);
  }
  return starts;
}

/** `;` when the first content line has more semicolons than commas outside quotes, else `,`. */
function detectDelimiter(text: string): "," | ";" {
  for (const raw of text.split(/\r\n|\n|\r/)) {
    const lineText = raw.trim();
    if (lineText === "" || lineText.startsWith("#")) continue;
    let commas = 0;
    let semis = 0;
    let quoted = false;
    for (const ch of lineText) {
      if (ch === '"') quoted = !quoted;
      else if (!quoted && ch === ",") commas++;
      else if (!quoted && ch === ";") semis++;
    }
    return semis > commas ? ";" : ",";
  }
  return ",";
}
