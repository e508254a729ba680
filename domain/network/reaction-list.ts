import Papa from "papaparse";
import { formatRational } from "../algebra/rational";
import { formatComplex } from "./complex";
import type { NetworkFileProblem } from "./errors";
import type { Network } from "./model";
import { tryParseNetworkCsv } from "./parse-csv";
import { CONSTANT_DIRECTIVE, formatConstantDeclaration } from "./constant-species";
import { INITIAL_DIRECTIVE, formatInitialDeclaration } from "./initial-values";

/**
 * Reaction lists as plain text, one reaction per line, read with exactly the CSV file's rules
 * (the lines become CSV rows and go through tryParseNetworkCsv, so the checks are one piece of code):
 *
 *   # comments and blank lines are skipped
 *   binding: E + S <-> C, kon = 2, koff = 1
 *   C -> E + P, kcat = 3
 *   0 -> S, 1/2          (a value alone: the rate gets its default name)
 *   A -> B               (no rate: default name, no value)
 *   # constant: A = 2, B (species held constant, as in the CSV file)
 *   # initial: S = 10    (initial concentrations, as in the CSV file)
 *
 * A line is `[label:] REACTION [, RATE] [, REVERSE_RATE]` where each rate is `NAME`, `NAME = VALUE`
 * or `VALUE`. A label with `:`, `,` or `#` is written in double quotes (`""` for a quote).
 * Problems carry the text's line number and the part they belong to (`reaction`, `rate`, …).
 *
 * Example: parseReactionList("A <-> B, k1 = 2, k2\n") gives the rows of the CSV
 * `reaction,rate,reverse_rate,rate_value\nA <-> B,k1,k2,2\n`.
 */
export function parseReactionList(
  text: string,
): { ok: true; network: Network; csv: string } | { ok: false; problems: readonly NetworkFileProblem[] } {
  const problems: NetworkFileProblem[] = [];
  const rows: string[][] = [];
  const lines: number[] = [];
  const directives: { line: number; text: string }[] = [];
  text.split(/\r\n|\n|\r/).forEach((raw, i) => {
    const line = i + 1;
    if (CONSTANT_DIRECTIVE.test(raw) || INITIAL_DIRECTIVE.test(raw)) {
      directives.push({ line, text: raw });
      return;
    }
    const body = stripComment(raw).trim();
    if (body === "") return;
    let label = "";
    let rest = body;
    const quoted = /^"((?:[^"]|"")*)"\s*:(.*)$/s.exec(body);
    if (quoted) {
      label = quoted[1].replace(/""/g, '"');
      rest = quoted[2];
    } else {
      const head = body.split(",")[0];
      const colon = head.lastIndexOf(":");
      if (colon >= 0) {
        label = head.slice(0, colon).trim();
        rest = body.slice(colon + 1);
      }
    }
    const [reaction, ...rates] = rest.split(",").map((p) => p.trim());
    if (rates.length > 2) {
      problems.push({ row: line, column: "rate", message: `${rates.length} rates after the reaction`, expected: "at most two: the forward rate and, for `<->`, the reverse rate" });
      return;
    }
    const cells = ["", "", "", ""];
    rates.forEach((r, j) => {
      const m = /^([^=]*?)\s*=\s*(.*)$/.exec(r);
      const isNumber = /^[0-9.+\-/eE\s]+$/.test(r) && /[0-9]/.test(r);
      const [name, value] = m ? [m[1], m[2]] : isNumber ? ["", r] : [r, ""];
      if (r === "") problems.push({ row: line, column: j === 0 ? "rate" : "reverse_rate", message: "an empty rate between commas", expected: "NAME, NAME = VALUE or VALUE" });
      cells[j] = name;
      cells[j + 2] = value;
    });
    rows.push([reaction, label, ...cells]);
    lines.push(line);
  });
  if (rows.length === 0 && problems.length === 0) {
    problems.push({ row: 1, column: "reaction", message: "the list has no reactions", expected: "one reaction per line, such as `E + S <-> C, kon = 2, koff = 1`" });
  }
  if (problems.length > 0) return { ok: false, problems };
  const fields = ["reaction", "label", "rate", "reverse_rate", "rate_value", "reverse_rate_value"];
  // The directive lines go after the rows, as written, so their character columns still hold.
  const csv = Papa.unparse({ fields, data: rows }, { newline: "\n" }) + "\n" + directives.map((d) => d.text + "\n").join("");
  const parsed = tryParseNetworkCsv(csv);
  if (!parsed.ok) {
    // CSV line n is text line lines[n - 2] (a reaction) or a directive line; the column name says
    // which part of the line. Only a directive's character column is the text's own.
    return {
      ok: false,
      problems: parsed.problems.map((p) => {
        const directive = directives[p.row - 2 - rows.length];
        if (directive && (p.column === "constant" || p.column === "initial")) return { ...p, row: directive.line };
        const { columnIndex: _drop, ...rest } = p;
        return { ...rest, row: p.row >= 2 && p.row - 2 < lines.length ? lines[p.row - 2] : 1 };
      }),
    };
  }
  return { ok: true, network: parsed.network, csv };
}

/**
 * Writes a network as a reaction list that parseReactionList reads back to the same network:
 * every rate symbol named, values where known, labels quoted when they need it, the constant
 * species and initial values as the CSV file's `# constant:` and `# initial:` lines, first.
 *
 * Example: the network of "reaction,label,rate,rate_value\nA -> B,decay,k,2\n" is `decay: A -> B, k = 2`.
 */
export function formatReactionList(network: Network): string {
  const directives = [
    ...(network.constants && network.constants.length > 0 ? [formatConstantDeclaration(network.constants)] : []),
    ...(network.initial && network.initial.length > 0 ? [formatInitialDeclaration(network.initial)] : []),
  ];
  return (
    directives.map((d) => d + "\n").join("") +
    network.rows
      .map((r) => {
        const rate = (name: string | undefined, value: typeof r.rateValue) =>
          name === undefined ? [] : [value !== undefined ? `${name} = ${formatRational(value)}` : name];
        const label = r.label === undefined ? "" : /[:,#"]/.test(r.label) || r.label.trim() !== r.label ? `"${r.label.replace(/"/g, '""')}": ` : `${r.label}: `;
        const reaction = `${formatComplex(r.left, network.species)} ${r.arrow} ${formatComplex(r.right, network.species)}`;
        return label + [reaction, ...rate(r.rate, r.rateValue), ...rate(r.reverseRate, r.reverseRateValue)].join(", ");
      })
      .join("\n") + "\n"
  );
}

/** Drops a `#` comment, but not a `#` inside a quoted label. */
function stripComment(line: string): string {
  let inQuote = false;
  for (let i = 0; i < line.length; i++) {
    if (line[i] === '"') inQuote = !inQuote;
    else if (line[i] === "#" && !inQuote) return line.slice(0, i);
  }
  return line;
}
