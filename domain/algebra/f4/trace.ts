import type { Limits } from "../groebner/limits";
import type { F4Poly } from "./f4";
import { Eliminator } from "./f4";
import { invModP, mulModP } from "./modp";

/**
 * A learnt F4 run, replayed at other primes (Traverso, "Gröbner trace algorithms", ISSAC 1988,
 * carried over to F4's matrices as common practice in multi-modular F4): the run at the first
 * prime records, for every matrix, the rows that gave a new element and the reducer rows those
 * rows actually used, each as column indices plus the polynomial whose coefficients fill it.
 * At a later prime only those rows are built and reduced — no pair selection, no symbolic
 * preprocessing, none of the rows that reduced to zero — and every result must land on exactly
 * the columns it had when learnt, or the replay gives up (null) and the caller runs F4 itself.
 *
 * What the check does not see: a row that reduced to zero at the learning prime but would not
 * at another. The multi-modular caller therefore proves its lifted basis exactly as before and
 * runs untraced when a traced lift fails (multimodular.ts), so a replay can cost time, never
 * correctness.
 *
 * The record is a straight-line program on numbered coefficient slots: slots 0..k-1 are the
 * inputs; `monic` and `permute` derive a slot from another; `matrix` reduces rows into new slots.
 */
export interface F4Trace {
  readonly inputMons: readonly Int32Array[];
  readonly ops: readonly TraceOp[];
  readonly outputs: readonly { readonly slot: number; readonly mons: Int32Array }[];
  readonly slots: number;
}

type TraceOp =
  | { readonly kind: "monic"; readonly src: number; readonly dst: number }
  | { readonly kind: "permute"; readonly src: number; readonly dst: number; readonly perm: Int32Array }
  | { readonly kind: "matrix"; readonly matrix: TraceMatrix };

/** Rows of one matrix: coefficients of slot `src` on the columns `cols` (first = leading column). */
interface TraceRow {
  readonly src: number;
  readonly cols: Int32Array;
}

interface TraceMatrix {
  readonly ncols: number;
  /** Degree of its rows' leading monomials, for progress. */
  readonly degree: number;
  readonly pivots: readonly TraceRow[];
  /** In elimination order; `out` is the result's slot, `outCols` its columns. */
  readonly rows: readonly (TraceRow & { readonly out: number; readonly outCols: Int32Array; readonly skip: number })[];
  /** F4's lower rows: each result becomes the pivot of its leading column for the rows after it. */
  readonly resultsPivot: boolean;
}

/**
 * Collects a trace while f4.ts runs (f4ModP, reducedModP and their callers report to it). A run
 * that cannot be replayed (the unit ideal, an unknown polynomial) marks it broken.
 */
export class F4Recorder {
  private readonly slotOf = new Map<F4Poly, number>();
  private readonly inputMons: Int32Array[] = [];
  private readonly ops: TraceOp[] = [];
  private next = 0;
  broken = false;

  input(f: F4Poly): void {
    this.slotOf.set(f, this.next++);
    this.inputMons.push(f.mons);
  }

  /** `to` holds the same coefficients as `from` (possibly on other monomials). */
  alias(from: F4Poly, to: F4Poly): void {
    this.slotOf.set(to, this.slot(from));
  }

  monic(from: F4Poly, to: F4Poly): void {
    const dst = this.next++;
    this.ops.push({ kind: "monic", src: this.slot(from), dst });
    this.slotOf.set(to, dst);
  }

  /** to.coeffs[t] = from.coeffs[perm[t]]. */
  permute(from: F4Poly, to: F4Poly, perm: Int32Array): void {
    const dst = this.next++;
    this.ops.push({ kind: "permute", src: this.slot(from), dst, perm });
    this.slotOf.set(to, dst);
  }

  /** One reduced matrix: used pivots and productive rows as (polynomial, columns); `results[k]` is row k's result. */
  matrix(
    ncols: number,
    degree: number,
    pivots: readonly { f: F4Poly; cols: Int32Array }[],
    rows: readonly { f: F4Poly; cols: Int32Array; result: F4Poly; resultCols: Int32Array }[],
    skip: number,
    resultsPivot: boolean,
  ): void {
    const m: TraceMatrix = {
      ncols,
      degree,
      pivots: pivots.map((r) => ({ src: this.slot(r.f), cols: r.cols })),
      rows: rows.map((r) => ({ src: this.slot(r.f), cols: r.cols, out: this.next++, outCols: r.resultCols, skip })),
      resultsPivot,
    };
    rows.forEach((r, k) => this.slotOf.set(r.result, m.rows[k].out));
    this.ops.push({ kind: "matrix", matrix: m });
  }

