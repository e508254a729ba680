import { AlgebraError } from "./errors";
import type { Exponents } from "./monomial";

/**
 * Monomial orders as comparators chosen once per ring (Cox, Little, O'Shea, "Ideals, Varieties,
 * and Algorithms", 4th ed. 2015, ch. 2 §2 for lex/grlex/grevlex; product/elimination orders in
 * ch. 3 §1, Exercise 9-style block orders).
 *
 * A spec is a list of blocks over consecutive variables, from the highest variable:
 * `lex`, `grevlex`, `lex(2), grevlex(3)`, `weighted(1,2,2)` (weighted degree, ties by grevlex).
 */
export type BlockKind = "lex" | "grlex" | "grevlex" | "weighted";

export interface OrderBlock {
  readonly kind: BlockKind;
  /** Number of variables in the block; undefined = "all remaining" (only for the last block). */
  readonly size?: number;
  /** Positive integer weights, one per variable, for `weighted`. */
  readonly weights?: readonly number[];
}

export type OrderSpec = readonly OrderBlock[];

/** Positive when monomial a > monomial b, negative when a < b, 0 when equal. */
export type MonomialComparator = (a: Exponents, ia: number, b: Exponents, ib: number) => number;

const KINDS: readonly BlockKind[] = ["lex", "grlex", "grevlex", "weighted"];

/**
 * Parses an order spec. Example: `parseOrderSpec('lex(2), grevlex(3)')` is
 * `[{kind:'lex',size:2},{kind:'grevlex',size:3}]`; `parseOrderSpec('grevlex')` is one block over all variables.
 */
export function parseOrderSpec(text: string): OrderSpec {
  const src = text.trim();
  if (src === "") throw new AlgebraError("parse", "order: empty order", { expected: "lex, grlex, grevlex or blocks like lex(2), grevlex(3)" });
  const blocks: OrderBlock[] = [];
  const re = /\s*([A-Za-z]+)\s*(?:\(([^)]*)\))?\s*(,|$)/y;
  let pos = 0;
  while (pos < src.length) {
    re.lastIndex = pos;
    const m = re.exec(src);
    if (!m || m[0] === "") {
      throw new AlgebraError("parse", `order: cannot read '${src.slice(pos)}'`, {
        location: { line: 1, column: pos + 1 },
        expected: "an order name such as lex, grlex, grevlex, weighted(...) optionally followed by (size)",
      });
    }
    const name = m[1].toLowerCase() as BlockKind;
    if (!KINDS.includes(name)) {
      throw new AlgebraError("parse", `order: unknown order '${m[1]}'`, {
        location: { line: 1, column: pos + 1 + m[0].indexOf(m[1]) },
        expected: "lex, grlex, grevlex or weighted",
      });
    }
    const args = m[2] === undefined ? [] : m[2].split(",").map((s) => s.trim());
    const nums = args.map((s) => (/^\d+$/.test(s) ? Number(s) : NaN));
    if (nums.some((x) => !Number.isSafeInteger(x) || x <= 0)) {
      throw new AlgebraError("parse", `order: bad argument list '(${m[2]})' for ${name}`, {
        location: { line: 1, column: pos + 1 },
        expected: "positive integers",
      });
    }
    if (name === "weighted") {
      if (nums.length === 0) throw new AlgebraError("parse", "order: weighted needs weights, e.g. weighted(1,2,3)", { location: { line: 1, column: pos + 1 } });
      blocks.push({ kind: name, size: nums.length, weights: nums });
    } else {
      if (nums.length > 1) throw new AlgebraError("parse", `order: ${name} takes one block size`, { location: { line: 1, column: pos + 1 } });
      blocks.push(nums.length === 1 ? { kind: name, size: nums[0] } : { kind: name });
    }
    pos = re.lastIndex;
    if (m[3] === ",") {
      if (pos >= src.length) throw new AlgebraError("parse", "order: trailing comma", { location: { line: 1, column: pos }, expected: "another block" });
    }
  }
  blocks.slice(0, -1).forEach((b, i) => {
    if (b.size === undefined) throw new AlgebraError("parse", `order: block ${i + 1} needs a size, e.g. ${b.kind}(2)`, { expected: "a block size" });
  });
  return blocks;
}

/** Resolves sizes against the number of variables; throws if they do not add up. */
export function resolveOrderSpec(spec: OrderSpec, nvars: number): OrderSpec {
  let used = 0;
  const out: OrderBlock[] = [];
  for (const b of spec) {
    const size = b.size ?? nvars - used;
    if (size <= 0) throw new AlgebraError("ring", `order: block sizes exceed the ${nvars} variables`);
    out.push({ ...b, size });
    used += size;
  }
  if (used !== nvars) throw new AlgebraError("ring", `order: blocks cover ${used} variables but the ring has ${nvars}`);
  return out;
}

export function formatOrderSpec(spec: OrderSpec): string {
  if (spec.length === 1 && spec[0].kind !== "weighted") return spec[0].kind;
  return spec.map((b) => (b.kind === "weighted" ? `weighted(${b.weights!.join(",")})` : `${b.kind}(${b.size})`)).join(", ");
}

/** Builds the comparator for a resolved spec; single-block orders get specialised loops. */
export function makeComparator(spec: OrderSpec, n: number): MonomialComparator {
  const r = resolveOrderSpec(spec, n);
  if (r.length === 1) {
    switch (r[0].kind) {
      case "lex":
        return (a, ia, b, ib) => {
          for (let k = 1; k <= n; k++) {
            const d = a[ia + k] - b[ib + k];
            if (d !== 0) return d;
          }
          return 0;
        };
      case "grlex":
        return (a, ia, b, ib) => {
          const dd = a[ia] - b[ib];
          if (dd !== 0) return dd;
          for (let k = 1; k <= n; k++) {
            const d = a[ia + k] - b[ib + k];
            if (d !== 0) return d;
          }
          return 0;
        };
      case "grevlex":
        return (a, ia, b, ib) => {
          const dd = a[ia] - b[ib];
          if (dd !== 0) return dd;
          for (let k = n; k >= 1; k--) {
            const d = b[ib + k] - a[ia + k];
            if (d !== 0) return d;
          }
          return 0;
        };
      default:
        break;
    }
  }
  const blocks = r.map((b, i) => {
    const start = 1 + r.slice(0, i).reduce((s, x) => s + x.size!, 0);
    return { kind: b.kind, start, end: start + b.size!, weights: b.weights };
  });
  return (a, ia, b, ib) => {
    for (const blk of blocks) {
      const { kind, start, end } = blk;
      if (kind !== "lex") {
        let da = 0, db = 0;
        const w = blk.weights;
        for (let k = start; k < end; k++) {
          const wk = w ? w[k - start] : 1;
          da += wk * a[ia + k];
          db += wk * b[ib + k];
        }
        if (da !== db) return da - db;
      }
      if (kind === "lex" || kind === "grlex") {
        for (let k = start; k < end; k++) {
          const d = a[ia + k] - b[ib + k];
          if (d !== 0) return d;
        }
      } else {
        for (let k = end - 1; k >= start; k--) {
          const d = b[ib + k] - a[ia + k];
          if (d !== 0) return d;
        }
      }
    }
    return 0;
  };
}
