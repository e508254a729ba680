import { formatRational, parseRational, type Rational } from "../algebra/rational";
import { readDirectiveEntries } from "./directive";
import type { NetworkFileProblem } from "./errors";
import { rateValueWithinLimits } from "./limits";
import type { InitialValue } from "./model";

/**
 * Initial concentrations stored with a version: a comment line of the network file
 *
 *   # initial: E = 1, S = 10, C = 0, P = 1/2
 *
 * read like `# constant:` (constant-species.ts explains why a comment line; directive.ts has the
 * grammar). Every entry needs a value: a concentration ≥ 0 as a decimal or a fraction. Zero is
 * allowed, unlike for a held species, because a product that starts absent is the usual case
 * (and SBML files say so with initialConcentration="0"). The values are the default starting
 * point of analyses and time courses; the network itself (species, reactions, structure) does not
 * depend on them. Checked against the reactions by the parser: every name must be a species of a
 * reaction and not held constant (a held species' value is on the `# constant:` line).
 *
 * Example: readInitialDeclarations([{ line: 1, text: "# initial: X = 1/2" }]) gives X = 1/2 at column 12.
 */
export const INITIAL_DIRECTIVE = /^[ \t]*#[ \t]*initial[ \t]*:/i;

const EXPECTED_ENTRY = "`NAME = VALUE` with a concentration ≥ 0 such as 1, 0.5 or 3/2, entries separated by `,`";
const EXPECTED_VALUE = "a decimal ≥ 0 such as 1 or 0.5, or a fraction such as 3/2";

/** A declared initial value with its place in the file, before it is checked against the reactions. */
export interface DeclaredInitial extends InitialValue {
  /** 1-based character column of the entry in its line. */
  readonly column: number;
}

/** Reads every `# initial:` line; other comment lines are ignored. Problems are located by line and character column. */
export function readInitialDeclarations(comments: readonly { readonly line: number; readonly text: string }[]): {
  declared: DeclaredInitial[];
  problems: NetworkFileProblem[];
} {
  const { entries, problems } = readDirectiveEntries(comments, INITIAL_DIRECTIVE, {
    key: "initial",
    expected: EXPECTED_ENTRY,
    twice: "given an initial value twice",
    once: "one initial value per species",
  });
  const declared: DeclaredInitial[] = [];
  for (const e of entries) {
    const at = { row: e.line, column: "initial", columnIndex: e.column };
    if (e.valueText === undefined || e.valueText === "") {
      problems.push({ ...at, message: `no initial value for \`${e.name}\``, expected: `\`${e.name} = VALUE\` with ${EXPECTED_VALUE}` });
      continue;
    }
    const v = rateValueWithinLimits(e.valueText) ? parseRational(e.valueText) : null;
    if (v === null) {
      problems.push({ ...at, message: `the initial value \`${e.valueText}\` of \`${e.name}\` is not a number`, expected: EXPECTED_VALUE });
      continue;
    }
    if (v.num < 0n) {
      problems.push({ ...at, message: `the initial value \`${e.valueText}\` of \`${e.name}\` is negative`, expected: EXPECTED_VALUE });
      continue;
    }
    declared.push({ name: e.name, value: v, line: e.line, column: e.column });
  }
  return { declared, problems: problems.sort((a, b) => a.row - b.row || (a.columnIndex ?? 0) - (b.columnIndex ?? 0)) };
}

/** The declaration line the writers put before the header. Example: `# initial: X = 1, Y = 1/2`. */
export function formatInitialDeclaration(initial: readonly InitialValue[]): string {
  return `# initial: ${initial.map((c) => `${c.name} = ${formatRational(c.value)}`).join(", ")}`;
}

/** The initial values as a map, species → value. Example: `# initial: X = 1` → Map { X → 1 }. */
export function initialMapOf(network: { readonly initial?: readonly InitialValue[] }): Map<string, Rational> {
  return new Map((network.initial ?? []).map((i) => [i.name, i.value]));
}
