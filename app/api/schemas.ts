/**
 * Request bodies of the JSON API as zod schemas (zod 4 API), and the response shapes as JSON
 * Schema 2020-12. Every route with a JSON body checks it with its schema here (app/api/body.ts),
 * and /api/openapi.json publishes `z.toJSONSchema` of the very same schema, so the document and
 * the check cannot drift (tests/app/api/openapi.test.ts compares them). What a schema cannot say
 * (a species of this network, a value within the lab's limits, a name not yet taken) the route's
 * own parser checks after it, answering per field as before.
 */
import { z } from "zod/v4";
import type { JsonSchema } from "./json-schema";

// Lengths stay in the descriptions: the save code checks them and answers per field.
const text = (description: string) => z.string().describe(description);
/** A number as JSON, or its exact text (`"1/3"`, `"2.5e-3"`), read exactly by the route. */
const exactNumber = z.union([z.string(), z.number()]);

const CSV = text("Our CSV: `reaction,label,rate,reverse_rate,rate_value,reverse_rate_value`, with optional `# constant: A = 2, B` and `# initial: X = 1` lines.");
const SBML = text("An SBML Level 2 Version 4 or Level 3 Version 1/2 Core document with mass-action kinetic laws.");
const REACTIONS = text("A reaction list, one per line: `binding: E + S <-> C, kon = 2, koff = 1`.");

/** Body of POST …/networks (JSON form); exactly one of csv, sbml, reactions carries the network. */
export const NETWORK_CREATE = z
  .object({
    name: text("Network name (required, at most 200 characters).").optional(),
    description: text("Free text, at most 5000 characters.").optional(),
    tags: z.union([z.string().describe("Comma-separated tags."), z.array(z.string())]).optional(),
    csv: CSV.optional(),
    sbml: SBML.optional(),
    reactions: REACTIONS.optional(),
    changeNote: text("Kept with the first version, at most 500 characters.").optional(),
  })
  .meta({
    description: "A new network. Give the reactions as our CSV (`csv`), as SBML (`sbml`) or as a reaction list (`reactions`).",
    examples: [{ name: "Enzyme", csv: "reaction,rate\nE + S <-> C,kon\nC -> E + P,kcat\n" }],
  });

/** Body of POST …/networks/{networkId}/versions (JSON form). */
export const VERSION_CREATE = z
  .object({ csv: CSV.optional(), sbml: SBML.optional(), reactions: REACTIONS.optional(), changeNote: text("What changed, at most 500 characters.").optional() })
  .meta({ description: "A new version of a network: the reactions in one of the three forms, and a change note." });

/** Body of POST /api/labs. */
export const LAB_CREATE = z.object({ name: text("Lab name.") }).meta({ description: "A new lab, owned by the caller." });

/** Body of POST …/analyses; the analysis settings parser (app/analyses/params.ts) checks it against the network next. */
export const ANALYSIS_CREATE = z
  .object({
    networkId: text("Network id (UUID)."),
    version: z.union([z.int().min(1), z.string().regex(/^[0-9]+$/)]).nullable().optional().describe("Version number; the newest when left out."),
    order: z.union([z.array(z.string()), z.string()]).optional().describe("Species elimination order (a list, or names separated by `,`)."),
    free: z.union([z.array(z.string()), z.string()]).optional().describe("Species kept free (last in the order)."),
    rateMode: z.enum(["numeric", "symbolic"]).optional().describe("Substitute the version's rate values (numeric, the default) or keep them symbolic."),
    rateValues: z.record(z.string(), exactNumber).optional().describe("Rate symbol → value (a number, or decimal or fraction text)."),
    initial: z
      .union([z.record(z.string(), exactNumber), z.string()])
      .nullable()
      .optional()
      .describe("Species → initial concentration (a number, or decimal or fraction text), or `S=1, E=1/2`. Left out: a symbolic analysis only."),
    timeLimitSeconds: z.int().min(1).optional().describe("Whole seconds, at least 1, at most the lab's maximum."),
    maxBasisSize: z.int().min(1).optional(),
    notify: z.boolean().optional(),
  })
  .meta({ description: "Start an analysis of a network version." });

/** Body of POST …/analyses/{analysisId}/scans; the scan settings parser checks it next. */
export const SCAN_CREATE = z
  .object({
    parameterKind: z.enum(["rate", "initial"]),
    parameter: text("Rate symbol or species name."),
    from: z.number(),
    to: z.number(),
    points: z.int().min(2).max(200).optional(),
    spacing: z.enum(["linear", "log"]).optional(),
    timeLimitSeconds: z.int().min(1).optional(),
  })
  .meta({ description: "Start a parameter scan from a numeric analysis." });

/** A described string in the hand-written response schemas below. */
const doc = (description: string): JsonSchema => ({ type: "string", description });

/** Where a problem of an uploaded file is. */
export const FILE_PROBLEM: JsonSchema = {
  type: "object",
  required: ["row", "message"],
  properties: {
    row: { type: "integer", description: "1-based line of the file." },
    column: doc("Column (CSV), part of the line (reaction list)."),
    columnIndex: { type: "integer", description: "1-based column (CSV)." },
    element: doc("SBML element, e.g. `reaction`."),
    id: doc("SBML id of that element."),
    message: doc("What is wrong."),
    expected: doc("What would have been accepted."),
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
        message: doc("For people."),
        details: { type: "object", description: "Located problems (`problems`: FileProblem[]), field messages (`fields`), SBML reaction outcomes (`reactions`), a body that does not match its schema (`schema`: { path, message }[], path a JSON Pointer)." },
      },
    },
  },
};

