import type { MonomialComparator } from "../order";
import type { EngineCoefficients } from "./coefficients";
import { Limits } from "./limits";
import type { BasisEntry, CriticalPair } from "./pairs";
import { updatePairs } from "./pairs";
import type { EPoly } from "./reduce";
import { ReductionKernel, toReducer } from "./reduce";
import { sPolynomialHead } from "./buchberger";

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
  const reducers = G.map((g, i) => ({ g, live: entries[i].live })).filter((x) => x.live).map((x) => toReducer(x.g, n));
  const kernel = new ReductionKernel(K, n, cmp, () => limits.checkTime(), false);
  for (let k = part.index; k < pairs.length; k += part.of) {
    const pair = pairs[k];
    limits.checkTime();
    const s = sPolynomialHead(G[pair.i], pair.lcm, n);
    if (kernel.reduce(s, reducers, false, G[pair.j]).coeffs.length !== 0) return false;
  }
  return true;
}
