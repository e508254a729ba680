/**
 * The subset of JSON Schema 2020-12 (the dialect of OpenAPI 3.1) that our request schemas use,
 * with a checker, so one schema object both validates a body and appears in /api/openapi.json.
 * Keywords: type, properties, required, additionalProperties (boolean), items, anyOf, maxLength,
 * minLength, enum, description, examples, $ref (to #/components/schemas/…, resolved by the caller).
 *
 * Example: checkJson({ type: "object", properties: { name: { type: "string" } } }, { name: 5 })
 * is [{ path: "/name", message: "expected a string, got a number" }].
 */
export interface JsonSchema {
  type?: "object" | "string" | "number" | "integer" | "boolean" | "array" | "null";
  description?: string;
  properties?: Record<string, JsonSchema>;
  required?: string[];
  additionalProperties?: boolean;
  items?: JsonSchema;
  anyOf?: JsonSchema[];
  maxLength?: number;
  minLength?: number;
  enum?: (string | number)[];
  examples?: unknown[];
  $ref?: string;
}

export interface SchemaProblem {
  /** JSON Pointer (RFC 6901) of the offending value, `` for the whole body. */
  readonly path: string;
  readonly message: string;
}

const kind = (v: unknown): string => (v === null ? "null" : Array.isArray(v) ? "array" : typeof v === "number" ? (Number.isInteger(v) ? "integer" : "number") : typeof v);
const article = (t: string) => (/^[aeiou]/.test(t) ? `an ${t}` : `a ${t}`);

export function checkJson(schema: JsonSchema, value: unknown, path = ""): SchemaProblem[] {
  if (schema.anyOf) {
    const attempts = schema.anyOf.map((s) => checkJson(s, value, path));
    return attempts.some((a) => a.length === 0) ? [] : [{ path, message: `matches none of: ${schema.anyOf.map((s) => s.type ?? "schema").join(", ")}` }];
  }
  const problems: SchemaProblem[] = [];
  if (schema.type) {
    const k = kind(value);
    const ok = schema.type === k || (schema.type === "number" && k === "integer");
    if (!ok) return [{ path, message: `expected ${article(schema.type)}, got ${article(k)}` }];
  }
  if (schema.enum && !schema.enum.includes(value as string | number)) problems.push({ path, message: `expected one of ${schema.enum.join(", ")}` });
  if (typeof value === "string") {
    if (schema.maxLength !== undefined && value.length > schema.maxLength) problems.push({ path, message: `longer than ${schema.maxLength} characters` });
    if (schema.minLength !== undefined && value.length < schema.minLength) problems.push({ path, message: `shorter than ${schema.minLength} characters` });
  }
  if (Array.isArray(value) && schema.items) value.forEach((v, i) => problems.push(...checkJson(schema.items!, v, `${path}/${i}`)));
  if (kind(value) === "object" && (schema.properties || schema.required)) {
    const obj = value as Record<string, unknown>;
    for (const r of schema.required ?? []) if (!(r in obj)) problems.push({ path: `${path}/${r}`, message: "is required" });
    for (const [k, v] of Object.entries(obj)) {
      const sub = schema.properties?.[k];
      if (sub) problems.push(...checkJson(sub, v, `${path}/${k.replace(/~/g, "~0").replace(/\//g, "~1")}`));
      else if (schema.additionalProperties === false) problems.push({ path: `${path}/${k}`, message: "is not a known field" });
    }
  }
  return problems;
}
