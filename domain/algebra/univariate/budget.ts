import { UnivariateError } from "./errors";

/**
 * Limits for operations that can run long: `deadline` is an absolute time in milliseconds
 * (as from `Date.now()`), `signal` an AbortSignal. Both optional.
 */
export interface RunLimits {
  readonly deadline?: number;
  readonly signal?: AbortSignal;
}

/**
 * Throws a UnivariateError (reason "aborted" or "deadline") when a limit has been reached.
 * Example: checkLimits({ deadline: Date.now() - 1 }, "isolation") throws a "timeout" error.
 */
export function checkLimits(limits: RunLimits | undefined, what: string): void {
  if (!limits) return;
  if (limits.signal?.aborted) throw new UnivariateError("aborted", `${what} was cancelled`);
  if (limits.deadline !== undefined && Date.now() > limits.deadline) {
    throw new UnivariateError("deadline", `${what} passed its deadline`);
  }
}
