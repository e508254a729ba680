/**
 * The algebra engine's single error family. Every failure the engine reports on purpose is an
 * `AlgebraError` with a machine-readable `code`; parse errors also carry a 1-based line/column.
 *
 * Example: `new AlgebraError('timeout', 'Gröbner basis: deadline exceeded after 120 pairs')`.
 */
export type AlgebraErrorCode =
  | "parse" // bad polynomial / order / file text
  | "ring" // mismatched rings, unknown variable, bad field
  | "domain" // mathematically undefined (division by zero, non-zero-dimensional ideal, ...)
  | "timeout" // deadline exceeded
  | "budget" // size budget exceeded (basis size, pairs, terms)
  | "cancelled"; // AbortSignal fired

export interface SourceLocation {
  readonly line: number;
  readonly column: number;
}

export class AlgebraError extends Error {
  readonly code: AlgebraErrorCode;
  readonly location?: SourceLocation;
  readonly expected?: string;

  constructor(code: AlgebraErrorCode, message: string, extra: { location?: SourceLocation; expected?: string } = {}) {
    const where = extra.location ? ` at line ${extra.location.line}, column ${extra.location.column}` : "";
    super(`${message}${where}`);
    this.name = "AlgebraError";
    this.code = code;
    this.location = extra.location;
    this.expected = extra.expected;
  }
}

export const isAlgebraError = (e: unknown): e is AlgebraError => e instanceof AlgebraError;
