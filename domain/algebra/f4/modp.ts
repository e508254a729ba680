/**
 * Arithmetic modulo a prime p < 2^26 on doubles, for the F4 matrices.
 *
 * Why this size: a product of two residues is below 2^52, so `a*b` is exact in a double and no
 * limb splitting (nor Math.imul) is needed; a dense row accumulates `row[c] += m*v` without
 * reducing until the entry would pass 2^53 − p² (then one floor-based reduction, no `%`). The
 * smaller p, the rarer that reduction: one F4 run of katsura-7 took about 0.7 s modulo a prime
 * below 2^20 against 1.2 s below 2^26 (Node 20, busy 2-core machine, two runs each), so the
 * multi-modular path lifts from primes below 2^21 (multimodular.ts); Z/p itself is used as given.
 */
export const F4_MAX_PRIME = 2 ** 26;

/** x mod p for 0 ≤ x < 2^53 with a precomputed 1/p (floor may be off by one; corrected). */
export function reduceDouble(x: number, p: number, invp: number): number {
  let r = x - Math.floor(x * invp) * p;
  if (r < 0) r += p;
  else if (r >= p) r -= p;
  return r;
}

/** Inverse modulo p: the field layer's one extended Euclid. */
export { invMod as invModP } from "../field";

export const mulModP = (a: number, b: number, p: number): number => (a * b) % p;

/** Primes below 2^26, largest first, skipping the given ones (those already used by the caller). */
export function* primesBelow(limit: number, skip: ReadonlySet<number> = new Set()): Generator<number> {
  for (let q = (limit - 1) | 1; q > 3; q -= 2) {
    if (skip.has(q)) continue;
    let prime = q % 3 !== 0;
    for (let d = 5; prime && d * d <= q; d += 2) if (q % d === 0) prime = false;
    if (prime) yield q;
  }
}
