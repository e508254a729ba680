import { AlgebraError } from "../errors";
import type { MonomialComparator } from "../order";
import { Limits } from "../groebner/limits";
import type { MonomialTable } from "./monomial-table";
import { F4_MAX_PRIME, invModP, mulModP, reduceDouble } from "./modp";
import type { F4Entry, F4Pair } from "./pairs";
import { updateF4Pairs } from "./pairs";
import type { F4Recorder } from "./trace";

/** A polynomial for F4: monomial ids (terms decreasing in the order) and residues mod p. */
export interface F4Poly {
  readonly mons: Int32Array;
  readonly coeffs: Int32Array;
}

export interface F4Options {
  readonly limits?: Limits;
  /** Reported in progress: this is prime number `k` of at most `of` (multi-modular runs). */
  readonly prime?: { readonly k: number; readonly of: number };
  /** Records the run for replay at other primes (trace.ts). */
  readonly recorder?: F4Recorder;
}

/** One matrix row to be: the basis polynomial `f` times the monomial `m`. */
interface RowGen {
  readonly m: number;
  readonly f: F4Poly;
  mons?: Int32Array;
}

interface Row {
  cols: Int32Array;
  coeffs: Int32Array;
}

/** Statistics of a run (matrix sizes), for the bench and the tests. */
export interface F4Stats {
  matrices: number;
  rows: number;
  maxRows: number;
  maxColumns: number;
}

/**
 * F4 modulo a prime p < 2^26 (Faugère, "A new efficient algorithm for computing Gröbner bases
 * (F4)", J. Pure Appl. Algebra 139, 1999) in a degree-compatible order (others: homogenised-image.ts):
 * all critical pairs of the lowest lcm degree (the normal strategy) go into one matrix;
 * symbolic preprocessing adds a reducer m·g for every monomial divisible by a leading monomial of
 * the basis; the matrix is reduced by Gaussian elimination mod p (sparse rows, one dense
 * accumulator, see modp.ts), and the rows with new leading monomials join the basis with the
 * Gebauer–Möller update (pairs.ts). Ends with the reduced basis: minimal, inter-reduced, monic,
 * sorted by increasing leading monomial; [1] for the unit ideal, [] for the zero ideal.
 *
 * Example: over Z/32003 in grevlex, {x^2 + y, x*y - 1} gives [y^2 + x, x*y - 1, x^2 + y].
 */
