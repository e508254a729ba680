import { MonomialTable } from "../f4/monomial-table";
import type { MonomialComparator } from "../order";
import type { EngineCoefficients } from "./coefficients";
import type { EPoly } from "./reduce";

/**
 * Decides exactly whether a polynomial reduces to zero modulo a fixed list of reducers, with the
 * reduction laid out as in F4 (Faugère, J. Pure Appl. Algebra 139, 1999, §2.2 "symbolic
 * preprocessing"): the monomials the reduction can reach are collected first (for each one, the
 * first reducer whose leading monomial divides it, and that reducer's multiple's monomials), sorted
 * once, and the polynomial becomes one dense row over them. Each step p := a·p − b·m·g then
 * touches only the columns of m·g (and, when a ≠ 1, the nonzero entries right of the pivot), where
 * a merge of sorted term lists (ReductionKernel) copies the whole remaining polynomial every step.
 * The steps, and the result, are those of top reduction with the same reducer choice: the proofs'
 * S-polynomials in block orders keep a few hundred terms while a reducer has about fifty (two-site
 * cycle with k3, k6 symbolic: 12112 steps over 3.8 million merged terms), so this does about a
 * sixth of the coefficient work and no monomial comparisons in the loop.
 *
 * Exact in any EngineCoefficients (fraction-free over Z for Q). Monomials, their reducers and the
 * multiples' monomials are interned once per instance and shared by every call.
 */
export class ZeroTest<C> {
  private readonly T: MonomialTable;
  private readonly polys: { ids: Int32Array; coeffs: C[] }[];
  /** Per monomial id: index of its reducer + 1, 0 when none divides it; -1 not yet looked up. */
  private reducerOf = new Int32Array(1 << 12).fill(-1);
  /** Per monomial id: the ids of (monomial / LM(reducer)) · reducer, when it has a reducer. */
  private multiples: (Int32Array | undefined)[] = [];
  /** Per monomial id: the call that last saw it (symbolic preprocessing), and its column there. */
  private seen = new Int32Array(1 << 12);
  private column = new Int32Array(1 << 12);
  private call = 0;
  private readonly lead: Int32Array;
  private readonly leadMask: Int32Array;

  constructor(
    reducers: readonly EPoly<C>[],
    private readonly K: EngineCoefficients<C>,
    private readonly n: number,
    private readonly cmp: MonomialComparator,
    private readonly tick: () => void = () => {},
  ) {
    this.T = new MonomialTable(n);
    this.polys = reducers.map((g) => ({ ids: this.intern(g), coeffs: g.coeffs }));
    this.lead = Int32Array.from(this.polys, (g) => g.ids[0]);
    this.leadMask = Int32Array.from(this.lead, (m) => this.T.masks[m]);
  }

  /** Monomial ids of f's terms (any term order). */
  intern(f: EPoly<C>): Int32Array {
    const S = this.n + 1, ids = new Int32Array(f.coeffs.length);
    for (let t = 0; t < ids.length; t++) ids[t] = this.T.intern(f.exps, t * S);
    return ids;
  }

  /** Does f reduce to zero (f's terms in any order)? */
  reducesToZero(f: EPoly<C>): boolean {
    return this.run(this.intern(f), f.coeffs, -1);
  }

  /**
   * Does the S-polynomial of reducers i and j reduce to zero? It is formed as (L/LM(g_i))·g_i
   * reduced first by (L/LM(g_j))·g_j, L the lcm of their leading monomials.
   */
  sPolynomialReducesToZero(i: number, j: number): boolean {
    const T = this.T, gi = this.polys[i];
    const L = T.lcm(this.lead[i], this.lead[j]);
    const q = T.quotient(L, this.lead[i]);
    const ids = new Int32Array(gi.ids.length);
    for (let t = 0; t < ids.length; t++) ids[t] = T.product(q, gi.ids[t]);
    return this.run(ids, gi.coeffs, j);
  }

