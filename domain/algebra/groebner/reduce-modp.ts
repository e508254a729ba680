import { invMod } from "../field";
import { divides } from "../monomial";
import type { MonomialComparator } from "../order";
import type { EPoly, Kernel, Reducer } from "./reduce";

/**
 * The reduction of ReductionKernel (reduce.ts), step for step the same (same reducer choice, same
 * results), specialised to Z/p with p < 2^26 on numbers: the arithmetic is inline instead of
 * calls through EngineCoefficients. The generic kernel runs on bigints and Rationals as well, so
 * its call sites are polymorphic and V8 does not inline them; the traced run modulo p that
 * modular.ts replays over Z spends almost all its time here. Measured on katsura-7 (grevlex):
 * the run modulo 2^26 − 5 took about half the time with this kernel (see bench/README.md).
 */
export class ModPReductionKernel implements Kernel<number> {
  private curE: Int32Array = new Int32Array(1024);
  private nxtE: Int32Array = new Int32Array(1024);
  private outE: Int32Array = new Int32Array(1024);
  private curC: number[] = [];
  private nxtC: number[] = [];
  private readonly tm: Int32Array;
  private readonly q: Int32Array;
  steps = 0;

  constructor(
    private readonly p: number,
    private readonly n: number,
    private readonly cmp: MonomialComparator,
    private readonly tick: () => void = () => {},
    private readonly normalizeResults = true,
  ) {
    if (!(p < 2 ** 26)) throw new RangeError(`ModPReductionKernel: prime ${p} is not below 2^26`);
    this.tm = new Int32Array(n + 1);
    this.q = new Int32Array(n + 1);
  }

  reduce(f: EPoly<number>, reducers: readonly Reducer<number>[], full: boolean, forced: EPoly<number> | null = null): EPoly<number> {
    const p = this.p, n = this.n, S = n + 1, cmp = this.cmp, tm = this.tm, q = this.q;
    let len = f.coeffs.length;
    if (this.curE.length < len * S) this.curE = new Int32Array(len * S * 2);
    let curE = this.curE, nxtE = this.nxtE;
    let curC = this.curC, nxtC = this.nxtC;
    curE.set(f.exps.subarray(0, len * S));
    for (let i = 0; i < len; i++) curC[i] = f.coeffs[i];
    let outE = this.outE;
    const outC: number[] = [];
    let outLen = 0;
    let head = 0;
    let work = 0;
    const termsPerTick = 1 << 16;
    const nred = reducers.length;
    while (head < len) {
      const off = head * S;
      let mmask = 0;
      for (let k = 1; k <= n; k++) if (curE[off + k] !== 0) mmask |= 1 << ((k - 1) & 31);
      let g: EPoly<number> | null = forced;
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
      // a = 1 over a field; b = lc(p) / lc(g) (reducers are monic here, so usually lc(p) itself).
      const lcg = gC[0];
      const b = lcg === 1 ? curC[head] : (curC[head] * invMod(lcg, p)) % p;
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
          nxtC[k] = curC[i];
          const io = i * S;
          for (let t = 0; t < S; t++) nxtE[ko + t] = curE[io + t];
          i++; k++;
        } else {
          let v = (b * gC[j]) % p;
          if (c < 0) v = v === 0 ? 0 : p - v;
          else {
            v = curC[i] - v;
            if (v < 0) v += p;
            i++;
          }
          if (v !== 0) {
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
      const te = curE; curE = nxtE; nxtE = te;
      const tc = curC; curC = nxtC; nxtC = tc;
      head = 0;
      len = k;
    }
    this.curE = curE; this.nxtE = nxtE; this.curC = curC; this.nxtC = nxtC;
    const rest = len - head;
    const total = outLen + rest;
    const coeffs: number[] = new Array(total);
    const exps = new Int32Array(total * S);
    for (let t = 0; t < outLen; t++) coeffs[t] = outC[t];
    exps.set(outE.subarray(0, outLen * S));
    for (let t = 0; t < rest; t++) coeffs[outLen + t] = curC[head + t];
    exps.set(curE.subarray(head * S, len * S), outLen * S);
    curC.length = 0; nxtC.length = 0;
    if (this.normalizeResults && total > 0 && coeffs[0] !== 1) {
      const inv = invMod(coeffs[0], p);
      for (let t = 0; t < total; t++) coeffs[t] = (coeffs[t] * inv) % p;
    }
    return { coeffs, exps };
  }
}