export function f4ModP(
  input: readonly F4Poly[],
  T: MonomialTable,
  p: number,
  cmp: MonomialComparator,
  options: F4Options = {},
  stats: F4Stats = { matrices: 0, rows: 0, maxRows: 0, maxColumns: 0 },
): F4Poly[] {
  if (p >= F4_MAX_PRIME) throw new AlgebraError("domain", `F4: prime ${p} is not below 2^26`);
  const limits = options.limits ?? new Limits();
  const rec = options.recorder;
  const mcmp = T.comparator(cmp);
  const basis: F4Poly[] = [];
  const entries: F4Entry[] = [];
  let pairs: F4Pair[] = [];
  const elim = new Eliminator(p, limits);
  const one = (): F4Poly[] => {
    if (rec) rec.broken = true;
    return [{ mons: Int32Array.of(T.intern(new Int32Array(T.S), 0)), coeffs: Int32Array.of(1) }];
  };
  let degree = 0;
  const report = (matrix?: { rows: number; cols: number }) => limits.progress({
    pairsLeft: pairs.length,
    basisSize: entries.reduce((s, e) => s + (e.live ? 1 : 0), 0),
    degree,
    reductions: stats.rows,
    ...(matrix ? { matrixRows: matrix.rows, matrixColumns: matrix.cols } : {}),
    ...(options.prime ? { prime: options.prime.k, primes: options.prime.of } : {}),
  });

  const add = (f: F4Poly): void => {
    basis.push(f);
    entries.push({ lm: f.mons[0], live: true });
    pairs = updateF4Pairs(T, entries, pairs, basis.length - 1);
    limits.checkSizes(liveCount(entries), pairs.length, f.mons.length);
  };

  // The inputs: one echelon form, so equal leading monomials and linear dependencies go first.
  const inputs = input.filter((f) => f.mons.length > 0).map((f) => {
    const g = monic(f, p);
    rec?.monic(f, g);
    return g;
  });
  if (inputs.length === 0) return [];
  {
    const gens: RowGen[] = inputs.map((f) => ({ m: -1, f }));
    const fresh = reduceRows(gens, [], [], T, mcmp, elim, stats, true, undefined, rec);
    fresh.sort((a, b) => mcmp(a.mons[0], b.mons[0]));
    for (const f of fresh) {
      if (T.degree(f.mons[0]) === 0) return one();
      add(f);
    }
  }

  while (pairs.length > 0) {
    limits.checkTime();
    degree = Infinity;
    for (const pr of pairs) if (pr.deg < degree) degree = pr.deg;
    const chosen: F4Pair[] = [];
    const rest: F4Pair[] = [];
    for (const pr of pairs) (pr.deg === degree ? chosen : rest).push(pr);
    pairs = rest;
    const seen = new Set<number>();
    const gens: RowGen[] = [];
    for (const pr of chosen) {
      for (const g of [pr.i, pr.j]) {
        const m = T.quotient(pr.lcm, entries[g].lm);
        const key = m * 1048576 + g;
        if (seen.has(key)) continue;
        seen.add(key);
        gens.push({ m, f: basis[g] });
      }
    }
    const live = liveIndices(entries);
    const fresh = reduceRows(gens, live.map((g) => basis[g]), live.map((g) => entries[g].lm), T, mcmp, elim, stats, false, report, rec);
    fresh.sort((a, b) => mcmp(a.mons[0], b.mons[0]));
    for (const f of fresh) {
      if (T.degree(f.mons[0]) === 0) return one();
      add(f);
    }
    report();
  }

  // Reduced basis: the minimal elements, each tail reduced by the others (one more matrix).
  const live = liveIndices(entries).filter((g) => !liveIndices(entries).some((h) => h !== g && T.divides(entries[h].lm, entries[g].lm)));
  const minimal = live.map((g) => basis[g]);
  const reduced = interReduce(minimal, T, mcmp, elim, stats, rec);
  reduced.sort((a, b) => mcmp(a.mons[0], b.mons[0]));
  return reduced;
}

/**
 * The reduced basis from a Gröbner basis `G` mod p (any order): the elements with minimal leading
 * monomials (one per monomial), each tail reduced by the others (one matrix), monic, sorted by
 * increasing leading monomial — the last step of f4ModP, for bases found another way.
 */
export function reducedModP(
  G: readonly F4Poly[],
  T: MonomialTable,
  p: number,
  cmp: MonomialComparator,
  limits: Limits,
  stats: F4Stats = { matrices: 0, rows: 0, maxRows: 0, maxColumns: 0 },
  rec?: F4Recorder,
): F4Poly[] {
  const mcmp = T.comparator(cmp);
  const nonzero = G.filter((g) => g.mons.length > 0).map((g) => {
    const m = monic(g, p);
    rec?.monic(g, m);
    return m;
  });
  if (nonzero.some((g) => T.degree(g.mons[0]) === 0)) {
    if (rec) rec.broken = true;
    return [{ mons: Int32Array.of(T.intern(new Int32Array(T.S), 0)), coeffs: Int32Array.of(1) }];
  }
  const minimal = nonzero.filter((g, i) => !nonzero.some((h, j) => j !== i && T.divides(h.mons[0], g.mons[0]) && (h.mons[0] !== g.mons[0] || j < i)));
  const reduced = interReduce(minimal, T, mcmp, new Eliminator(p, limits), stats, rec);
  reduced.sort((a, b) => mcmp(a.mons[0], b.mons[0]));
  return reduced;
}

function liveCount(entries: readonly F4Entry[]): number {
  let c = 0;
  for (const e of entries) if (e.live) c++;
  return c;
}

function liveIndices(entries: readonly F4Entry[]): number[] {
  const out: number[] = [];
  entries.forEach((e, g) => { if (e.live) out.push(g); });
  return out;
}


export function monic(f: F4Poly, p: number): F4Poly {
  if (f.coeffs[0] === 1) return f;
  const c = invModP(f.coeffs[0], p);
  const coeffs = new Int32Array(f.coeffs.length);
  for (let t = 0; t < coeffs.length; t++) coeffs[t] = mulModP(f.coeffs[t], c, p);
  return { mons: f.mons, coeffs };
}

