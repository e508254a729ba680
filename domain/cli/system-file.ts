// Direct module imports (not the index) keep the CLI's start-up module graph small.
import { AlgebraError } from "../algebra/errors";
import { QQ, primeField } from "../algebra/field";
import type { Field } from "../algebra/field";
import { parseOrderSpec } from "../algebra/order";
import type { OrderSpec } from "../algebra/order";
import type { Polynomial } from "../algebra/polynomial";
import { PolynomialRing } from "../algebra/ring";
import { CliError } from "./io";

/**
 * The CLI input format: `#` comment lines, blank lines, `vars: x, y, z` (highest first),
 * `order: lex | grlex | grevlex | lex(2), grevlex(3)` (default grevlex), then one polynomial per
 * line. Errors name the file line and column.
 */
export interface SystemFile<C> {
  readonly ring: PolynomialRing<C>;
  readonly polys: Polynomial<C>[];
  /** 1-based file line of each polynomial. */
  readonly lines: number[];
}

export function fieldFromFlag(value: string | undefined): Field<unknown> {
  if (value === undefined) return QQ as Field<unknown>;
  if (!/^\d+$/.test(value)) throw new CliError(`--field expects a prime number, got '${value}'`);
  try {
    return primeField(Number(value)) as Field<unknown>;
  } catch (e) {
    throw new CliError(`--field: ${(e as Error).message.replace(/^field: /, "")}`);
  }
}

export function parseSystemFile<C>(text: string, field: Field<C>): SystemFile<C> {
  let vars: string[] | null = null;
  let order: OrderSpec | null = null;
  let ring: PolynomialRing<C> | null = null;
  const polys: Polynomial<C>[] = [];
  const lines: number[] = [];
  const src = text.split(/\r?\n/);
  src.forEach((raw, idx) => {
    const lineNo = idx + 1;
    const trimmed = raw.trim();
    if (trimmed === "" || trimmed.startsWith("#")) return;
    const header = /^(vars|order)\s*:(.*)$/i.exec(trimmed);
    const indent = raw.length - raw.trimStart().length;
    if (header) {
      const key = header[1].toLowerCase();
      const valueColumn = indent + trimmed.indexOf(":") + 2;
      if (ring) throw located(`'${key}:' must come before the first polynomial`, lineNo, indent + 1, "a polynomial");
      if (key === "vars") {
        if (vars) throw located("'vars:' given twice", lineNo, indent + 1, "a single vars: line");
        const names = header[2].split(",").map((s) => s.trim());
        const bad = names.findIndex((s) => !/^[A-Za-z_][A-Za-z0-9_]*$/.test(s));
        if (bad >= 0) {
          throw located(`bad variable name '${names[bad]}'`, lineNo, valueColumn, "a comma-separated list of names like x, y, k1");
        }
        const dup = names.findIndex((s, i) => names.indexOf(s) !== i);
        if (dup >= 0) throw located(`variable '${names[dup]}' listed twice`, lineNo, valueColumn, "distinct variable names");
        vars = names;
      } else {
        if (order) throw located("'order:' given twice", lineNo, indent + 1, "a single order: line");
        try {
          order = parseOrderSpec(header[2]);
        } catch (e) {
          const col = e instanceof AlgebraError && e.location ? e.location.column : 1;
          throw located(stripLocation(e), lineNo, valueColumn + col - 1 + (header[2].length - header[2].trimStart().length), "an order such as lex, grlex, grevlex or lex(2), grevlex(3)");
        }
      }
      return;
    }
    if (!vars) throw located("polynomial before the 'vars:' line", lineNo, indent + 1, "a line 'vars: x, y, ...' first");
    if (!ring) {
      try {
        ring = new PolynomialRing<C>(vars, field, order ?? "grevlex");
      } catch (e) {
        throw new CliError(`order: ${stripLocation(e)}`);
      }
    }
    try {
      polys.push(ring.parse(raw, { line: lineNo, column: 1 }));
      lines.push(lineNo);
    } catch (e) {
      if (e instanceof AlgebraError) throw new CliError(e.message);
      throw e;
    }
  });
  if (!vars) throw new CliError("missing 'vars:' line (e.g. vars: x, y, z)");
  if (!ring) throw new CliError("no polynomials after the 'vars:' line");
  return { ring, polys, lines };
}

function stripLocation(e: unknown): string {
  return (e instanceof Error ? e.message : String(e)).replace(/ at line \d+, column \d+$/, "");
}

function located(message: string, line: number, column: number, expected: string): CliError {
  return new CliError(`${message}; expected ${expected} at line ${line}, column ${column}`);
}