  private run(ids: Int32Array, coeffs: readonly C[], forced: number): boolean {
    const K = this.K, T = this.T;
    const call = ++this.call;
    // Symbolic preprocessing: every monomial the reduction can reach, and its reducer's multiple.
    const cols: number[] = [];
    const forcedMultiple = forced >= 0 ? this.multipleBy(forced, ids[0]) : null;
    const add = (m: number) => {
      this.ensure(m);
      if (this.seen[m] === call) return;
      this.seen[m] = call;
      cols.push(m);
    };
    for (let t = 0; t < ids.length; t++) add(ids[t]);
    for (let c = 0; c < cols.length; c++) {
      const m = cols[c];
      const mult = c === 0 && forcedMultiple ? forcedMultiple : this.multipleOf(m);
      if (mult) for (let t = 1; t < mult.length; t++) add(mult[t]);
      if ((c & 1023) === 1023) this.tick();
    }
    const mcmp = T.comparator(this.cmp);
    cols.sort((a, b) => mcmp(b, a));
    const ncols = cols.length;
    for (let c = 0; c < ncols; c++) this.column[cols[c]] = c;
    const row: C[] = new Array(ncols).fill(K.zero);
    for (let t = 0; t < ids.length; t++) row[this.column[ids[t]]] = coeffs[t];
    let work = 0;
    const perTick = K.termsPerTick;
    for (let c = 0; c < ncols; c++) {
      const v = row[c];
      if (K.isZero(v)) continue;
      const m = cols[c];
      const r = c === 0 && forced >= 0 ? forced : this.reducerOf[m] - 1;
      if (r < 0) return false; // an irreducible leading term: the remainder is not zero
      const mult = c === 0 && forcedMultiple ? forcedMultiple : this.multiples[m]!;
      const g = this.polys[r].coeffs;
      const [a, b] = K.reductionFactors(v, g[0], this.tick);
      if (!K.isOne(a)) {
        for (let k = c + 1; k < ncols; k++) if (!K.isZero(row[k])) row[k] = K.mul(a, row[k]);
        work += ncols - c;
      }
      row[c] = K.zero;
      for (let t = 1; t < mult.length; t++) {
        const k = this.column[mult[t]];
        row[k] = K.mulSub(row[k], b, g[t]);
      }
      work += mult.length;
      if (work >= perTick) { work = 0; this.tick(); }
    }
    return true;
  }

  /** The multiple of m's reducer that cancels m (looked up once per monomial), or null. */
  private multipleOf(m: number): Int32Array | null {
    let r = this.reducerOf[m];
    if (r < 0) {
      r = 0;
      const T = this.T, mask = T.masks[m];
      for (let i = 0; i < this.lead.length; i++) {
        if ((this.leadMask[i] & ~mask) === 0 && T.divides(this.lead[i], m)) { r = i + 1; break; }
      }
      this.ensure(m);
      this.reducerOf[m] = r;
      if (r > 0) this.multiples[m] = this.multipleBy(r - 1, m);
    }
    return r > 0 ? this.multiples[m]! : null;
  }

  private multipleBy(r: number, m: number): Int32Array {
    const T = this.T, g = this.polys[r].ids;
    const q = T.quotient(m, g[0]);
    const out = new Int32Array(g.length);
    for (let t = 0; t < g.length; t++) out[t] = T.product(q, g[t]);
    return out;
  }

  /** Grows the per-monomial arrays to cover id m (the table grows during preprocessing). */
  private ensure(m: number): void {
    if (m < this.reducerOf.length) return;
    let size = this.reducerOf.length;
    while (size <= m) size *= 2;
    const r = new Int32Array(size).fill(-1); r.set(this.reducerOf); this.reducerOf = r;
    const s = new Int32Array(size); s.set(this.seen); this.seen = s;
    const c = new Int32Array(size); c.set(this.column); this.column = c;
  }
}