  /** The trace ending in `outputs`, or null when the run cannot be replayed. */
  finish(outputs: readonly F4Poly[]): F4Trace | null {
    if (this.broken) return null;
    const out = outputs.map((g) => ({ slot: this.slotOf.get(g) ?? -1, mons: g.mons }));
    if (out.some((o) => o.slot < 0)) return null;
    return { inputMons: this.inputMons, ops: this.ops, outputs: out, slots: this.next };
  }

  private slot(f: F4Poly): number {
    const s = this.slotOf.get(f);
    if (s === undefined) { this.broken = true; return 0; }
    return s;
  }
}

/** Counts of a replay, for the bench and the tests. */
export interface ReplayStats {
  replayed: number;
  declined: number;
}

/**
 * The learnt run at prime p on `inputs` (same supports as when learnt): the reduced basis as F4
 * would give it, or null when a row's result leaves its learnt columns (then run F4 itself).
 */
export function replayF4(trace: F4Trace, inputs: readonly F4Poly[], p: number, limits: Limits, prime?: { readonly k: number; readonly of: number }): F4Poly[] | null {
  if (inputs.length !== trace.inputMons.length) return null;
  const slots: Int32Array[] = new Array(trace.slots);
  for (let i = 0; i < inputs.length; i++) {
    if (!sameArray(inputs[i].mons, trace.inputMons[i])) return null;
    slots[i] = inputs[i].coeffs;
  }
  const elim = new Eliminator(p, limits);
  let rows = 0, made = 0; // rows reduced so far; of them, new basis elements (F4's lower rows)
  for (const op of trace.ops) {
    if (op.kind === "monic") {
      const src = slots[op.src];
      if (src[0] === 1) { slots[op.dst] = src; continue; }
      const c = invModP(src[0], p), dst = new Int32Array(src.length);
      for (let t = 0; t < dst.length; t++) dst[t] = mulModP(src[t], c, p);
      slots[op.dst] = dst;
    } else if (op.kind === "permute") {
      const src = slots[op.src], perm = op.perm, dst = new Int32Array(perm.length);
      for (let t = 0; t < perm.length; t++) dst[t] = src[perm[t]];
      slots[op.dst] = dst;
    } else {
      const m = op.matrix;
      rows += m.rows.length;
      if (m.resultsPivot) made += m.rows.length;
      limits.checkTime();
      limits.progress({
        pairsLeft: 0, basisSize: made, degree: m.degree, reductions: rows,
        matrixRows: m.pivots.length + m.rows.length, matrixColumns: m.ncols,
        ...(prime ? { prime: prime.k, primes: prime.of } : {}),
      });
      const pivots: ({ cols: Int32Array; coeffs: Int32Array } | undefined)[] = new Array(m.ncols);
      for (const r of m.pivots) pivots[r.cols[0]] = { cols: r.cols, coeffs: slots[r.src] };
      for (const r of m.rows) {
        const red = elim.reduce({ cols: r.cols, coeffs: slots[r.src] }, pivots, m.ncols, r.skip);
        if (!red || !sameArray(red.cols, r.outCols)) return null;
        if (m.resultsPivot) pivots[red.cols[0]] = red;
        slots[r.out] = red.coeffs;
      }
    }
  }
  return trace.outputs.map((o) => ({ mons: o.mons, coeffs: slots[o.slot] }));
}

function sameArray(a: Int32Array, b: Int32Array): boolean {
  if (a.length !== b.length) return false;
  for (let t = 0; t < a.length; t++) if (a[t] !== b[t]) return false;
  return true;
}

/**
 * A trace as bytes, so that one process can learn a run and others replay it (a distributed
 * run's coordinator learns at its first prime; its workers' task processes, which would each
 * learn the same run again, load it: app/jobs/task-child.ts). Monomial ids belong to one
 * process' table, so the inputs' and outputs' monomials travel as exponent vectors (`exps(id)`:
 * the S = n + 1 packed entries, degree slot included) and are interned again on arrival; the
 * rest is slot numbers and matrix-local column indices, which mean the same everywhere.
 */
