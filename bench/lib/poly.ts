/**
 * A small sparse polynomial type for the harness: it builds the benchmark systems and puts the
 * outputs of all three programs into one canonical text, so bases compare as sets of strings.
 * Variables are positions in a `vars` list (highest first), exponents plain arrays.
 *
 * Example: with vars [x, y], canonical(fromTerms([[[0,1], q(2n)], [[2,0], q(1n)]]), ...) under
 * grevlex prints "x^2 + 2*y".
 */
import { q, qAdd, qDiv, qIsZero, qMul, qNeg, qToString, type Q } from "./rational";

export type SimpleOrder = "lex" | "grlex" | "grevlex";
export const SIMPLE_ORDERS: readonly SimpleOrder[] = ["lex", "grlex", "grevlex"];

/** One block of a product order: `size` consecutive variables compared by `order`. */
export interface OrderBlock {
  readonly order: SimpleOrder;
  readonly size: number;
}

/** A simple order over all variables, or a block (product) order, blocks from the highest. */
export type MonomialOrder = SimpleOrder | readonly OrderBlock[];

export interface Term {
  readonly exps: readonly number[];
  readonly coef: Q;
}

/** Terms keyed by their exponent vector; no zero coefficients are stored. */
export type Poly = Map<string, Term>;

const keyOf = (exps: readonly number[]): string => exps.join(",");

export function polyConst(c: Q, nvars: number): Poly {
  const p: Poly = new Map();
  if (!qIsZero(c)) {
    const exps = new Array<number>(nvars).fill(0);
    p.set(keyOf(exps), { exps, coef: c });
  }
  return p;
}

export function polyVar(index: number, nvars: number): Poly {
  const exps = new Array<number>(nvars).fill(0);
  exps[index] = 1;
  return new Map([[keyOf(exps), { exps, coef: q(1n) }]]);
}

function addTermInto(p: Poly, exps: readonly number[], coef: Q): void {
  const key = keyOf(exps);
  const old = p.get(key);
  const sum = old ? qAdd(old.coef, coef) : coef;
  if (qIsZero(sum)) p.delete(key);
  else p.set(key, { exps, coef: sum });
}

export function polyAdd(a: Poly, b: Poly): Poly {
  const out: Poly = new Map(a);
  for (const t of b.values()) addTermInto(out, t.exps, t.coef);
  return out;
}

export function polyScale(a: Poly, c: Q): Poly {
  const out: Poly = new Map();
  if (qIsZero(c)) return out;
  for (const [k, t] of a) out.set(k, { exps: t.exps, coef: qMul(t.coef, c) });
  return out;
}

export const polyNeg = (a: Poly): Poly => polyScale(a, qNeg(q(1n)));
export const polySub = (a: Poly, b: Poly): Poly => polyAdd(a, polyNeg(b));

export function polyMul(a: Poly, b: Poly): Poly {
  const out: Poly = new Map();
  for (const s of a.values())
    for (const t of b.values())
      addTermInto(out, s.exps.map((e, i) => e + t.exps[i]), qMul(s.coef, t.coef));
  return out;
}

export function polyPow(a: Poly, k: number, nvars: number): Poly {
  let out = polyConst(q(1n), nvars);
  for (let i = 0; i < k; i++) out = polyMul(out, a);
  return out;
}

const degree = (e: readonly number[]): number => e.reduce((s, x) => s + x, 0);

function lexCompare(a: readonly number[], b: readonly number[]): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return 0;
}

/**
 * Monomial comparators (positive when a > b), variables highest first, as in Cox, Little and
 * O'Shea, "Ideals, Varieties, and Algorithms", ch. 2 §2 (lex, grlex, grevlex).
 * Example: grevlex has x*z < y^2 for vars [x, y, z]; lex has x*z > y^2.
 */
export function compareMonomials(order: MonomialOrder, a: readonly number[], b: readonly number[]): number {
  if (typeof order !== "string") return compareBlocks(order, a, b);
  if (order === "lex") return lexCompare(a, b);
  const dd = degree(a) - degree(b);
  if (dd !== 0) return dd;
  if (order === "grlex") return lexCompare(a, b);
  // grevlex: the monomial with the smaller exponent in the last differing variable is larger.
  for (let i = a.length - 1; i >= 0; i--) if (a[i] !== b[i]) return b[i] - a[i];
  return 0;
}

/** Product order (Cox, Little and O'Shea, ch. 3 §1, exercise on elimination orders): first differing block decides. */
function compareBlocks(blocks: readonly OrderBlock[], a: readonly number[], b: readonly number[]): number {
  let start = 0;
  for (const block of blocks) {
    const end = start + block.size;
    const c = compareMonomials(block.order, a.slice(start, end), b.slice(start, end));
    if (c !== 0) return c;
    start = end;
  }
  return 0;
}

export function sortedTerms(p: Poly, order: MonomialOrder): Term[] {
  return [...p.values()].sort((s, t) => compareMonomials(order, t.exps, s.exps));
}

export function leadingTerm(p: Poly, order: MonomialOrder): Term | undefined {
  return sortedTerms(p, order)[0];
}

/** Divides by the leading coefficient, so a reduced basis element is unique. */
export function monic(p: Poly, order: MonomialOrder): Poly {
  const lt = leadingTerm(p, order);
  if (!lt) return p;
  const out: Poly = new Map();
  for (const [k, t] of p) out.set(k, { exps: t.exps, coef: qDiv(t.coef, lt.coef) });
  return out;
}

function monomialText(exps: readonly number[], vars: readonly string[]): string {
  const factors: string[] = [];
  exps.forEach((e, i) => {
    if (e === 1) factors.push(vars[i]);
    else if (e > 1) factors.push(`${vars[i]}^${e}`);
  });
  return factors.join("*");
}

/**
 * Canonical text: terms in decreasing order, `*` between factors, `^` for powers, fractions
 * a/b, " + " and " - " between terms (the CLI contract of issue 3). Example: "x^2 - 3/2*x*y + 1".
 */
export function canonical(p: Poly, vars: readonly string[], order: MonomialOrder): string {
  const terms = sortedTerms(p, order);
  if (terms.length === 0) return "0";
  return terms
    .map((t, i) => {
      const negative = t.coef.n < 0n;
      const abs = negative ? qNeg(t.coef) : t.coef;
      const mono = monomialText(t.exps, vars);
      const isOne = abs.n === 1n && abs.d === 1n;
      const body = mono === "" ? qToString(abs) : isOne ? mono : `${qToString(abs)}*${mono}`;
      if (i === 0) return negative ? `-${body}` : body;
      return negative ? ` - ${body}` : ` + ${body}`;
    })
    .join("");
}
