import type { PrimeField } from "../field";
import type { Polynomial } from "../polynomial";
import type { PolynomialRing } from "../ring";
import type { Limits } from "../groebner/limits";
import type { F4Poly } from "./f4";
import { f4ModP } from "./f4";
import { homogenisedF4ModP } from "./homogenised-image";
import { F4_MAX_PRIME } from "./modp";
import { MonomialTable } from "./monomial-table";

/** Orders F4 runs in directly (pairs by lcm degree, the normal strategy); the others go through F^h. */
export function isGradedOrder(ring: PolynomialRing<unknown>): boolean {
  return ring.order.length === 1 && (ring.order[0].kind === "grlex" || ring.order[0].kind === "grevlex");
}

/** Can F4 run over this field? Primes below 2^26 (products exact in doubles, see modp.ts). */
export const f4SupportsPrime = (p: number): boolean => p < F4_MAX_PRIME;

export function toF4(T: MonomialTable, exps: Int32Array, coeffs: ArrayLike<number>): F4Poly {
  const len = coeffs.length;
  const mons = new Int32Array(len);
  for (let t = 0; t < len; t++) mons[t] = T.intern(exps, t * T.S);
  return { mons, coeffs: Int32Array.from(coeffs) };
}

/**
 * Reduced Gröbner basis over Z/p (p < 2^26) by F4 (f4.ts), in the ring's order (orders other than
 * grevlex/grlex through the homogenised ideal, homogenised-image.ts). Exact: every step
 * is arithmetic in Z/p, so no proof is needed. Sorted by increasing leading monomial, monic.
 *
 * Example: over GF(32003), grevlex, [x^2 - y, x*y - 1] gives [y^2 - x, x*y - 1, x^2 - y].
 */
export function f4GroebnerModP(polys: readonly Polynomial<number>[], limits: Limits): Polynomial<number>[] {
  const ring = polys[0].ring;
  const p = (ring.field as PrimeField).p;
  const T = new MonomialTable(ring.n);
  const input = polys.filter((f) => f.coeffs.length > 0).map((f) => toF4(T, f.exps, f.coeffs));
  const G = isGradedOrder(ring) ? f4ModP(input, T, p, ring.cmp, { limits }) : homogenisedF4ModP(input, T, p, ring.order, ring.cmp, { limits });
  return G.map((g) => ({ ring, coeffs: Array.from(g.coeffs), exps: T.packed(g.mons) }));
}
