import { SPECIES_NAME } from "./complex";
import type { NetworkFileProblem } from "./errors";

/**
 * The shared grammar of the species directives of a network file, comment lines such as
 *
 *   # constant: A = 2, ATP
 *   # initial: X = 1, Y = 1/2
 *
 * `KEY:` then entries separated by `,`, each `NAME` or `NAME = VALUE`. This reader splits a line
 * into entries and checks only the grammar (empty line, empty entry, a name that is no species
 * name, a second declaration of a name); what a value must be is the caller's rule
 * (constant-species.ts, initial-values.ts). Problems are located by line and character column,
 * with the directive's key as the column name.
 *
 * Example: readDirectiveEntries([{ line: 1, text: "# initial: X = 1, Y" }], /^#\s*initial\s*:/, "initial", …)
 * gives the entries X (value text "1", column 12) and Y (no value, column 19).
 */
export interface DirectiveEntry {
  readonly name: string;
  /** The text after `=`, trimmed; absent for a bare name. */
  readonly valueText?: string;
  readonly line: number;
  /** 1-based character column of the entry in its line. */
  readonly column: number;
}

export interface DirectiveWording {
  /** The column name of its problems, also the key of the directive: `constant`, `initial`. */
  readonly key: string;
  /** What an entry looks like, for `expected`. */
  readonly expected: string;
  /** How a repeated name is put: `declared constant twice`. */
  readonly twice: string;
  /** The rule a repeated name breaks: `each constant species declared once`. */
  readonly once: string;
}

export function readDirectiveEntries(
  comments: readonly { readonly line: number; readonly text: string }[],
  directive: RegExp,
  wording: DirectiveWording,
): { entries: DirectiveEntry[]; problems: NetworkFileProblem[] } {
  const entries: DirectiveEntry[] = [];
  const problems: NetworkFileProblem[] = [];
  for (const c of comments) {
    const head = directive.exec(c.text);
    if (!head) continue;
    let offset = head[0].length;
    const body = c.text.slice(offset);
    if (body.trim() === "") {
      problems.push({ row: c.line, column: wording.key, columnIndex: offset + 1, message: `the \`# ${wording.key}:\` line names no species`, expected: wording.expected });
      continue;
    }
    for (const part of body.split(",")) {
      const lead = part.length - part.trimStart().length;
      const column = offset + lead + 1;
      offset += part.length + 1;
      const entry = part.trim();
      const at = { row: c.line, column: wording.key, columnIndex: column };
      if (entry === "") {
        problems.push({ ...at, message: `empty entry in the \`# ${wording.key}:\` line`, expected: wording.expected });
        continue;
      }
      const m = /^([^=\s]+)\s*(?:=\s*(.*))?$/.exec(entry);
      const name = m?.[1] ?? entry;
      if (!m || !SPECIES_NAME.test(name)) {
        problems.push({ ...at, message: `\`${entry}\` is not a species declaration`, expected: wording.expected });
        continue;
      }
      const before = entries.find((d) => d.name === name);
      if (before) {
        problems.push({
          ...at,
          message: `\`${name}\` is ${wording.twice} (first on line ${before.line}, column ${before.column})`,
          expected: wording.once,
        });
        continue;
      }
      entries.push({ name, ...(m[2] !== undefined ? { valueText: m[2].trim() } : {}), line: c.line, column });
    }
  }
  return { entries, problems };
}
