/**
 * Puts a printed basis (our CLI's, SymPy's or Singular's) into one canonical, comparable form:
 * each line parsed exactly, made monic for the system's order (coefficients reduced into [0, p)
 * over Z/p), printed canonically, and the list sorted. Two reduced Gröbner bases of the same
 * ideal and order are equal exactly when these lists are equal (uniqueness of the reduced
 * basis: Cox, Little and O'Shea, "Ideals, Varieties, and Algorithms", ch. 2 §7, Prop. 6).
 *
 * Example: normaliseBasis(["2*x - 4"], ["x"], "lex") is ["x - 2"].
 */
import { parsePoly } from "./parse-poly";
import { canonical, leadingTerm, monic, type MonomialOrder, type Poly } from "./poly";
import { q, qModP } from "./rational";

function reduceModP(p: Poly, prime: bigint): Poly {
  const out: Poly = new Map();
  for (const [k, t] of p) {
    const c = qModP(t.coef, prime);
    if (c !== 0n) out.set(k, { exps: t.exps, coef: q(c) });
  }
  return out;
}

function monicModP(p: Poly, order: MonomialOrder, prime: bigint): Poly {
  const reduced = reduceModP(p, prime);
  const lt = leadingTerm(reduced, order);
  if (!lt) return reduced;
  const inv = qModP(q(1n, lt.coef.n), prime);
  const out: Poly = new Map();
  for (const [k, t] of reduced) out.set(k, { exps: t.exps, coef: q((t.coef.n * inv) % prime) });
  return out;
}

/** Blank lines and `#` lines are skipped; a zero polynomial is dropped (it adds nothing to an ideal). */
export function normaliseBasis(lines: readonly string[], vars: readonly string[], order: MonomialOrder, prime?: bigint): string[] {
  const out: string[] = [];
  for (const line of lines) {
    const text = line.trim();
    if (text === "" || text.startsWith("#")) continue;
    const p = parsePoly(text, vars);
    const m = prime === undefined ? monic(p, order) : monicModP(p, order, prime);
    if (m.size > 0) out.push(canonical(m, vars, order));
  }
  return out.sort();
}

export interface BasisComparison {
  readonly equal: boolean;
  readonly onlyInFirst: string[];
  readonly onlyInSecond: string[];
}

/** Set comparison of two normalised bases. Example: compareBases(["x"], ["x", "y"]).onlyInSecond is ["y"]. */
export function compareBases(first: readonly string[], second: readonly string[]): BasisComparison {
  const a = new Set(first);
  const b = new Set(second);
  const onlyInFirst = [...a].filter((p) => !b.has(p));
  const onlyInSecond = [...b].filter((p) => !a.has(p));
  return { equal: onlyInFirst.length === 0 && onlyInSecond.length === 0, onlyInFirst, onlyInSecond };
}
