import { formatRational, parseRational, type Rational } from "../algebra/rational";
import { makeComplex, type Complex } from "./complex";
import type { NetworkFileProblem } from "./errors";
import type { ConstantSpecies } from "./model";
import { readDirectiveEntries } from "./directive";
import { rateValueWithinLimits as withinLimits } from "./limits";

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
  const { entries, problems } = readDirectiveEntries(comments, CONSTANT_DIRECTIVE, {
    key: "constant",
    expected: EXPECTED_ENTRY,
    twice: "declared constant twice",
    once: "each constant species declared once",
  });
  const declared: DeclaredConstant[] = [];
  for (const e of entries) {
    let value: Rational | undefined;
    if (e.valueText !== undefined) {
      const v = withinLimits(e.valueText) ? parseRational(e.valueText) : null;
      if (v === null || v.num <= 0n) {
        problems.push({
          row: e.line,
          column: "constant",
          columnIndex: e.column,
          message: e.valueText === "" ? `no value after \`${e.name} =\`` : `the concentration \`${e.valueText}\` of \`${e.name}\` is not a positive number`,
          expected: "a positive decimal such as 2 or 0.5, or a fraction such as 3/2 (or leave out `= …` for a symbolic concentration)",
        });
        continue;
      }
      value = v;
    }
    declared.push({ name: e.name, ...(value !== undefined ? { value } : {}), line: e.line, column: e.column });
  }
  return { declared, problems: problems.sort((a, b) => a.row - b.row || (a.columnIndex ?? 0) - (b.columnIndex ?? 0)) };
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
