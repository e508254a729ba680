/**
 * Request and response schemas of the JSON API (JSON Schema 2020-12). Those marked as enforced
 * are the very objects the routes check bodies with (see app/networks/api.server.ts), and
 * /api/openapi.json publishes them as they are.
 */
import type { JsonSchema } from "./json-schema";

// Lengths stay in the descriptions: the save code checks them and answers per field.
const text = (description: string, _maxLength?: number): JsonSchema => ({ type: "string", description });

/** Body of POST …/networks (JSON form); exactly one of csv, sbml, reactions carries the network. */
export const NETWORK_CREATE: JsonSchema = {
  type: "object",
  description: "A new network. Give the reactions as our CSV (`csv`), as SBML (`sbml`) or as a reaction list (`reactions`).",
  properties: {
    name: text("Network name (required, at most 200 characters).", 200),
    description: text("Free text, at most 5000 characters.", 5000),
    tags: { anyOf: [{ type: "string", description: "Comma-separated tags." }, { type: "array", items: { type: "string" } }] },
    csv: text("Our CSV: `reaction,label,rate,reverse_rate,rate_value,reverse_rate_value`."),
    sbml: text("An SBML Level 2 Version 4 or Level 3 Version 1/2 Core document with mass-action kinetic laws."),
    reactions: text("A reaction list, one per line: `binding: E + S <-> C, kon = 2, koff = 1`."),
    changeNote: text("Kept with the first version, at most 500 characters.", 500),
  },
  examples: [{ name: "Enzyme", csv: "reaction,rate\nE + S <-> C,kon\nC -> E + P,kcat\n" }],
};

/** Body of POST …/networks/{networkId}/versions (JSON form). */
export const VERSION_CREATE: JsonSchema = {
  type: "object",
  description: "A new version of a network: the reactions in one of the three forms, and a change note.",
  properties: {
    csv: NETWORK_CREATE.properties!.csv!,
    sbml: NETWORK_CREATE.properties!.sbml!,
    reactions: NETWORK_CREATE.properties!.reactions!,
    changeNote: text("What changed, at most 500 characters.", 500),
  },
};

/** Where a problem of an uploaded file is. */
export const FILE_PROBLEM: JsonSchema = {
  type: "object",
  required: ["row", "message"],
  properties: {
    row: { type: "integer", description: "1-based line of the file." },
    column: text("Column (CSV), part of the line (reaction list)."),
    columnIndex: { type: "integer", description: "1-based column (CSV)." },
    element: text("SBML element, e.g. `reaction`."),
    id: text("SBML id of that element."),
    message: text("What is wrong."),
    expected: text("What would have been accepted."),
  },
};

/** The one error shape. */
export const API_ERROR: JsonSchema = {
  type: "object",
  required: ["error"],
  properties: {
    error: {
      type: "object",
      required: ["code", "message"],
      properties: {
        code: { type: "string", enum: ["unauthenticated", "invalid_token", "forbidden", "not_found", "invalid_request", "conflict", "rate_limited", "method_not_allowed"] },
        message: text("For people."),
        details: { type: "object", description: "Located problems (`problems`: FileProblem[]), field messages (`fields`), SBML reaction outcomes (`reactions`)." },
      },
    },
  },
};

/** Body of POST /api/labs (checked by the route's own code). */
export const LAB_CREATE: JsonSchema = { type: "object", required: ["name"], properties: { name: text("Lab name.") } };

/** Body of POST …/analyses (checked by the analysis settings parser, app/analyses/params.ts). */
export const ANALYSIS_CREATE: JsonSchema = {
  type: "object",
  required: ["networkId"],
  properties: {
    networkId: text("Network id (UUID)."),
    version: { type: "integer", description: "Version number; the newest when left out." },
    order: { type: "array", items: { type: "string" }, description: "Species elimination order." },
    free: { type: "array", items: { type: "string" } },
    rateMode: { type: "string", enum: ["numeric", "symbolic"], description: "Substitute the version's rate values (numeric, the default) or keep them symbolic." },
    rateValues: { type: "object", description: "Rate symbol → value (decimal or fraction text)." },
    initial: { type: "object", description: "Species → initial concentration (decimal or fraction text)." },
    timeLimitSeconds: { type: "integer", description: "Whole seconds, at least 1, at most the lab's maximum." },
    maxBasisSize: { type: "integer" },
    notify: { type: "boolean" },
  },
};

/** Body of POST …/analyses/{analysisId}/scans (checked by the scan settings parser). */
export const SCAN_CREATE: JsonSchema = {
  type: "object",
  required: ["parameterKind", "parameter", "from", "to"],
  properties: {
    parameterKind: { type: "string", enum: ["rate", "initial"] },
    parameter: text("Rate symbol or species name."),
    from: { type: "number" },
    to: { type: "number" },
    points: { type: "integer" },
    spacing: { type: "string", enum: ["linear", "log"] },
    timeLimitSeconds: { type: "integer" },
  },
};
