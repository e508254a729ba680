/** Raised when an exact linear-algebra computation would exceed the size budget it was given. */
export class LinearBudgetError extends Error {
  constructor(
    message: string,
    readonly limit: number,
  ) {
    super(message);
    this.name = "LinearBudgetError";
  }
}
