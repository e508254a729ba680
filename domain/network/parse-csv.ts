import { formatRational, parseRational, eq, type Rational } from "../algebra/rational";
import { SPECIES_NAME, formatComplex, type Complex } from "./complex";
import { NETWORK_LIMITS, rateValueWithinLimits } from "./limits";
import { readCsvTable, type CsvLine } from "./csv-table";
import { NetworkFileError, type NetworkFileProblem } from "./errors";
import type { Arrow, ConstantSpecies, DirectedReaction, InitialValue, Network, NetworkRow } from "./model";
import { readConstantDeclarations, splitComplex, type DeclaredConstant } from "./constant-species";
import { readInitialDeclarations, type DeclaredInitial } from "./initial-values";
import { parseReactionText } from "./reaction-text";
import { textFileProblem } from "./text-file";
import { defaultRateName } from "./rate-names";

export const NETWORK_COLUMNS = ["reaction", "label", "rate", "reverse_rate", "rate_value", "reverse_rate_value"] as const;
export type NetworkColumn = (typeof NETWORK_COLUMNS)[number];

const EXPECTED_VALUE = "a positive decimal such as 0.5 or 2e-3, or a fraction such as 3/2";
const EXPECTED_SYMBOL = "a name starting with a letter, then letters, digits or `_` (e.g. `k1`, `kcat`), other than a built-in name such as `toString`";

interface RowDraft {
  readonly line: number;
  /** False when the row had a problem; its symbols and values are still checked. */
  readonly valid: boolean;
  readonly label?: string;
  readonly left: Complex;
  readonly arrow: Arrow;
  readonly right: Complex;
  readonly speciesInOrder: readonly string[];
  readonly rate?: string;
  readonly reverseRate?: string;
  readonly rateValue?: Rational;
  readonly reverseRateValue?: Rational;
}

/** Where a rate symbol or value was written, for error locations. */
interface CellRef {
  readonly line: number;
  readonly column: NetworkColumn;
  readonly columnIndex: number;
}

/**
 * Reads a network file (our CSV format) into a Network, or throws a NetworkFileError listing
 * every problem of the file with its line and column. Format (one reaction per row, header required):
 *
 *   reaction,label,rate,reverse_rate,rate_value,reverse_rate_value
 *   E + S <-> C,binding,kon,koff,1/2,0.1
 *   C -> E + P,,kcat,,3,
 *
 * Rows with `<->` give two directed reactions (left→right, then right→left); `<-` gives one
 * (right→left). A missing rate symbol gets the default `k<i>` where i is the 1-based index of
 * the directed reaction (`k<i>_2`, `k<i>_3`, … if that name is already taken). The same symbol
 * on several reactions means one shared rate constant; its values must agree.
 * A comment line `# constant: A = 2, B` holds species at a given or symbolic concentration (see
 * constant-species.ts): they leave the species list and the reactions' complexes, and stay in
 * `network.constants` and each reaction's `held` part. A comment line `# initial: X = 1, Y = 1/2`
 * stores initial concentrations (initial-values.ts) in `network.initial`. Other `#` lines are comments.
 * Format and checks are common practice for CSV input (RFC 4180 quoting).
 *
 * Example: parseNetworkCsv("reaction\nA <-> B\n") has species [A, B] and reactions
 * r1: A → B (rate k1) and r2: B → A (rate k2).
 */
export function parseNetworkCsv(text: string): Network {
  const result = tryParseNetworkCsv(text);
  if (!result.ok) throw new NetworkFileError(result.problems);
  return result.network;
}

/**
 * Like parseNetworkCsv, but returns the problems instead of throwing.
 * Example: tryParseNetworkCsv("reaction\nA -> A\n") is { ok: false, problems: [{ row: 2, column: "reaction", … }] }.
 */
