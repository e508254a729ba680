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
