/**
 * The subset of JSON Schema 2020-12 (the dialect of OpenAPI 3.1) that our hand-written response
 * schemas use. Request bodies are zod schemas (./schemas.ts), published with z.toJSONSchema.
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