export function tryParseNetworkCsv(
  text: string,
): { ok: true; network: Network } | { ok: false; problems: readonly NetworkFileProblem[] } {
  // A binary file or mis-decoded text: one clear problem, not a complaint per stray byte.
  const notText = textFileProblem(text);
  if (notText) return { ok: false, problems: [notText] };
  const table = readCsvTable(text);
  const problems: NetworkFileProblem[] = [...table.problems];
  if (!table.header) {
    problems.push({ row: 1, message: "the file has no header row and no reactions", expected: "a header such as `reaction,rate`" });
    return { ok: false, problems };
  }
  const columns = readHeader(table.header, problems);
  if (columns.reaction === undefined) {
    return { ok: false, problems: sortProblems(problems) };
  }
  const drafts: RowDraft[] = [];
  for (const row of table.rows) {
    drafts.push(readRow(row, columns, table.header.cells.length, problems));
  }
  if (table.rows.length === 0) {
    problems.push({
      row: table.header.line,
      column: "reaction",
      columnIndex: columns.reaction + 1,
      message: "the file has a header but no reactions",
      expected: "one reaction per row after the header",
    });
  }
  const constants = readConstantDeclarations(table.comments);
  problems.push(...constants.problems);
  const initial = readInitialDeclarations(table.comments);
  problems.push(...initial.problems);
  const network = assemble(drafts, columns, problems, constants.declared, initial.declared);
  if (problems.length > 0) return { ok: false, problems: sortProblems(problems) };
  return { ok: true, network };
}

const sortProblems = (ps: NetworkFileProblem[]): NetworkFileProblem[] =>
  [...ps].sort((a, b) => a.row - b.row || (a.columnIndex ?? 0) - (b.columnIndex ?? 0));

type ColumnMap = Partial<Record<NetworkColumn, number>>;

function readHeader(header: CsvLine, problems: NetworkFileProblem[]): ColumnMap {
  const columns: ColumnMap = {};
  header.cells.forEach((cell, j) => {
    const name = cell.toLowerCase();
    const at = { row: header.line, columnIndex: j + 1 };
    if (name === "") {
      problems.push({ ...at, message: "empty column name in the header", expected: `one of ${NETWORK_COLUMNS.join(", ")}` });
    } else if (!(NETWORK_COLUMNS as readonly string[]).includes(name)) {
      problems.push({
        ...at,
        column: cell,
        message: `unknown column \`${cell}\``,
        expected: cell.includes("\t")
          ? "columns separated by `,` or `;` (tabs are not a delimiter here)"
          : `one of ${NETWORK_COLUMNS.join(", ")}`,
      });
    } else if (columns[name as NetworkColumn] !== undefined) {
      problems.push({ ...at, column: name, message: `column \`${name}\` appears twice`, expected: "each column once" });
    } else {
      columns[name as NetworkColumn] = j;
    }
  });
  if (columns.reaction === undefined) {
    problems.push({
      row: header.line,
      column: "reaction",
      message: header.cells.some((c) => /->|<-/.test(c))
        ? "the header has no `reaction` column (the first row looks like a reaction, but a header row is required)"
        : "the header has no `reaction` column",
      expected: "a header row naming the columns, such as `reaction,rate,rate_value`",
    });
  }
  return columns;
}

