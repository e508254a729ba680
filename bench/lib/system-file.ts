/**
 * The CLI input format of issue 3: `# comment` lines, `vars: x, y, z` (highest first),
 * `order: grevlex` (or blocks such as `order: lex(2), grevlex(3)`), then one polynomial per line.
 *
 * Example: formatSystemFile({ comments: ["demo"], vars: ["x","y"], order: "lex", polys: ["x - y"] })
 * gives "# demo\nvars: x, y\norder: lex\nx - y\n", and parseSystemFile reads it back.
 */
import { SIMPLE_ORDERS, type MonomialOrder, type OrderBlock, type SimpleOrder } from "./poly";

export interface SystemFile {
  readonly comments: readonly string[];
  readonly vars: readonly string[];
  readonly order: string;
  readonly polys: readonly string[];
}

export class SystemFileError extends Error {
  constructor(
    message: string,
    readonly line: number,
  ) {
    super(`line ${line}: ${message}`);
    this.name = "SystemFileError";
  }
}

export function formatSystemFile(s: SystemFile): string {
  const lines = [...s.comments.map((c) => `# ${c}`.trimEnd()), `vars: ${s.vars.join(", ")}`, `order: ${s.order}`, ...s.polys];
  return lines.join("\n") + "\n";
}

export function parseSystemFile(text: string): SystemFile {
  const comments: string[] = [];
  const polys: string[] = [];
  let vars: string[] | undefined;
  let order: string | undefined;
  text.split(/\r?\n/).forEach((raw, idx) => {
    const line = raw.trim();
    const lineNo = idx + 1;
    if (line === "") return;
    if (line.startsWith("#")) comments.push(line.slice(1).trim());
    else if (/^vars\s*:/.test(line)) {
      if (vars) throw new SystemFileError("second `vars:` line", lineNo);
      vars = line.replace(/^vars\s*:/, "").split(",").map((v) => v.trim());
      const bad = vars.find((v) => !/^[A-Za-z_][A-Za-z0-9_]*$/.test(v));
      if (bad !== undefined) throw new SystemFileError(`bad variable name "${bad}"`, lineNo);
    } else if (/^order\s*:/.test(line)) {
      if (order) throw new SystemFileError("second `order:` line", lineNo);
      order = line.replace(/^order\s*:/, "").trim();
    } else {
      if (!vars) throw new SystemFileError("polynomial before the `vars:` line", lineNo);
      polys.push(line);
    }
  });
  if (!vars) throw new SystemFileError("missing `vars:` line", 1);
  if (!order) throw new SystemFileError("missing `order:` line", 1);
  const blocks = parseOrderBlocks(order, vars.length);
  if (!blocks) throw new SystemFileError(`unknown order "${order}"`, 1);
  return { comments, vars, order, polys };
}

/**
 * Reads `grevlex` as one block over all variables and `lex(2), grevlex(3)` as blocks of the
 * `vars:` list from the highest; returns undefined for anything else or sizes that do not add up.
 */
export function parseOrderBlocks(order: string, nvars: number): OrderBlock[] | undefined {
  const simple = order.trim() as SimpleOrder;
  if (SIMPLE_ORDERS.includes(simple)) return [{ order: simple, size: nvars }];
  const blocks: OrderBlock[] = [];
  for (const part of order.split(",")) {
    const m = /^\s*(lex|grlex|grevlex)\s*\(\s*(\d+)\s*\)\s*$/.exec(part);
    if (!m) return undefined;
    blocks.push({ order: m[1] as SimpleOrder, size: Number(m[2]) });
  }
  return blocks.reduce((s, b) => s + b.size, 0) === nvars && blocks.every((b) => b.size > 0) ? blocks : undefined;
}

/** The order of a parsed system file: a simple order, or the list of blocks. */
export function monomialOrderOf(s: SystemFile): MonomialOrder {
  const blocks = parseOrderBlocks(s.order, s.vars.length);
  if (!blocks) throw new SystemFileError(`unknown order "${s.order}"`, 1);
  return blocks.length === 1 ? blocks[0].order : blocks;
}