export function encodeTrace(trace: F4Trace, S: number, exps: (mon: number) => Int32Array): Uint8Array {
  const w = new IntWriter();
  w.push(TRACE_FORMAT); w.push(S); w.push(trace.slots);
  const monomials = (mons: Int32Array) => {
    w.push(mons.length);
    for (let i = 0; i < mons.length; i++) w.array(exps(mons[i]), false);
  };
  w.push(trace.inputMons.length);
  for (const m of trace.inputMons) monomials(m);
  w.push(trace.ops.length);
  for (const op of trace.ops) {
    if (op.kind === "monic") { w.push(0); w.push(op.src); w.push(op.dst); }
    else if (op.kind === "permute") { w.push(1); w.push(op.src); w.push(op.dst); w.array(op.perm); }
    else {
      const m = op.matrix;
      w.push(2); w.push(m.ncols); w.push(m.degree); w.push(m.resultsPivot ? 1 : 0);
      w.push(m.pivots.length);
      for (const r of m.pivots) { w.push(r.src); w.array(r.cols); }
      w.push(m.rows.length);
      for (const r of m.rows) { w.push(r.src); w.array(r.cols); w.push(r.out); w.array(r.outCols); w.push(r.skip); }
    }
  }
  w.push(trace.outputs.length);
  for (const o of trace.outputs) { w.push(o.slot); monomials(o.mons); }
  const ints = w.done();
  return new Uint8Array(ints.buffer, ints.byteOffset, ints.byteLength);
}

/** encodeTrace's bytes as a trace on this process' monomials (`intern` as MonomialTable.intern). */
export function decodeTrace(bytes: Uint8Array, S: number, intern: (e: Int32Array, off: number) => number): F4Trace {
  // Copied when unaligned (a Buffer from the database may start anywhere in its pool).
  const ints = bytes.byteOffset % 4 === 0
    ? new Int32Array(bytes.buffer, bytes.byteOffset, bytes.byteLength >> 2)
    : new Int32Array(bytes.slice().buffer);
  let at = 0;
  const next = () => ints[at++];
  const array = () => { const len = next(); const a = ints.slice(at, at + len); at += len; return a; };
  const monomials = () => {
    const len = next(), mons = new Int32Array(len);
    for (let i = 0; i < len; i++, at += S) mons[i] = intern(ints, at);
    return mons;
  };
  if (next() !== TRACE_FORMAT) throw new Error("decodeTrace: not a trace of this engine's format");
  if (next() !== S) throw new Error("decodeTrace: the trace belongs to a ring with another number of variables");
  const slots = next();
  const inputMons = Array.from({ length: next() }, monomials);
  const ops: TraceOp[] = [];
  for (let k = next(); k > 0; k--) {
    const kind = next();
    if (kind === 0) ops.push({ kind: "monic", src: next(), dst: next() });
    else if (kind === 1) { const src = next(), dst = next(); ops.push({ kind: "permute", src, dst, perm: array() }); }
    else {
      const ncols = next(), degree = next(), resultsPivot = next() === 1;
      const pivots = Array.from({ length: next() }, () => { const src = next(); return { src, cols: array() }; });
      const rows = Array.from({ length: next() }, () => {
        const src = next(), cols = array(), out = next(), outCols = array(), skip = next();
        return { src, cols, out, outCols, skip };
      });
      ops.push({ kind: "matrix", matrix: { ncols, degree, pivots, rows, resultsPivot } });
    }
  }
  const outputs = Array.from({ length: next() }, () => { const slot = next(); return { slot, mons: monomials() }; });
  if (at !== ints.length) throw new Error("decodeTrace: trailing data");
  return { inputMons, ops, outputs, slots };
}

/** Bumped when encodeTrace's layout changes, so a stored trace of another layout is refused. */
const TRACE_FORMAT = 0x54524301;

/** A growable Int32Array. */
class IntWriter {
  private buf = new Int32Array(1 << 16);
  private n = 0;
  push(x: number): void {
    if (this.n === this.buf.length) this.grow(1);
    this.buf[this.n++] = x;
  }
  /** With its length first unless `withLength` is false. */
  array(a: Int32Array, withLength = true): void {
    if (withLength) this.push(a.length);
    if (this.n + a.length > this.buf.length) this.grow(a.length);
    this.buf.set(a, this.n);
    this.n += a.length;
  }
  done(): Int32Array {
    return this.buf.subarray(0, this.n);
  }
  private grow(extra: number): void {
    const b = new Int32Array(Math.max(this.buf.length * 2, this.n + extra));
    b.set(this.buf.subarray(0, this.n));
    this.buf = b;
  }
}
