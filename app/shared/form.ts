/** Form-action helpers shared by every feature: one result shape, and fields read as text. */
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

/** Every text field of a form, as the plain object the JSON API takes. */
export function formObject(form: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of form.entries()) if (typeof v === "string") out[k] = v;
  return out;
}
