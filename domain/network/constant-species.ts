import { formatRational, parseRational, type Rational } from "../algebra/rational";
import { SPECIES_NAME, makeComplex, type Complex } from "./complex";
import type { NetworkFileProblem } from "./errors";
import type { ConstantSpecies } from "./model";

/**
 * The declaration of constant species in a network file: a comment line
 *
 *   # constant: A = 2, ATP = 1/2, ADP
 *
 * anywhere in the file (the writer puts it before the header). `NAME = VALUE` holds the species at
 * that positive concentration; a bare `NAME` holds it at a symbolic concentration, a parameter
 * named like the species. Several such lines may be given.
 *
 * Why a comment line: the reactions table stays a plain CSV with one reaction per row, so any CSV
 * reader that skips `#` lines (papaparse's `comments: "#"` option, spreadsheets after deleting the
 * line) still reads the reactions, and an older reader of ours ignores the line rather than failing
 * on an unknown column. The declaration is about species, not about one reaction, so it does not
 * belong in a reaction row. Other comment lines (such as `# Restored from version 2 …`) stay free text.
 *
 * Holding a species constant is the usual reduction of an open (fed) reactor: the species is
 * removed from the state variables and its concentration enters the rate constants, as in
 * Schlögl, "Chemical reaction models for non-equilibrium phase transitions", Z. Physik 253 (1972),
 * who holds the reservoir species A and B fixed.
 *
 * Example: readConstantDeclarations([{ line: 1, text: "# constant: A = 2, B" }]) declares A at 2
 * and B symbolic.
 */
export const CONSTANT_DIRECTIVE = /^[ \t]*#[ \t]*constants?[ \t]*:/i;

const EXPECTED_ENTRY = "`NAME = VALUE` with a positive value such as 2, 0.5 or 3/2, or a bare `NAME` for a symbolic concentration, entries separated by `,`";

/** A declared constant with its place in the file, before it is checked against the reactions. */
export interface DeclaredConstant extends ConstantSpecies {
  /** 1-based character column of the entry in its line. */
  readonly column: number;
}

/** Reads every `# constant:` line; other comment lines are ignored. Problems are located by line and character column. */
export function readConstantDeclarations(comments: readonly { readonly line: number; readonly text: string }[]): {
  declared: DeclaredConstant[];
  problems: NetworkFileProblem[];
} {
  const declared: DeclaredConstant[] = [];
  const problems: NetworkFileProblem[] = [];
  for (const c of comments) {
    const head = CONSTANT_DIRECTIVE.exec(c.text);
    if (!head) continue;
    let offset = head[0].length;
    const body = c.text.slice(offset);
    if (body.trim() === "") {
      problems.push({ row: c.line, column: "constant", columnIndex: offset + 1, message: "the `# constant:` line names no species", expected: EXPECTED_ENTRY });
      continue;
    }
    for (const part of body.split(",")) {
      const lead = part.length - part.trimStart().length;
      const column = offset + lead + 1;
      offset += part.length + 1;
      const entry = part.trim();
      const at = { row: c.line, column: "constant", columnIndex: column };
      if (entry === "") {
        problems.push({ ...at, message: "empty entry in the `# constant:` line", expected: EXPECTED_ENTRY });
        continue;
      }
      const m = /^([^=\s]+)\s*(?:=\s*(.*))?$/.exec(entry);
      const name = m?.[1] ?? entry;
      if (!m || !SPECIES_NAME.test(name)) {
        problems.push({ ...at, message: `\`${entry}\` is not a species declaration`, expected: EXPECTED_ENTRY });
        continue;
      }
      let value: Rational | undefined;
      if (m[2] !== undefined) {
        const v = parseRational(m[2]);
        if (v === null || v.num <= 0n) {
          problems.push({
            ...at,
            message: m[2].trim() === "" ? `no value after \`${name} =\`` : `the concentration \`${m[2].trim()}\` of \`${name}\` is not a positive number`,
            expected: "a positive decimal such as 2 or 0.5, or a fraction such as 3/2 (or leave out `= …` for a symbolic concentration)",
          });
          continue;
        }
        value = v;
      }
      const before = declared.find((d) => d.name === name);
      if (before) {
        problems.push({
          ...at,
          message: `\`${name}\` is declared constant twice (first on line ${before.line}, column ${before.column})`,
          expected: "each constant species declared once",
        });
        continue;
      }
      declared.push({ name, ...(value !== undefined ? { value } : {}), line: c.line, column });
    }
  }
  return { declared, problems };
}

/** The declaration line the CSV writer puts before the header. Example: `# constant: A = 2, B`. */
export function formatConstantDeclaration(constants: readonly ConstantSpecies[]): string {
  return `# constant: ${constants.map((c) => (c.value ? `${c.name} = ${formatRational(c.value)}` : c.name)).join(", ")}`;
}

/** Splits a complex into its free part and its constant part. Example: `A + 2X` with A constant → [{ X: 2 }, { A: 1 }]. */
export function splitComplex(c: Complex, constant: ReadonlySet<string>): [free: Complex, held: Complex] {
  const entries = Object.entries(c);
  return [makeComplex(entries.filter(([s]) => !constant.has(s))), makeComplex(entries.filter(([s]) => constant.has(s)))];
}
