import type { Exponents } from "../monomial";
import { divides, isCoprime, lcm, monomialEquals } from "../monomial";

/** A critical pair (i, j) of basis indices with the lcm of their leading monomials and its sugar. */
export interface CriticalPair {
  readonly i: number;
  readonly j: number;
  readonly lcm: Exponents;
  readonly sugar: number;
}

/** What the pair bookkeeping needs to know about a basis element. */
export interface BasisEntry {
  /** Packed leading monomial at offset 0. */
  readonly lm: Exponents;
  readonly sugar: number;
  live: boolean;
}

/**
 * Gebauer–Möller update (Gebauer and Möller, "On an installation of Buchberger's algorithm",
 * J. Symbolic Comput. 6, 1988; as the procedure UPDATE in Becker and Weispfenning, "Gröbner
 * Bases", 1993, p. 230). Adds basis element h: forms the new pairs (g, h) for live g, drops
 * those whose lcm is a multiple of another new pair's lcm (chain criterion) or that are coprime
 * (product criterion), drops old pairs that h makes redundant (the B_k criterion), and marks
 * live elements whose leading monomial is divisible by LM(h) as no longer live.
 */
export function updatePairs(basis: BasisEntry[], pairs: CriticalPair[], h: number, n: number): CriticalPair[] {
  const H = basis[h];
  const hE = H.lm;
  type Cand = { g: number; lcm: Exponents; coprime: boolean; keep: boolean };
  const cands: Cand[] = [];
  for (let g = 0; g < basis.length; g++) {
    if (g === h || !basis[g].live) continue;
    cands.push({ g, lcm: lcm(basis[g].lm, 0, hE, 0, n), coprime: isCoprime(basis[g].lm, 0, hE, 0, n), keep: false });
  }
  // D: keep (h, g1) if coprime or no other candidate still pending / already kept has lcm dividing it.
  const decided = new Array<boolean>(cands.length).fill(false);
  for (let a = 0; a < cands.length; a++) {
    decided[a] = true;
    const c1 = cands[a];
    if (c1.coprime) { c1.keep = true; continue; }
    let dominated = false;
    for (let b = 0; b < cands.length && !dominated; b++) {
      if (b === a) continue;
      const c2 = cands[b];
      if (decided[b] && !c2.keep) continue; // already discarded pairs do not count
      if (divides(c2.lcm, 0, c1.lcm, 0, n)) dominated = true;
    }
    c1.keep = !dominated;
  }
  // Old pairs (g1, g2) with LM(h) | lcm(g1, g2) and lcm(g1,h), lcm(h,g2) both ≠ lcm(g1,g2) are redundant.
  const lcmWithH = new Map<number, Exponents>();
  for (const c of cands) lcmWithH.set(c.g, c.lcm);
  const lcmH = (g: number) => lcmWithH.get(g) ?? lcm(basis[g].lm, 0, hE, 0, n);
  const kept: CriticalPair[] = [];
  for (const p of pairs) {
    if (
      divides(hE, 0, p.lcm, 0, n) &&
      !monomialEquals(lcmH(p.i), 0, p.lcm, 0, n) &&
      !monomialEquals(lcmH(p.j), 0, p.lcm, 0, n)
    ) continue;
    kept.push(p);
  }
  for (const c of cands) {
    if (!c.keep || c.coprime) continue;
    const G = basis[c.g];
    const d = c.lcm[0];
    const sugar = Math.max(G.sugar - G.lm[0], H.sugar - hE[0]) + d;
    kept.push({ i: c.g, j: h, lcm: c.lcm, sugar });
  }
  for (let g = 0; g < basis.length; g++) {
    if (g !== h && basis[g].live && divides(hE, 0, basis[g].lm, 0, n)) basis[g].live = false;
  }
  H.live = true;
  return kept;
}