/** Monomial ids of m·f (m = -1 means f itself). */
function rowMonomials(g: RowGen, T: MonomialTable): Int32Array {
  if (g.mons) return g.mons;
  const f = g.f;
  if (g.m < 0) return (g.mons = f.mons);
  const out = new Int32Array(f.mons.length);
  for (let t = 0; t < out.length; t++) out[t] = T.product(g.m, f.mons[t]);
  return (g.mons = out);
}

/**
 * Symbolic preprocessing (Faugère 1999, §2.3) and elimination: the rows `gens` (the first with a
 * given leading monomial is a pivot, the others are reduced), plus a reducer for every monomial
 * that a leading monomial of `reducers` divides. Returns the reduced rows whose leading monomial
 * is new (not a pivot), monic. `allLower`: every gen row is reduced (the input echelon step).
 */
function reduceRows(
  gens: RowGen[],
  reducers: readonly F4Poly[],
  reducerLms: readonly number[],
  T: MonomialTable,
  mcmp: (a: number, b: number) => number,
  elim: Eliminator,
  stats: F4Stats,
  allLower: boolean,
  report?: (m: { rows: number; cols: number }) => void,
  rec?: F4Recorder,
): F4Poly[] {
  const pivotGen = new Map<number, RowGen>();
  const lower: RowGen[] = [];
  const monList: number[] = [];
  const todo: number[] = [];
  const stamp = elim.nextStamp();
  const visit = (g: RowGen) => {
    const ms = rowMonomials(g, T);
    const seen = elim.seen(T.size);
    for (let t = 0; t < ms.length; t++) {
      const m = ms[t];
      if (seen[m] !== stamp) { seen[m] = stamp; monList.push(m); todo.push(m); }
    }
  };
  for (const g of gens) {
    const lm = rowMonomials(g, T)[0];
    if (!allLower && !pivotGen.has(lm)) pivotGen.set(lm, g);
    else lower.push(g);
    visit(g);
  }
  let steps = 0;
  while (todo.length > 0) {
    const m = todo.pop()!;
    if (pivotGen.has(m)) continue;
    if ((++steps & 4095) === 0) elim.tick();
    let best = -1;
    const mm = T.masks[m];
    for (let r = 0; r < reducers.length; r++) {
      if ((T.masks[reducerLms[r]] & ~mm) !== 0) continue;
      if (T.divides(reducerLms[r], m) && (best < 0 || reducers[r].mons.length < reducers[best].mons.length)) best = r;
    }
    if (best < 0) continue;
    const g: RowGen = { m: T.quotient(m, reducerLms[best]), f: reducers[best] };
    pivotGen.set(m, g);
    visit(g);
  }
  monList.sort((a, b) => mcmp(b, a));
  const colOf = elim.columns(T.size);
  monList.forEach((m, c) => { colOf[m] = c; });
  const ncols = monList.length;
  const toRow = (g: RowGen): Row => {
    const ms = rowMonomials(g, T);
    const cols = new Int32Array(ms.length);
    for (let t = 0; t < ms.length; t++) cols[t] = colOf[ms[t]];
    return { cols, coeffs: g.f.coeffs };
  };
  const pivots: (Row | undefined)[] = new Array(ncols);
  // Recording: which generator each row came from, and the pivots the productive rows used.
  const genOf = rec ? new Map<Row, RowGen>() : null;
  for (const [m, g] of pivotGen) {
    const r = toRow(g);
    pivots[colOf[m]] = r;
    genOf?.set(r, g);
  }
  const lowerRows = lower.map((g) => {
    const r = toRow(g);
    genOf?.set(r, g);
    return r;
  });
  lowerRows.sort((a, b) => a.cols[0] - b.cols[0]);
  stats.matrices++;
  stats.rows += lowerRows.length;
  stats.maxRows = Math.max(stats.maxRows, lowerRows.length + pivotGen.size);
  stats.maxColumns = Math.max(stats.maxColumns, ncols);
  report?.({ rows: lowerRows.length + pivotGen.size, cols: ncols });
  const out: F4Poly[] = [];
  const used = new Set<Row>();
  const productive: { f: F4Poly; cols: Int32Array; result: F4Poly; resultCols: Int32Array }[] = [];
  if (rec) elim.recording = [];
  for (const r of lowerRows) {
    const red = elim.reduce(r, pivots, ncols, 0);
    if (elim.recording) {
      if (red) for (const u of elim.recording) used.add(u);
      elim.recording.length = 0;
    }
    if (!red) continue;
    pivots[red.cols[0]] = red;
    const mons = new Int32Array(red.cols.length);
    for (let t = 0; t < mons.length; t++) mons[t] = monList[red.cols[t]];
    const f = { mons, coeffs: red.coeffs };
    out.push(f);
    if (genOf) productive.push({ f: genOf.get(r)!.f, cols: r.cols, result: f, resultCols: red.cols });
  }
  if (rec && genOf) {
    elim.recording = null;
    const usedPivots = [...used].filter((u) => genOf.has(u)).map((u) => ({ f: genOf.get(u)!.f, cols: u.cols }));
    rec.matrix(ncols, productive.length > 0 ? T.degree(productive[0].result.mons[0]) : 0, usedPivots, productive, 0, true);
  }
  return out;
}

