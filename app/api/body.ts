/**
 * Checks a JSON request body with its zod schema (app/api/schemas.ts) and answers a mismatch with
 * 400 `invalid_request`, each failing field located by its JSON Pointer (RFC 6901) in
 * `details.schema` as `{ path, message }`, e.g. `{ path: "/csv", message: "expected a string, got an integer" }`.
 */
import type { z } from "zod/v4";
import { apiError } from "~/permissions/api-errors";

export interface SchemaProblem {
  /** JSON Pointer of the offending value, `` for the whole body. */
  readonly path: string;
  readonly message: string;
}

const kind = (v: unknown): string => (v === null ? "null" : Array.isArray(v) ? "array" : typeof v === "number" ? (Number.isInteger(v) ? "integer" : "number") : typeof v);
const article = (t: string) => (/^[aeiou]/.test(t) ? `an ${t}` : `a ${t}`);
const pointer = (path: readonly PropertyKey[]) => path.map((p) => `/${String(p).replace(/~/g, "~0").replace(/\//g, "~1")}`).join("");

/** Our wording of one zod issue (zod's own for bounds and formats). */
function describeIssue(issue: z.core.$ZodIssue): string {
  switch (issue.code) {
    case "invalid_type":
      return issue.input === undefined ? "is required" : `expected ${article(issue.expected === "int" ? "integer" : issue.expected)}, got ${article(kind(issue.input))}`;
    case "invalid_value":
      return `expected one of ${issue.values.map(String).join(", ")}`;
    case "invalid_union":
      return `matches none of the accepted forms (got ${article(kind(issue.input))})`;
    default:
      return issue.message;
  }
}

/** The problems of a body against a schema; [] when it matches. */
export function schemaProblems(schema: z.ZodType, body: unknown): SchemaProblem[] {
  const r = schema.safeParse(body, { reportInput: true });
  return r.success ? [] : r.error.issues.map((i) => ({ path: pointer(i.path), message: describeIssue(i) }));
}

/** The body when it matches the schema; else throws the 400 response. */
export function requireBody<S extends z.ZodType>(schema: S, body: unknown): z.infer<S> {
  const wrong = schemaProblems(schema, body);
  if (wrong.length > 0) throw apiError("invalid_request", `The JSON body does not match the schema: ${wrong.map((p) => `${p.path || "(body)"} ${p.message}`).join("; ")}.`, { schema: wrong });
  return body as z.infer<S>;
}
