import type { MonomialTable } from "./monomial-table";

/** A critical pair of basis indices i < j, with the id of lcm(LM(g_i), LM(g_j)) and its selection degree. */
export interface F4Pair {
  readonly i: number;
  readonly j: number;
  readonly lcm: number;
  /** Total degree of the lcm (normal strategy). */
  readonly deg: number;
}

/** What the pair bookkeeping needs of a basis element. */
export interface F4Entry {
  readonly lm: number;
  live: boolean;
}

/**
 * Gebauer–Möller update on monomial ids (Gebauer and Möller, J. Symbolic Comput. 6, 1988; the
 * procedure UPDATE of Becker and Weispfenning, "Gröbner Bases", 1993, p. 230): new pairs (g, h)
 * for live g minus those whose lcm a pending or kept new pair's lcm properly divides (chain
 * criterion, keeping one of equal lcms) and coprime ones (product criterion); old pairs that h
 * makes redundant (B_k criterion); live elements whose LM is a multiple of LM(h) retire.
 * The pair degree is the total degree of the lcm: F4 runs only in graded orders (other orders go
 * through the homogenised ideal, homogenised-image.ts).
 */
export function updateF4Pairs(T: MonomialTable, basis: F4Entry[], pairs: F4Pair[], h: number): F4Pair[] {
  const H = basis[h];
  const hm = H.lm;
  const cand: { g: number; lcm: number; coprime: boolean }[] = [];
  for (let g = 0; g < h; g++) {
    if (!basis[g].live) continue;
    cand.push({ g, lcm: T.lcm(basis[g].lm, hm), coprime: T.coprime(basis[g].lm, hm) });
  }
  // D of UPDATE: keep (g1, h) if coprime or no other candidate (pending or kept) has an lcm dividing it.
  const kept: typeof cand = [];
  for (let a = 0; a < cand.length; a++) {
    const c = cand[a];
    let redundant = false;
    if (!c.coprime) {
      for (let b = a + 1; b < cand.length && !redundant; b++) if (T.divides(cand[b].lcm, c.lcm)) redundant = true;
      for (let b = 0; b < kept.length && !redundant; b++) if (T.divides(kept[b].lcm, c.lcm)) redundant = true;
    }
    if (!redundant) kept.push(c);
  }
  const out: F4Pair[] = [];
  // B_k: an old pair (g1, g2) goes when LM(h) divides its lcm and both lcm(g1, h), lcm(g2, h) differ from it.
  for (const p of pairs) {
    if (T.divides(hm, p.lcm)) {
      const l1 = T.lcm(basis[p.i].lm, hm), l2 = T.lcm(basis[p.j].lm, hm);
      if (l1 !== p.lcm && l2 !== p.lcm) continue;
    }
    out.push(p);
  }
  for (const c of kept) {
    if (c.coprime) continue;
    out.push({ i: c.g, j: h, lcm: c.lcm, deg: T.degree(c.lcm) });
  }
  for (let g = 0; g < h; g++) if (basis[g].live && T.divides(hm, basis[g].lm)) basis[g].live = false;
  return out;
}
