import { AlgebraError } from "./errors";
import type { GroebnerOptions } from "./groebner";
import { groebnerBasis, ringOf } from "./groebner";
import type { OrderBlock } from "./order";
import type { Polynomial } from "./polynomial";
import { isZeroPoly, mul as mulPoly, normalizeTerms, sub } from "./polynomial";
import { PolynomialRing } from "./ring";

/**
 * Re-expresses p in a ring over the same field whose variables are matched by name (reordered,
 * extended, or missing variables that p does not use).
 */
export function moveToRing<C>(p: Polynomial<C>, target: PolynomialRing<C>): Polynomial<C> {
  const src = p.ring, S = src.stride, T = target.stride;
  const map = src.vars.map((v) => target.indexOf(v));
  const exps = new Int32Array(p.coeffs.length * T);
  for (let i = 0; i < p.coeffs.length; i++) {
    exps[i * T] = p.exps[i * S];
    for (let k = 0; k < src.n; k++) {
      const e = p.exps[i * S + 1 + k];
      if (e === 0) continue;
      if (map[k] < 0) throw new AlgebraError("ring", `variable '${src.vars[k]}' does not exist in the target ring`);
      exps[i * T + 1 + map[k]] = e;
    }
  }
  return normalizeTerms(target, p.coeffs, exps);
}

/** Does p involve any of the variables (0-based indices)? */
function involves<C>(p: Polynomial<C>, vars: ReadonlySet<number>): boolean {
  const S = p.ring.stride;
  for (let i = 0; i < p.coeffs.length; i++) for (const k of vars) if (p.exps[i * S + 1 + k] !== 0) return true;
  return false;
}

/**
 * The elimination ideal I ∩ K[remaining variables], as its reduced Gröbner basis in the original
 * ring's order restricted to the remaining variables (Elimination Theorem, Cox, Little, O'Shea,
 * ch. 3 §1, Theorem 2, with a block (product) order: the eliminated variables form the first
 * block, graded reverse lexicographic inside, ch. 3 §1 Exercise 6-style).
 *
 * Example (grevlex, variables t, x, y): eliminate([x - t, y - t^2], ['t']) is [x^2 - y].
 */
export function eliminate<C>(polys: readonly Polynomial<C>[], variables: readonly string[], options: GroebnerOptions = {}): Polynomial<C>[] {
  const ring = ringOf(polys, "eliminate");
  const elim = new Set(variables);
  for (const v of elim) if (ring.indexOf(v) < 0) throw new AlgebraError("ring", `eliminate: unknown variable '${v}'`);
  const rest = ring.vars.filter((v) => !elim.has(v));
  if (rest.length === 0) {
    const G = groebnerBasis(polys, options);
    return G.length === 1 && G[0].exps[0] === 0 ? G : [];
  }
  // Keep the original order on the remaining variables when it is a single graded/lex block.
  const restOrder: OrderBlock = ring.order.length === 1 && ring.order[0].kind !== "weighted"
    ? { kind: ring.order[0].kind, size: rest.length }
    : { kind: "grevlex", size: rest.length };
  const elimRing = new PolynomialRing([...variables, ...rest], ring.field, [{ kind: "grevlex", size: variables.length }, restOrder]);
  const restRing = new PolynomialRing(rest, ring.field, [restOrder]);
  const G = groebnerBasis(polys.map((p) => moveToRing(p, elimRing)), options);
  const elimIdx = new Set(variables.map((_, k) => k));
  return G.filter((g) => !involves(g, elimIdx)).map((g) => moveToRing(moveToRing(g, restRing), ring));
}

/**
 * Saturation I : f^∞ = (I + ⟨1 − t·f⟩) ∩ K[x] (Cox, Little, O'Shea, ch. 4 §4, Theorem 14), computed by
 * eliminating a fresh variable t. Result: reduced Gröbner basis in the original ring.
 * Example: saturate([x*y], y) is [x].
 */
export function saturate<C>(polys: readonly Polynomial<C>[], f: Polynomial<C>, options: GroebnerOptions = {}): Polynomial<C>[] {
  const ring = ringOf([...polys, f], "saturate");
  let t = "t_sat";
  while (ring.indexOf(t) >= 0) t += "_";
  const ext = new PolynomialRing([t, ...ring.vars], ring.field, [{ kind: "grevlex", size: 1 }, ...ring.order]);
  const tf = moveToRing(f, ext);
  const tVar = ext.variable(0);
  const extra = sub(ext.one(), mulPoly(tVar, tf));
  const G = groebnerBasis([...polys.map((p) => moveToRing(p, ext)), extra], options);
  return G.filter((g) => !involves(g, new Set([0]))).map((g) => moveToRing(g, ring));
}


