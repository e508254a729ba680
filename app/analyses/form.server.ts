/** Reads the start-analysis form into the same input object the JSON API takes. */
export function analysisInputFromForm(form: FormData): Record<string, unknown> {
  const prefixed = (prefix: string) => {
    const out: Record<string, string> = {};
    for (const [k, v] of form.entries()) if (k.startsWith(prefix) && typeof v === "string" && v.trim() !== "") out[k.slice(prefix.length)] = v.trim();
    return out;
  };
  const initial = prefixed("initial.");
  return {
    order: String(form.get("order") ?? ""),
    free: form.getAll("free").map(String),
    rateMode: String(form.get("rateMode") ?? "numeric"),
    rateValues: prefixed("rate."),
    initial: Object.keys(initial).length > 0 ? initial : null,
    timeLimitSeconds: String(form.get("timeLimitSeconds") ?? ""),
    maxBasisSize: String(form.get("maxBasisSize") ?? ""),
    notify: form.get("notify") === "on",
  };
}
