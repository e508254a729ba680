import { AlgebraError } from "../errors";

/** What a long computation reports through `onProgress`. */
export interface Progress {
  readonly pairsLeft: number;
  readonly basisSize: number;
  /** Degree of the S-pair being processed (lcm of the leading monomials). */
  readonly degree: number;
  readonly reductions: number;
  /** F4: rows and columns of the matrix being reduced. */
  readonly matrixRows?: number;
  readonly matrixColumns?: number;
  /** Multi-modular runs: this is prime number `prime` of at most `primes`. */
  readonly prime?: number;
  readonly primes?: number;
}

/**
 * Limits shared by every long operation: a deadline (absolute or relative), size budgets,
 * cancellation by AbortSignal and a progress callback.
 */
export interface LimitOptions {
  /** Absolute deadline in ms since the epoch (Date.now() scale). */
  readonly deadline?: number;
  /** Relative timeout in ms, from the call. */
  readonly timeoutMs?: number;
  /** Largest number of polynomials the basis may reach during the computation. */
  readonly maxBasisSize?: number;
  /** Largest number of pending S-pairs. */
  readonly maxPairs?: number;
  /** Largest number of terms of any polynomial produced. */
  readonly maxTerms?: number;
  /** Most reduction steps one Buchberger run may take (a budget for trying a path first). */
  readonly maxReductions?: number;
  /** Highest degree of a selected pair (the same kind of budget). */
  readonly maxPairDegree?: number;
  readonly signal?: AbortSignal;
  readonly onProgress?: (p: Progress) => void;
}

export class Limits {
  private readonly deadline: number;
  constructor(private readonly options: LimitOptions = {}, private readonly what = "Gröbner basis") {
    const rel = options.timeoutMs !== undefined ? Date.now() + options.timeoutMs : Infinity;
    this.deadline = Math.min(options.deadline ?? Infinity, rel);
  }

  /** Time and cancellation; cheap enough to call every few thousand reduction steps. */
  checkTime(): void {
    if (this.options.signal?.aborted) throw new AlgebraError("cancelled", `${this.what}: cancelled`);
    if (Date.now() > this.deadline) throw new AlgebraError("timeout", `${this.what}: deadline exceeded`);
  }

  checkSizes(basisSize: number, pairs: number, terms = 0): void {
    const o = this.options;
    if (o.maxBasisSize !== undefined && basisSize > o.maxBasisSize) {
      throw new AlgebraError("budget", `${this.what}: basis grew beyond ${o.maxBasisSize} polynomials`);
    }
    if (o.maxPairs !== undefined && pairs > o.maxPairs) throw new AlgebraError("budget", `${this.what}: more than ${o.maxPairs} pending pairs`);
    if (o.maxTerms !== undefined && terms > o.maxTerms) throw new AlgebraError("budget", `${this.what}: a polynomial grew beyond ${o.maxTerms} terms`);
  }

  progress(p: Progress): void {
    const most = this.options.maxReductions;
    if (most !== undefined && p.reductions > most) throw new AlgebraError("budget", `${this.what}: more than ${most} reduction steps`);
    const top = this.options.maxPairDegree;
    if (top !== undefined && p.degree > top) throw new AlgebraError("budget", `${this.what}: a pair of degree above ${top} (reduction steps budget)`);
    this.options.onProgress?.(p);
  }
}