/** Tail reduction of a minimal basis by itself (and the multiples symbolic preprocessing adds). */
function interReduce(
  minimal: readonly F4Poly[],
  T: MonomialTable,
  mcmp: (a: number, b: number) => number,
  elim: Eliminator,
  stats: F4Stats,
  rec?: F4Recorder,
): F4Poly[] {
  const lms = minimal.map((f) => f.mons[0]);
  const gens: RowGen[] = minimal.map((f) => ({ m: -1, f }));
  const pivotGen = new Map<number, RowGen>();
  const monList: number[] = [];
  const seenMon = new Set<number>();
  const todo: number[] = [];
  const visit = (g: RowGen) => {
    const ms = rowMonomials(g, T);
    for (let t = 0; t < ms.length; t++) {
      const m = ms[t];
      if (!seenMon.has(m)) { seenMon.add(m); monList.push(m); todo.push(m); }
    }
  };
  for (const g of gens) { pivotGen.set(g.f.mons[0], g); visit(g); }
  while (todo.length > 0) {
    const m = todo.pop()!;
    if (pivotGen.has(m)) continue;
    for (let r = 0; r < minimal.length; r++) {
      if (T.divides(lms[r], m)) {
        const g: RowGen = { m: T.quotient(m, lms[r]), f: minimal[r] };
        pivotGen.set(m, g);
        visit(g);
        break;
      }
    }
  }
  monList.sort((a, b) => mcmp(b, a));
  const colOf = new Map<number, number>();
  monList.forEach((m, c) => colOf.set(m, c));
  const ncols = monList.length;
  const pivots: (Row | undefined)[] = new Array(ncols);
  const genOf = rec ? new Map<Row, RowGen>() : null;
  for (const [m, g] of pivotGen) {
    const ms = rowMonomials(g, T);
    const cols = new Int32Array(ms.length);
    for (let t = 0; t < ms.length; t++) cols[t] = colOf.get(ms[t])!;
    const r = { cols, coeffs: g.f.coeffs };
    pivots[colOf.get(m)!] = r;
    genOf?.set(r, g);
  }
  stats.matrices++;
  stats.maxColumns = Math.max(stats.maxColumns, ncols);
  const used = new Set<Row>();
  const productive: { f: F4Poly; cols: Int32Array; result: F4Poly; resultCols: Int32Array }[] = [];
  if (rec) elim.recording = [];
  const reduced = minimal.map((f) => {
    const row = pivots[colOf.get(f.mons[0])!]!;
    const red = elim.reduce(row, pivots, ncols, 1)!;
    const mons = new Int32Array(red.cols.length);
    for (let t = 0; t < mons.length; t++) mons[t] = monList[red.cols[t]];
    const g = { mons, coeffs: red.coeffs };
    if (elim.recording) {
      for (const u of elim.recording) used.add(u);
      elim.recording.length = 0;
      productive.push({ f, cols: row.cols, result: g, resultCols: red.cols });
    }
    return g;
  });
  if (rec && genOf) {
    elim.recording = null;
    rec.matrix(ncols, productive.length > 0 ? T.degree(productive[0].result.mons[0]) : 0, [...used].map((u) => ({ f: genOf.get(u)!.f, cols: u.cols })), productive, 1, false);
  }
  return reduced;
}

