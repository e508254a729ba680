import { AlgebraError } from "../algebra/index";
import type { GroebnerOptions, LimitOptions } from "../algebra/index";
import type { DistributionHook } from "../algebra/f4/distribution";

/** What analyseNetwork reports while it works. */
export interface AnalysisProgress {
  /** "structure", "linear-elimination", "parametrisation", "groebner", "acr", "relations", "steady-states". */
  readonly phase: string;
  readonly message: string;
}

/** The engine's limits (groebner/limits.ts) for a whole analysis, with progress reported by phase. */
export interface BudgetOptions extends Pick<LimitOptions, "deadline" | "maxBasisSize" | "maxTerms" | "signal"> {
  /** Relative time limit in ms (default 30 000). */
  readonly timeoutMs?: number;
  readonly onProgress?: (p: AnalysisProgress) => void;
  /** Large bases over Q may be computed on many machines (f4/distribution.ts); passed to every Gröbner phase. */
  readonly distribution?: DistributionHook;
}

/**
 * One time and size budget shared by every phase. A phase may take only a share of what is left,
 * so that a costly optional step (the full lex basis) cannot starve the steady states. (Common practice.)
 * Example: with 20 s left, budget.groebner(0.25) hands a Gröbner basis a deadline 5 s from now.
 */
export class Budget {
  readonly deadline: number;
  constructor(private readonly options: BudgetOptions = {}) {
    const rel = Date.now() + (options.timeoutMs ?? 30_000);
    this.deadline = Math.min(options.deadline ?? Infinity, rel);
  }

  /** Gröbner options for a phase allowed `share` (0..1] of the remaining time; engine progress is forwarded (at most every 250 ms). */
  groebner(share = 1, phase = "groebner"): GroebnerOptions {
    const left = Math.max(0, this.deadline - Date.now());
    let last = 0;
    return {
      deadline: Date.now() + left * share,
      signal: this.options.signal,
      maxBasisSize: this.options.maxBasisSize,
      maxTerms: this.options.maxTerms,
      ...(this.options.distribution ? { distribution: this.options.distribution } : {}),
      onProgress: this.options.onProgress
        ? (p) => {
            const now = Date.now();
            if (now - last < 250) return;
            last = now;
            this.progress(phase, `Gröbner basis: ${p.basisSize} polynomials, ${p.pairsLeft} pairs left, degree ${p.degree}`);
          }
        : undefined,
    };
  }

  /** Throws when cancelled or out of time. */
  check(what: string): void {
    if (this.options.signal?.aborted) throw new AlgebraError("cancelled", `${what}: cancelled`);
    if (Date.now() > this.deadline) throw new AlgebraError("timeout", `${what}: deadline exceeded`);
  }

  progress(phase: string, message: string): void {
    this.options.onProgress?.({ phase, message });
  }
}

/** True for the errors a phase turns into a warning (time or size budget); cancellation propagates. */
export const isBudgetError = (e: unknown): e is AlgebraError =>
  e instanceof AlgebraError && (e.code === "timeout" || e.code === "budget");

/** Also true for the univariate layer's deadline errors. */
export function isOutOfBudget(e: unknown): boolean {
  if (isBudgetError(e)) return true;
  return e instanceof Error && e.name === "UnivariateError" && (e as { code?: string }).code === "deadline";
}
