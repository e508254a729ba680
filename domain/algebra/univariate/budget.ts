import type { LimitOptions } from "../groebner/limits";
import { UnivariateError } from "./errors";

/**
 * The part of the engine's one limits type (groebner/limits.ts) that univariate work honours:
 * `deadline`, an absolute time in milliseconds (as from `Date.now()`), and `signal`.
 */
export type RunLimits = Pick<LimitOptions, "deadline" | "signal">;

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