function readRow(row: CsvLine, columns: ColumnMap, width: number, problems: NetworkFileProblem[]): RowDraft {
  const before = problems.length;
  const cell = (c: NetworkColumn): string => (columns[c] === undefined ? "" : (row.cells[columns[c]!] ?? ""));
  const at = (c: NetworkColumn) => ({ row: row.line, column: c, columnIndex: columns[c]! + 1 });
  if (row.cells.length > width && row.cells.slice(width).some((c) => c !== "")) {
    problems.push({
      row: row.line,
      columnIndex: width + 1,
      message: `this row has ${row.cells.length} fields but the header has ${width} columns`,
      expected: `at most ${width} fields; quote a field that contains the delimiter`,
    });
  }
  const parsed = parseReactionText(cell("reaction"));
  if (!parsed.ok) for (const p of parsed.problems) problems.push({ ...at("reaction"), ...p });

  const symbol = (c: "rate" | "reverse_rate"): string | undefined => {
    const s = cell(c);
    if (s === "") return undefined;
    if (!SPECIES_NAME.test(s)) problems.push({ ...at(c), message: `bad rate symbol \`${s}\``, expected: EXPECTED_SYMBOL });
    return s;
  };
  const value = (c: "rate_value" | "reverse_rate_value"): Rational | undefined => {
    const s = cell(c);
    if (s === "") return undefined;
    // Bound the text before it becomes an exact rational: `1e60000000` would take tens of seconds.
    if (!rateValueWithinLimits(s)) {
      problems.push({ ...at(c), message: `rate value \`${s.length > 40 ? `${s.slice(0, 40)}…` : s}\` is too large to work with exactly`, expected: `${EXPECTED_VALUE}, at most ${NETWORK_LIMITS.maxRateValueChars} characters with an exponent from -${NETWORK_LIMITS.maxRateValueExponent} to ${NETWORK_LIMITS.maxRateValueExponent}` });
      return undefined;
    }
    const v = parseRational(s);
    if (v === null) problems.push({ ...at(c), message: `\`${s}\` is not a number`, expected: EXPECTED_VALUE });
    else if (v.num <= 0n) problems.push({ ...at(c), message: `rate value \`${s}\` is not positive`, expected: EXPECTED_VALUE });
    else return v;
    return undefined;
  };
  const rate = symbol("rate");
  const reverseRate = symbol("reverse_rate");
  const rateValue = value("rate_value");
  const reverseRateValue = value("reverse_rate_value");
  if (parsed.ok && parsed.reaction.arrow !== "<->") {
    for (const c of ["reverse_rate", "reverse_rate_value"] as const) {
      if (cell(c) !== "") {
        problems.push({
          ...at(c),
          message: `\`${c}\` given for the irreversible reaction \`${cell("reaction")}\``,
          expected: "an empty cell, or the arrow `<->` for a reversible reaction",
        });
      }
    }
  }
  const label = cell("label");
  const reaction = parsed.ok ? parsed.reaction : { left: {}, arrow: "->" as const, right: {}, speciesInOrder: [] };
  return {
    line: row.line,
    valid: parsed.ok && problems.length === before,
    ...(label !== "" ? { label } : {}),
    left: reaction.left,
    arrow: reaction.arrow,
    right: reaction.right,
    speciesInOrder: reaction.speciesInOrder,
    rate,
    reverseRate,
    rateValue,
    reverseRateValue,
  };
}

