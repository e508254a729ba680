import { MonomialTable } from "../f4/monomial-table";
import type { MonomialComparator } from "../order";
import type { EngineCoefficients } from "./coefficients";
import type { EPoly, Kernel, Reducer } from "./reduce";

/**
 * The reduction of ReductionKernel (same reducer choice — the first whose leading monomial
 * divides the current head — hence the same steps and the same result), laid out as one dense
 * row per call as in F4's symbolic preprocessing (Faugère, J. Pure Appl. Algebra 139, 1999, §2.2):
 * the monomials the reduction can reach are collected and sorted once, then each step
 * p := a·p − b·m·g touches only the columns of m·g (and, when a ≠ 1, the row's nonzero entries),
 * where the merge kernel copies the whole remaining polynomial every step. That pays when the
 * remainders are much longer than the reducers — block orders with parameters in the lower block,
 * whose tails carry many parameter monomials — and costs a little when they are short, since
 * the preprocessing also visits monomials whose coefficients cancel on the way.
 *
 * Monomials, per-polynomial monomial ids and each monomial's reducer are cached across calls;
 * the reducer cache is dropped whenever a call passes a different reducers array.
 */
export class RowKernel<C> implements Kernel<C> {
  steps = 0;
  private readonly T: MonomialTable;
  private readonly ids = new WeakMap<EPoly<C>, Int32Array>();
  private lastReducers: readonly Reducer<C>[] | null = null;
  private leads = new Int32Array(0);
  private leadMasks = new Int32Array(0);
  private generation = 0;
  /** Per monomial id: generation of the lookup below; reducer index + 1 (0: none); the multiple's ids. */
  private lookedUp = new Int32Array(1 << 12);
  private reducerOf = new Int32Array(1 << 12);
  private multiples: (Int32Array | undefined)[] = [];
  private seen = new Int32Array(1 << 12);
  private column = new Int32Array(1 << 12);
  private call = 0;

  constructor(
    private readonly K: EngineCoefficients<C>,
    private readonly n: number,
    private readonly cmp: MonomialComparator,
    private readonly tick: () => void = () => {},
    /** Normalise results (monic / primitive); off for normal forms that must keep their scale. */
    private readonly normalizeResults = true,
  ) {
    this.T = new MonomialTable(n);
  }

  reduce(f: EPoly<C>, reducers: readonly Reducer<C>[], full: boolean, forced: EPoly<C> | null = null): EPoly<C> {
    const K = this.K, T = this.T;
    if (reducers !== this.lastReducers) this.useReducers(reducers);
    const fIds = this.idsOf(f);
    if (fIds.length === 0) return { coeffs: [], exps: new Int32Array(0) };
    const call = ++this.call;
    const cols: number[] = [];
    const add = (m: number) => {
      this.ensure(m);
      if (this.seen[m] === call) return;
      this.seen[m] = call;
      cols.push(m);
    };
    for (let t = 0; t < fIds.length; t++) add(fIds[t]);
    // f's terms are sorted, so its head is cols[0]; a forced first step reduces it by `forced`.
    const forcedPoly = forced;
    const forcedMultiple = forcedPoly ? this.multipleBy(this.idsOf(forcedPoly), fIds[0]) : null;
    for (let c = 0; c < cols.length; c++) {
      const mult = c === 0 && forcedMultiple ? forcedMultiple : this.multipleOf(cols[c], reducers);
      if (mult) for (let t = 1; t < mult.length; t++) add(mult[t]);
      if ((c & 1023) === 1023) this.tick();
    }
    const mcmp = T.comparator(this.cmp);
    cols.sort((a, b) => mcmp(b, a));
    const ncols = cols.length;
    for (let c = 0; c < ncols; c++) this.column[cols[c]] = c;
    const row: C[] = new Array(ncols).fill(K.zero);
    for (let t = 0; t < fIds.length; t++) row[this.column[fIds[t]]] = f.coeffs[t];
    let work = 0;
    const perTick = K.termsPerTick;
    let stop = ncols;
    for (let c = 0; c < ncols; c++) {
      const v = row[c];
      if (K.isZero(v)) continue;
      const m = cols[c];
      let g: readonly C[], mult: Int32Array;
      if (c === 0 && forcedMultiple) {
        g = forcedPoly!.coeffs;
        mult = forcedMultiple;
      } else {
        const r = this.reducerOf[m] - 1;
        if (r < 0) {
          if (!full) { stop = c; break; }
          continue; // irreducible: stays in the row, part of the normal form
        }
        g = reducers[r].poly.coeffs;
        mult = this.multiples[m]!;
      }
      this.steps++;
      const [a, b] = K.reductionFactors(v, g[0], this.tick);
      if (!K.isOne(a)) {
        for (let k = 0; k < ncols; k++) if (k !== c && !K.isZero(row[k])) row[k] = K.mul(a, row[k]);
        work += ncols;
      }
      row[c] = K.zero;
      for (let t = 1; t < mult.length; t++) {
        const k = this.column[mult[t]];
        row[k] = K.mulSub(row[k], b, g[t]);
      }
      work += mult.length;
      if (work >= perTick) { work = 0; this.tick(); }
    }
    // The result: every nonzero entry (full), or the head that no reducer divides and all after it.
    const coeffs: C[] = [];
    const out: number[] = [];
    for (let c = full ? 0 : stop; c < ncols; c++) {
      if (K.isZero(row[c])) continue;
      coeffs.push(row[c]);
      out.push(cols[c]);
    }
    if (this.normalizeResults) K.normalize(coeffs, this.tick);
    return { coeffs, exps: T.packed(out) };
  }