/**
 * Reduction of one sparse row by pivot rows (monic, indexed by their first column) in a dense
 * accumulator of doubles: columns are swept left to right (decreasing monomials), so a pivot's tail
 * only touches columns still to come and the result is fully reduced. `skip` leading entries are
 * kept as they are (1 for the tail reduction of a basis element by the others).
 */
export class Eliminator {
  /** When set, every pivot row applied by `reduce` is appended (trace.ts learns from it). */
  recording: Row[] | null = null;
  private dense = new Float64Array(1024);
  private readonly invp: number;
  /** Entries stay below this, so one more product (< p²) keeps them exact (< 2^53). */
  private readonly limit: number;
  private work = 0;
  private seenBuf = new Int32Array(0);
  private colBuf = new Int32Array(0);
  private stampNo = 0;

  constructor(private readonly p: number, private readonly limits: Limits) {
    this.invp = 1 / p;
    this.limit = 2 ** 53 - p * p;
  }

  /** Deadline and cancellation, from symbolic preprocessing. */
  tick(): void {
    this.limits.checkTime();
  }

  nextStamp(): number {
    return ++this.stampNo;
  }

  /** Scratch: a stamp per monomial id (which monomials a matrix has seen). */
  seen(size: number): Int32Array {
    if (this.seenBuf.length < size) {
      const b = new Int32Array(Math.max(size, this.seenBuf.length * 2));
      b.set(this.seenBuf);
      this.seenBuf = b;
    }
    return this.seenBuf;
  }

  /** Scratch: the column of each monomial id in the current matrix. */
  columns(size: number): Int32Array {
    if (this.colBuf.length < size) this.colBuf = new Int32Array(Math.max(size, this.colBuf.length * 2));
    return this.colBuf;
  }

  reduce(row: Row, pivots: readonly (Row | undefined)[], ncols: number, skip: number): Row | null {
    if (this.dense.length < ncols) this.dense = new Float64Array(Math.max(ncols, this.dense.length * 2));
    const d = this.dense, p = this.p, invp = this.invp, limit = this.limit;
    const rc = row.cols, rv = row.coeffs;
    for (let t = skip; t < rc.length; t++) d[rc[t]] = rv[t];
    const start = skip < rc.length ? rc[skip] : ncols;
    let nnz = 0;
    for (let c = start; c < ncols; c++) {
      let v = d[c];
      if (v === 0) continue;
      if (v >= p) { v = reduceDouble(v, p, invp); d[c] = v; if (v === 0) continue; }
      const pr = pivots[c];
      if (pr === undefined || pr === row) { nnz++; continue; }
      d[c] = 0;
      if (this.recording) this.recording.push(pr);
      const m = p - v;
      const pc = pr.cols, pv = pr.coeffs;
      for (let k = 1; k < pc.length; k++) {
        const j = pc[k];
        let x = d[j] + m * pv[k];
        if (x >= limit) x = reduceDouble(x, p, invp);
        d[j] = x;
      }
      this.work += pc.length;
      if (this.work > 1 << 20) { this.work = 0; this.limits.checkTime(); }
    }
    if (nnz === 0 && skip === 0) return null;
    const cols = new Int32Array(nnz + skip);
    const coeffs = new Int32Array(nnz + skip);
    for (let t = 0; t < skip; t++) { cols[t] = rc[t]; coeffs[t] = rv[t]; }
    let k = skip;
    for (let c = start; c < ncols && k < cols.length; c++) {
      const v = d[c];
      if (v === 0) continue;
      cols[k] = c;
      coeffs[k] = v;
      d[c] = 0;
      k++;
    }
    if (skip === 0 && coeffs[0] !== 1) {
      const inv = invModP(coeffs[0], p);
      for (let t = 0; t < coeffs.length; t++) coeffs[t] = mulModP(coeffs[t], inv, p);
    }
    return { cols, coeffs };
  }
}