/** Leading monomials of a Gröbner basis, as exponent vectors. */
function leadingExponents<C>(G: readonly Polynomial<C>[]): number[][] {
  return G.filter((g) => !isZeroPoly(g)).map((g) => Array.from(g.exps.subarray(1, 1 + g.ring.n)));
}

/**
 * Zero-dimensionality (finitely many solutions over the algebraic closure): for every variable
 * some leading monomial of the Gröbner basis is a pure power of it (Finiteness Theorem, Cox,
 * Little, O'Shea, ch. 5 §3, Theorem 6). `isBasis` skips recomputing the basis.
 * Example: isZeroDimensional([x^2 - 1, y^2 - 1]) is true; isZeroDimensional([x*y]) is false.
 */
export function isZeroDimensional<C>(polys: readonly Polynomial<C>[], options: GroebnerOptions & { isBasis?: boolean } = {}): boolean {
  const ring = ringOf(polys, "isZeroDimensional");
  const G = options.isBasis ? polys : groebnerBasis(polys, options);
  const lms = leadingExponents(G);
  if (lms.some((e) => e.every((x) => x === 0))) return true; // the whole ring: no solutions, finite
  for (let k = 0; k < ring.n; k++) {
    if (!lms.some((e) => e[k] > 0 && e.every((x, j) => j === k || x === 0))) return false;
  }
  return true;
}

/**
 * The standard monomials (those outside ⟨LT(I)⟩) of a zero-dimensional ideal, in increasing
 * order; they form a basis of K[x]/I (Cox, Little, O'Shea, ch. 5 §3, Proposition 4 and
 * Theorem 6). Throws AlgebraError('domain') if the ideal is not zero-dimensional.
 * Example: standardMonomials([x^2, y^2]) is [1, y, x, x*y] (grevlex), as exponent vectors.
 */
export function standardMonomials<C>(polys: readonly Polynomial<C>[], options: GroebnerOptions & { isBasis?: boolean; maxCount?: number } = {}): number[][] {
  const ring = ringOf(polys, "standardMonomials");
  const G = options.isBasis ? polys : groebnerBasis(polys, options);
  if (!isZeroDimensional(G, { isBasis: true })) {
    throw new AlgebraError("domain", "standardMonomials: the ideal is not zero-dimensional (infinitely many standard monomials)");
  }
  const lms = leadingExponents(G);
  const n = ring.n;
  const divisible = (e: number[]) => lms.some((l) => l.every((x, k) => x <= e[k]));
  const start = new Array<number>(n).fill(0);
  if (divisible(start)) return [];
  const seen = new Set<string>([start.join(",")]);
  const out: number[][] = [start];
  const maxCount = options.maxCount ?? 1_000_000;
  for (let q = 0; q < out.length; q++) {
    for (let k = 0; k < n; k++) {
      const e = out[q].slice();
      e[k]++;
      const key = e.join(",");
      if (seen.has(key) || divisible(e)) continue;
      seen.add(key);
      out.push(e);
      if (out.length > maxCount) throw new AlgebraError("budget", `standardMonomials: more than ${maxCount} standard monomials`);
    }
  }
  const tmp = ring.fromTerms(out.map((exponents) => ({ coeff: ring.field.one, exponents })));
  const sorted: number[][] = [];
  for (let i = tmp.coeffs.length - 1; i >= 0; i--) sorted.push(Array.from(tmp.exps.subarray(i * ring.stride + 1, i * ring.stride + 1 + n)));
  return sorted;
}

/**
 * Number of solutions over the algebraic closure counted with multiplicity = dim_K K[x]/I = the
 * number of standard monomials (Cox, Little, O'Shea, "Using Algebraic Geometry", 2nd ed. 2005,
 * ch. 4 §2 — recalled from memory as the place where multiplicities are defined this way).
 * Example: countSolutions([x^2 - 1, y - x]) is 2; countSolutions([x^2, y]) is 2 (a double point).
 */
export function countSolutions<C>(polys: readonly Polynomial<C>[], options: GroebnerOptions = {}): number {
  return standardMonomials(polys, options).length;
}
