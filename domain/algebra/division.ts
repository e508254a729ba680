import { AlgebraError } from "./errors";
import { divides, divInto } from "./monomial";
import type { Polynomial } from "./polynomial";
import { mulTerm, sub } from "./polynomial";

export interface DivisionResult<C> {
  /** quotients[i] belongs to divisors[i]. */
  readonly quotients: Polynomial<C>[];
  readonly remainder: Polynomial<C>;
}

/**
 * Multivariate division by an ordered list (Cox, Little, O'Shea, "Ideals, Varieties, and
 * Algorithms", 4th ed. 2015, ch. 2 §3, Theorem 3 and its algorithm): while p ≠ 0, the first
 * divisor (in the given order) whose leading term divides LT(p) gets LT(p)/LT(f_i) added to its
 * quotient and p := p − (LT(p)/LT(f_i))·f_i; if none divides, LT(p) moves to the remainder.
 * Guarantees f = Σ q_i·f_i + r, no term of r divisible by any LT(f_i), LM(q_i·f_i) ≤ LM(f).
 *
 * Example (CLO ch. 2 §3, Example 1, lex x > y): x*y^2 + 1 divided by (x*y + 1, y + 1) gives
 * q1 = y, q2 = -1, r = 2.
 */
export function divide<C>(f: Polynomial<C>, divisors: readonly Polynomial<C>[]): DivisionResult<C> {
  const ring = f.ring;
  const F = ring.field, S = ring.stride, n = ring.n;
  for (const g of divisors) {
    if (g.ring !== ring) throw new AlgebraError("ring", "divide: divisor from a different ring");
    if (g.coeffs.length === 0) throw new AlgebraError("domain", "divide: division by the zero polynomial");
  }
  const qC: C[][] = divisors.map(() => []);
  const qE: number[][] = divisors.map(() => []);
  const rC: C[] = [];
  const rE: number[] = [];
  const lcInv = divisors.map((g) => F.inv(g.coeffs[0]));
  const m = new Int32Array(S);
  let p = f;
  while (p.coeffs.length > 0) {
    let i = 0;
    while (i < divisors.length && !divides(divisors[i].exps, 0, p.exps, 0, n)) i++;
    if (i === divisors.length) {
      rC.push(p.coeffs[0]);
      for (let k = 0; k < S; k++) rE.push(p.exps[k]);
      p = { ring, coeffs: p.coeffs.slice(1), exps: p.exps.subarray(S) };
      continue;
    }
    const g = divisors[i];
    const c = F.mul(p.coeffs[0], lcInv[i]);
    divInto(m, 0, p.exps, 0, g.exps, 0, n);
    qC[i].push(c);
    for (let k = 0; k < S; k++) qE[i].push(m[k]);
    // Subtracting c·m·g cancels the leading term exactly (the merge drops the zero).
    p = sub(p, mulTerm(g, c, m));
  }
  return {
    // Quotient and remainder terms are produced in strictly decreasing order: no re-sorting needed.
    quotients: qC.map((coeffs, i) => ({ ring, coeffs, exps: Int32Array.from(qE[i]) })),
    remainder: { ring, coeffs: rC, exps: Int32Array.from(rE) },
  };
}
