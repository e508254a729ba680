import { AlgebraError, type AlgebraErrorCode } from "../errors";

/**
 * Finer reasons behind the univariate tools' errors. The errors themselves belong to the engine's
 * single family: a UnivariateError is an AlgebraError whose `code` is the family's code
 * ("domain", "timeout", "cancelled") and whose `reason` says more.
 */
export type UnivariateReason =
  | "zero-polynomial" // an operation that needs a nonzero polynomial got 0
  | "division-by-zero" // divisor is the zero polynomial
  | "not-exact" // an exact division left a remainder
  | "invalid-interval" // an interval that does not isolate a root of the polynomial
  | "invalid-argument" // any other malformed input
  | "deadline" // the caller's deadline passed
  | "aborted"; // the caller's AbortSignal fired

const FAMILY_CODE: Record<UnivariateReason, AlgebraErrorCode> = {
  "zero-polynomial": "domain",
  "division-by-zero": "domain",
  "not-exact": "domain",
  "invalid-interval": "domain",
  "invalid-argument": "domain",
  deadline: "timeout",
  aborted: "cancelled",
};

/**
 * Example: `new UnivariateError("deadline", "real-root isolation passed its deadline")` has
 * code "timeout", reason "deadline", and is an instance of AlgebraError.
 */
export class UnivariateError extends AlgebraError {
  readonly reason: UnivariateReason;
  constructor(reason: UnivariateReason, message: string) {
    super(FAMILY_CODE[reason], message);
    this.name = "UnivariateError";
    this.reason = reason;
  }
}