  private idsOf(f: EPoly<C>): Int32Array {
    let ids = this.ids.get(f);
    if (ids === undefined) {
      const S = this.n + 1;
      ids = new Int32Array(f.coeffs.length);
      for (let t = 0; t < ids.length; t++) ids[t] = this.T.intern(f.exps, t * S);
      this.ids.set(f, ids);
    }
    return ids;
  }

  private useReducers(reducers: readonly Reducer<C>[]): void {
    this.lastReducers = reducers;
    this.generation++;
    this.leads = Int32Array.from(reducers, (r) => this.idsOf(r.poly)[0]);
    this.leadMasks = Int32Array.from(this.leads, (m) => this.T.masks[m]);
  }

  /** The multiple of m's reducer that cancels m (looked up once per monomial and reducer set), or null. */
  private multipleOf(m: number, reducers: readonly Reducer<C>[]): Int32Array | null {
    this.ensure(m);
    if (this.lookedUp[m] !== this.generation) {
      const T = this.T, mask = T.masks[m];
      let r = 0;
      for (let i = 0; i < this.leads.length; i++) {
        if ((this.leadMasks[i] & ~mask) === 0 && T.divides(this.leads[i], m)) { r = i + 1; break; }
      }
      this.lookedUp[m] = this.generation;
      this.reducerOf[m] = r;
      this.multiples[m] = r > 0 ? this.multipleBy(this.idsOf(reducers[r - 1].poly), m) : undefined;
    }
    return this.reducerOf[m] > 0 ? this.multiples[m]! : null;
  }

  private multipleBy(g: Int32Array, m: number): Int32Array {
    const T = this.T;
    const q = T.quotient(m, g[0]);
    const out = new Int32Array(g.length);
    for (let t = 0; t < g.length; t++) out[t] = T.product(q, g[t]);
    return out;
  }

  /** Grows the per-monomial arrays to cover id m (the table grows during preprocessing). */
  private ensure(m: number): void {
    if (m < this.seen.length) return;
    let size = this.seen.length;
    while (size <= m) size *= 2;
    const grow = (a: Int32Array) => { const b = new Int32Array(size); b.set(a); return b; };
    this.lookedUp = grow(this.lookedUp);
    this.reducerOf = grow(this.reducerOf);
    this.seen = grow(this.seen);
    this.column = grow(this.column);
  }
}