function assemble(
  drafts: RowDraft[],
  columns: ColumnMap,
  problems: NetworkFileProblem[],
  declared: readonly DeclaredConstant[],
  declaredInitial: readonly DeclaredInitial[],
): Network {
  const written: string[] = [];
  for (const d of drafts) {
    for (const s of d.speciesInOrder) if (!written.includes(s)) written.push(s);
  }
  const speciesSet = new Set(written);
  const constantSet = new Set(declared.map((c) => c.name));
  for (const c of declared) {
    if (!speciesSet.has(c.name) && drafts.every((d) => d.valid)) {
      problems.push({
        row: c.line,
        column: "constant",
        columnIndex: c.column,
        message: `\`${c.name}\` is declared constant but is not a species of any reaction`,
        expected: written.length > 0 ? `one of the species ${written.join(", ")}` : "a species that appears in a reaction",
      });
    }
  }
  const species = written.filter((s) => !constantSet.has(s));
  const constants: ConstantSpecies[] = declared.map((c) => ({ name: c.name, ...(c.value ? { value: c.value } : {}), line: c.line }));
  for (const c of declaredInitial) {
    const at = { row: c.line, column: "initial", columnIndex: c.column };
    if (constantSet.has(c.name)) {
      problems.push({ ...at, message: `\`${c.name}\` is held constant, so it has no initial value of its own`, expected: "its concentration on the `# constant:` line, and initial values for the other species" });
    } else if (!speciesSet.has(c.name) && drafts.every((d) => d.valid)) {
      problems.push({
        ...at,
        message: `\`${c.name}\` has an initial value but is not a species of any reaction`,
        expected: species.length > 0 ? `one of the species ${species.join(", ")}` : "a species that appears in a reaction",
      });
    }
  }
  const initial: InitialValue[] = declaredInitial.filter((c) => speciesSet.has(c.name) && !constantSet.has(c.name)).map((c) => ({ name: c.name, value: c.value, line: c.line }));

  const ref = (line: number, column: NetworkColumn): CellRef => ({ line, column, columnIndex: columns[column]! + 1 });
  const values = new Map<string, { value: Rational; at: CellRef }>();
  const explicit = new Set<string>();
  const noteSymbol = (sym: string | undefined, value: Rational | undefined, at: CellRef, valueAt: CellRef) => {
    if (sym === undefined) return;
    explicit.add(sym);
    if (speciesSet.has(sym)) {
      problems.push({
        row: at.line,
        column: at.column,
        columnIndex: at.columnIndex,
        message: `rate symbol \`${sym}\` is also a species name`,
        expected: "rate symbols distinct from species names",
      });
    }
    if (value === undefined) return;
    const seen = values.get(sym);
    if (!seen) values.set(sym, { value, at: valueAt });
    else if (!eq(seen.value, value)) {
      problems.push({
        row: valueAt.line,
        column: valueAt.column,
        columnIndex: valueAt.columnIndex,
        message: `rate symbol \`${sym}\` has value ${formatRational(value)} here but ${formatRational(seen.value)} on line ${seen.at.line}`,
        expected: "one value per rate symbol, or different symbols",
      });
    }
  };
  for (const d of drafts) {
    noteSymbol(d.rate, d.rateValue, ref(d.line, "rate"), ref(d.line, "rate_value"));
    noteSymbol(d.reverseRate, d.reverseRateValue, ref(d.line, "reverse_rate"), ref(d.line, "reverse_rate_value"));
  }
  // Held at fixed concentrations, a row whose two sides differ only in constant species changes
  // nothing: say so rather than keep a reaction the theory would not have.
  for (const d of drafts) {
    if (!d.valid || constantSet.size === 0) continue;
    const [left] = splitComplex(d.left, constantSet);
    const [right] = splitComplex(d.right, constantSet);
    if (formatComplex(left) === formatComplex(right)) {
      problems.push({
        row: d.line,
        column: "reaction",
        columnIndex: columns.reaction! + 1,
        message: `with ${[...new Set(d.speciesInOrder.filter((s) => constantSet.has(s)))].join(", ")} held constant, this reaction changes no other species (both sides are \`${formatComplex(left)}\`)`,
        expected: "a reaction that changes at least one species not declared constant, or fewer constant species",
      });
    }
  }

  const taken = new Set<string>([...explicit, ...written]);
  const rows: NetworkRow[] = [];
  const reactions: DirectedReaction[] = [];
  const addReaction = (d: RowDraft, reactantAsWritten: Complex, productAsWritten: Complex, rate: string, direction: "forward" | "reverse") => {
    const v = values.get(rate)?.value;
    const [reactant, held] = splitComplex(reactantAsWritten, constantSet);
    const [product] = splitComplex(productAsWritten, constantSet);
    reactions.push({
      id: `r${reactions.length + 1}`,
      ...(d.label !== undefined ? { label: d.label } : {}),
      reactant,
      product,
      ...(Object.keys(held).length > 0 ? { held } : {}),
      rate,
      ...(v !== undefined ? { rateValue: v } : {}),
      row: d.line,
      direction,
    });
  };
  const nameFor = (given: string | undefined, value: Rational | undefined): string => {
    if (given !== undefined) return given;
    const name = defaultRateName(reactions.length + 1, taken);
    taken.add(name);
    if (value !== undefined) values.set(name, { value, at: { line: 0, column: "rate", columnIndex: 0 } });
    return name;
  };
  for (const d of drafts) {
    if (!d.valid) continue;
    const forward = d.arrow === "<-" ? [d.right, d.left] : [d.left, d.right];
    const rate = nameFor(d.rate, d.rateValue);
    addReaction(d, forward[0], forward[1], rate, "forward");
    let reverseRate: string | undefined;
    if (d.arrow === "<->") {
      reverseRate = nameFor(d.reverseRate, d.reverseRateValue);
      addReaction(d, d.right, d.left, reverseRate, "reverse");
    }
    rows.push({
      line: d.line,
      ...(d.label !== undefined ? { label: d.label } : {}),
      left: d.left,
      arrow: d.arrow,
      right: d.right,
      rate,
      ...(reverseRate !== undefined ? { reverseRate } : {}),
      ...(d.rateValue !== undefined ? { rateValue: d.rateValue } : {}),
      ...(d.reverseRateValue !== undefined ? { reverseRateValue: d.reverseRateValue } : {}),
    });
  }
  return { species, reactions, rows, ...(constants.length > 0 ? { constants } : {}), ...(initial.length > 0 ? { initial } : {}) };
}
