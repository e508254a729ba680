import type { Exponents } from "../monomial";
import { divides } from "../monomial";
import type { MonomialComparator } from "../order";
import type { EngineCoefficients } from "./coefficients";

/** Engine-internal polynomial: coefficients apart from packed monomials, terms decreasing. */
export interface EPoly<C> {
  readonly coeffs: C[];
  readonly exps: Exponents;
}

/** A polynomial usable as a reducer, with its leading monomial's divisibility mask cached. */
export interface Reducer<C> {
  readonly poly: EPoly<C>;
  readonly mask: number;
}

export function maskOf(e: Exponents, off: number, n: number): number {
  let mask = 0;
  for (let k = 1; k <= n; k++) if (e[off + k] !== 0) mask |= 1 << ((k - 1) & 31);
  return mask;
}

export const toReducer = <C>(poly: EPoly<C>, n: number): Reducer<C> => ({ poly, mask: maskOf(poly.exps, 0, n) });

/** What the algorithms need from a reduction kernel. */
export interface Kernel<C> {
  steps: number;
  reduce(f: EPoly<C>, reducers: readonly Reducer<C>[], full: boolean, forced?: EPoly<C> | null): EPoly<C>;
}

/**
 * Reduction of a polynomial by a set of reducers (Cox, Little, O'Shea, ch. 2 §3; Becker and
 * Weispfenning, "Gröbner Bases", 1993, §5.1 "reduction"). The working polynomial lives in two
 * reusable scratch buffers; each step merges the tail of p with −b·m·g into the other buffer.
 * `full` reduces every term (normal form); otherwise only the head (top reduction).
 */
export class ReductionKernel<C> implements Kernel<C> {
  private curE: Int32Array = new Int32Array(1024);
  private nxtE: Int32Array = new Int32Array(1024);
  private outE: Int32Array = new Int32Array(1024);
  private curC: C[] = [];
  private nxtC: C[] = [];
  private readonly tm: Int32Array;
  private readonly q: Int32Array;
  /** Reduction steps performed so far (for progress/limits). */
  steps = 0;

  constructor(
    private readonly K: EngineCoefficients<C>,
    private readonly n: number,
    private readonly cmp: MonomialComparator,
    private readonly tick: () => void = () => {},
    /** Normalise results (monic / primitive); off for normal forms that must keep their scale. */
    private readonly normalizeResults = true,
  ) {
    this.tm = new Int32Array(n + 1);
    this.q = new Int32Array(n + 1);
  }

  /**
   * `forced`, when given, performs the first step (its leading monomial must divide LM(f)):
   * that is how an S-polynomial m1·f − m2·g is formed with the right partner g.
   */
  reduce(f: EPoly<C>, reducers: readonly Reducer<C>[], full: boolean, forced: EPoly<C> | null = null): EPoly<C> {
    const K = this.K, n = this.n, S = n + 1, cmp = this.cmp, tm = this.tm, q = this.q;
    let len = f.coeffs.length;
    if (this.curE.length < len * S) this.curE = new Int32Array(len * S * 2);
    let curE = this.curE, nxtE = this.nxtE;
    let curC = this.curC, nxtC = this.nxtC;
    curE.set(f.exps.subarray(0, len * S));
    for (let i = 0; i < len; i++) curC[i] = f.coeffs[i];
    let outE = this.outE;
    const outC: C[] = [];
    let outLen = 0;
    let head = 0;
    // Deadline checks by terms merged, not by steps: over Z one step on long polynomials with
    // huge coefficients can take seconds (the modular replay's coefficients can double per
    // reduction), so counting steps alone overran deadlines several-fold.
    let work = 0;
    const termsPerTick = K.termsPerTick;
    const nred = reducers.length;
    while (head < len) {
      const off = head * S;
      let mmask = 0;
      for (let k = 1; k <= n; k++) if (curE[off + k] !== 0) mmask |= 1 << ((k - 1) & 31);
      let g: EPoly<C> | null = forced;
      forced = null;
      if (g === null) for (let r = 0; r < nred; r++) {
        const red = reducers[r];
        if ((red.mask & ~mmask) === 0 && divides(red.poly.exps, 0, curE, off, n)) {
          g = red.poly;
          break;
        }
      }
      if (g === null) {
        if (!full) break;
        if (outE.length < (outLen + 1) * S) {
          const bigger = new Int32Array(outE.length * 2);
          bigger.set(outE);
          outE = this.outE = bigger;
        }
        for (let k = 0; k < S; k++) outE[outLen * S + k] = curE[off + k];
        outC[outLen++] = curC[head];
        head++;
        continue;
      }
      const gC = g.coeffs, gE = g.exps, glen = gC.length;
      this.steps++;
      if (++work >= termsPerTick) {
        work = 0;
        this.tick();
      }
      const [a, b] = K.reductionFactors(curC[head], gC[0], this.tick);
      const aOne = K.isOne(a);
      for (let k = 0; k <= n; k++) q[k] = curE[off + k] - gE[k];
      const need = (len - head - 1 + glen - 1) * S;
      if (nxtE.length < need) nxtE = new Int32Array(need * 2);
      let i = head + 1, j = 1, k = 0;
      if (j < glen) for (let t = 0; t <= n; t++) tm[t] = gE[S + t] + q[t];
      while (i < len || j < glen) {
        if (++work >= termsPerTick) {
          work = 0;
          this.tick();
        }
        const c = i >= len ? -1 : j >= glen ? 1 : cmp(curE, i * S, tm, 0);
        const ko = k * S;
        if (c > 0) {
          nxtC[k] = aOne ? curC[i] : K.mul(a, curC[i]);
          const io = i * S;
          for (let t = 0; t < S; t++) nxtE[ko + t] = curE[io + t];
          i++; k++;
        } else {
          let v: C;
          if (c < 0) v = K.negMul(b, gC[j]);
          else {
            v = K.mulSub(aOne ? curC[i] : K.mul(a, curC[i]), b, gC[j]);
            i++;
          }
          if (!K.isZero(v)) {
            nxtC[k] = v;
            for (let t = 0; t < S; t++) nxtE[ko + t] = tm[t];
            k++;
          }
          j++;
          if (j < glen) {
            const jo = j * S;
            for (let t = 0; t <= n; t++) tm[t] = gE[jo + t] + q[t];
          }
        }
      }
      if (!aOne) {
        for (let t = 0; t < outLen; t++) outC[t] = K.mul(a, outC[t]);
        work += outLen;
      }
      const te = curE; curE = nxtE; nxtE = te;
      const tc = curC; curC = nxtC; nxtC = tc;
      head = 0;
      len = k;
    }
    this.curE = curE; this.nxtE = nxtE; this.curC = curC; this.nxtC = nxtC;
    // Result: the irreducible terms, then (top reduction) the untouched rest.
    const rest = len - head;
    const total = outLen + rest;
    const coeffs: C[] = new Array(total);
    const exps = new Int32Array(total * S);
    for (let t = 0; t < outLen; t++) coeffs[t] = outC[t];
    exps.set(outE.subarray(0, outLen * S));
    for (let t = 0; t < rest; t++) coeffs[outLen + t] = curC[head + t];
    exps.set(curE.subarray(head * S, len * S), outLen * S);
    curC.length = 0; nxtC.length = 0;
    if (this.normalizeResults) K.normalize(coeffs, this.tick);
    return { coeffs, exps };
  }
}
