/** Result of a form action, for `data(result, { status })` and the page to show. */
export interface ActionResult {
  status: number;
  error?: string;
  notice?: string;
  /** A secret shown exactly once (a new API token). */
  secret?: string;
}

export const ok = (notice: string, extra: Partial<ActionResult> = {}): ActionResult => ({ status: 200, notice, ...extra });
export const refuse = (status: number, error: string): ActionResult => ({ status, error });

export function field(form: FormData, name: string): string {
  const v = form.get(name);
  return typeof v === "string" ? v : "";
}
