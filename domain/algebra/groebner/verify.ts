import type { MonomialComparator } from "../order";
import type { EngineCoefficients } from "./coefficients";
import { Limits } from "./limits";
import type { BasisEntry, CriticalPair } from "./pairs";
import { updatePairs } from "./pairs";
import type { EPoly } from "./reduce";
import { ZeroTest } from "./zero-test";

/**
 * Proves that G is a Gröbner basis (of the ideal it generates) by Buchberger's criterion with the
 * Gebauer–Möller criteria: this is exactly a run of Becker–Weispfenning's GROEBNERNEW2 (Gröbner
 * Bases, 1993, p. 232) started from G in which every remaining pair reduces to zero, so its output
 * G is a Gröbner basis (ibid., Theorem 5.66 — theorem number recalled from memory). Only top
 * reduction is needed: a polynomial reduces to zero iff its head-reductions do.
 * Returns false at the first S-polynomial that does not reduce to zero. With `part`, only the
 * pairs whose position in the (deterministic) pair list is `index` modulo `of`: the parts of one
 * G together check every pair, so they can run on different machines.
 */
export function verifyGroebner<C>(
  G: readonly EPoly<C>[],
  K: EngineCoefficients<C>,
  n: number,
  cmp: MonomialComparator,
  limits: Limits = new Limits(),
  part: { readonly index: number; readonly of: number } = { index: 0, of: 1 },
): boolean {
  const entries: BasisEntry[] = [];
  let pairs: CriticalPair[] = [];
  for (const g of G) {
    entries.push({ lm: g.exps.subarray(0, n + 1), sugar: 0, live: true });
    pairs = updatePairs(entries, pairs, entries.length - 1, n);
  }
  // Reduced by rows (zero-test.ts): the same top reductions without re-copying the remainder each step.
  const rows = new ZeroTest(G, K, n, cmp, () => limits.checkTime());
  for (let k = part.index; k < pairs.length; k += part.of) {
    const pair = pairs[k];
    limits.checkTime();
    if (!rows.sPolynomialReducesToZero(pair.i, pair.j)) return false;
  }
  return true;
}
