/**
 * The OpenAPI 3.1 description of the JSON API (OpenAPI Specification 3.1.0, 2021), built from
 * the route catalogue below and the schemas in ./schemas. Every request body schema is
 * `z.toJSONSchema` of the zod schema the route checks the body with (app/api/body.ts), so the
 * document follows the check; what a schema cannot say (species of this network, the lab's limits)
 * the route's own parser checks next, and its problems come back located as well.
 * A test keeps the catalogue equal to the /api routes of app/routes.ts and each body schema equal
 * to its zod schema's JSON Schema.
 */
import { z } from "zod/v4";
import * as S from "./schemas";
import type { JsonSchema } from "./json-schema";

type Role = "signed-in" | "viewer" | "editor" | "owner" | "public";
interface Operation {
  readonly method: "get" | "post" | "delete";
  readonly path: string;
  readonly summary: string;
  readonly role: Role;
  readonly body?: { schema: keyof typeof BODY_SCHEMAS; alsoAccepts?: string[] };
  readonly ok: number;
}

/** The zod schema of each request body, by its name in components.schemas. */
export const BODY_SCHEMAS = {
  NetworkCreate: S.NETWORK_CREATE,
  VersionCreate: S.VERSION_CREATE,
  LabCreate: S.LAB_CREATE,
  AnalysisCreate: S.ANALYSIS_CREATE,
  ScanCreate: S.SCAN_CREATE,
} as const;

const LAB = "/api/labs/{labSlug}";
export const API_OPERATIONS: readonly Operation[] = [
  { method: "get", path: "/api/health", summary: "Health: database reachable, migrations applied.", role: "public", ok: 200 },
  { method: "get", path: "/api/me", summary: "Who the token (or session) acts as, their labs with roles, and the public labs (`publicLabs`) they may read as a guest.", role: "signed-in", ok: 200 },
  { method: "get", path: "/api/openapi.json", summary: "This document.", role: "signed-in", ok: 200 },
  { method: "get", path: "/api/labs", summary: "The caller's labs.", role: "signed-in", ok: 200 },
  { method: "post", path: "/api/labs", summary: "Create a lab owned by the caller.", role: "signed-in", body: { schema: "LabCreate" }, ok: 201 },
  { method: "get", path: LAB, summary: "The lab (`public` when every signed-in person may read it), the caller's role, and `guest` when they read a public lab without being a member.", role: "viewer", ok: 200 },
  { method: "get", path: `${LAB}/members`, summary: "Who is in the lab, with roles (members only: a guest of a public lab gets 404).", role: "viewer", ok: 200 },
  { method: "get", path: `${LAB}/audit`, summary: "The lab's audit trail, newest first.", role: "owner", ok: 200 },
  { method: "get", path: `${LAB}/networks`, summary: "The lab's networks with counts (`?archived=1` includes archived).", role: "viewer", ok: 200 },
  {
    method: "post",
    path: `${LAB}/networks`,
    summary: "Create a network from JSON, a multipart `file` (.csv, .xml/.sbml, .txt), a text/csv body or an application/sbml+xml body (`?name=`).",
    role: "editor",
    body: { schema: "NetworkCreate", alsoAccepts: ["multipart/form-data", "text/csv", "application/sbml+xml"] },
    ok: 201,
  },
  { method: "get", path: `${LAB}/networks/{networkId}`, summary: "The network, its newest version (CSV) and that version's structure (null, with structureStatus \"pending\", until the worker has computed it).", role: "viewer", ok: 200 },
  { method: "get", path: `${LAB}/networks/{networkId}/versions`, summary: "Every version, newest first.", role: "viewer", ok: 200 },
  {
    method: "post",
    path: `${LAB}/networks/{networkId}/versions`,
    summary: "Save a new version; the same body forms as creating a network. 409 when the content equals a version.",
    role: "editor",
    body: { schema: "VersionCreate", alsoAccepts: ["multipart/form-data", "text/csv", "application/sbml+xml"] },
    ok: 201,
  },
  { method: "get", path: `${LAB}/networks/{networkId}/versions/{number}`, summary: "One version with its CSV and structure (null, with structureStatus \"pending\", until computed).", role: "viewer", ok: 200 },
  { method: "get", path: `${LAB}/analyses`, summary: "The lab's analyses, newest first (`?networkId=`).", role: "viewer", ok: 200 },
  { method: "post", path: `${LAB}/analyses`, summary: "Start an analysis of a network version (202, queued).", role: "editor", body: { schema: "AnalysisCreate" }, ok: 202 },
  { method: "get", path: `${LAB}/analyses/{analysisId}`, summary: "Status, progress, name, note, archived flag; the result once succeeded, else `partialResult`: the stages finished so far (their `unfinished` lists the rest).", role: "viewer", ok: 200 },
  { method: "delete", path: `${LAB}/analyses/{analysisId}`, summary: "Cancel (as POST …/cancel).", role: "editor", ok: 200 },
  { method: "post", path: `${LAB}/analyses/{analysisId}/cancel`, summary: "Cancel: a queued analysis at once, a running one within a heartbeat.", role: "editor", ok: 200 },
  { method: "get", path: `${LAB}/analyses/{analysisId}/scans`, summary: "The scans started from this analysis.", role: "viewer", ok: 200 },
  { method: "post", path: `${LAB}/analyses/{analysisId}/scans`, summary: "Start a parameter scan (202, queued).", role: "editor", body: { schema: "ScanCreate" }, ok: 202 },
  { method: "get", path: `${LAB}/scans/{scanId}`, summary: "Status, progress and (once succeeded) the scan's points.", role: "viewer", ok: 200 },
  { method: "delete", path: `${LAB}/scans/{scanId}`, summary: "Cancel (as POST …/cancel).", role: "editor", ok: 200 },
  { method: "post", path: `${LAB}/scans/{scanId}/cancel`, summary: "Cancel a scan.", role: "editor", ok: 200 },
];

const ROLE_TEXT: Record<Role, string> = {
  public: "No sign-in needed.",
  "signed-in": "Any signed-in caller (bearer token or session cookie).",
  viewer: "Members of the lab (viewer or above); others get 404 as for a missing lab.",
  editor: "Editors and owners of the lab; viewers get 403, non-members 404.",
  owner: "Owners of the lab; other members get 403, non-members 404.",
};

const errorResponse = (description: string) => ({ description, content: { "application/json": { schema: { $ref: "#/components/schemas/ApiError" } } } });

export function openApiDocument(version: string): Record<string, unknown> {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const op of API_OPERATIONS) {
    const params = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => ({ name: m[1], in: "path", required: true, schema: { type: m[1] === "number" ? "integer" : "string" } }));
    const responses: Record<string, unknown> = { [String(op.ok)]: { description: "Success.", content: { "application/json": { schema: { type: "object" } } } } };
    if (op.role !== "public") responses["401"] = errorResponse("No or invalid credentials.");
    if (op.role === "viewer" || op.role === "editor" || op.role === "owner") responses["404"] = errorResponse("No such lab or resource (also for labs the caller is not in).");
    if (op.role === "editor" || op.role === "owner") responses["403"] = errorResponse("The caller's role is too low.");
    if (op.body) responses["400"] = errorResponse("The body has problems, located in `details` (file problems with line, column or SBML element id).");
    if (op.path.endsWith("/versions") && op.method === "post") responses["409"] = errorResponse("The content equals an existing version.");
    const operation: Record<string, unknown> = {
      summary: op.summary,
      description: ROLE_TEXT[op.role],
      operationId: `${op.method}${op.path.replace(/^\/api/, "").replace(/\{(\w+)\}/g, "By_$1").replace(/[^A-Za-z0-9]+(.)?/g, (_, c: string | undefined) => (c ? c.toUpperCase() : ""))}`,
      ...(params.length > 0 ? { parameters: params } : {}),
      ...(op.role === "public" ? { security: [] } : {}),
      responses,
    };
    if (op.body) {
      const content: Record<string, unknown> = { "application/json": { schema: { $ref: `#/components/schemas/${op.body.schema}` } } };
      for (const t of op.body.alsoAccepts ?? []) content[t] = { schema: t === "multipart/form-data" ? { type: "object", properties: { file: { type: "string", contentMediaType: "application/octet-stream" }, name: { type: "string" } } } : { type: "string" } };
      operation.requestBody = { required: true, content };
      operation["x-enforced-by-schema"] = true;
    }
    (paths[op.path] ??= {})[op.method] = operation;
  }
  const schemas: Record<string, unknown> = {
    ...Object.fromEntries(Object.entries(BODY_SCHEMAS).map(([name, schema]) => [name, bodyJsonSchema(schema)])),
    FileProblem: S.FILE_PROBLEM,
    ApiError: S.API_ERROR,
  };
  return {
    openapi: "3.1.0",
    info: {
      title: "Stillpoint JSON API",
      version,
      description:
        "Reaction networks with mass-action kinetics: labs, networks and their versions (CSV, SBML or reaction lists in), analyses and scans. Errors always have the shape `{ error: { code, message, details? } }`.",
    },
    jsonSchemaDialect: "https://json-schema.org/draft/2020-12/schema",
    servers: [{ url: "/" }],
    security: [{ bearerToken: [] }, { sessionCookie: [] }],
    paths,
    components: {
      schemas,
      securitySchemes: {
        bearerToken: { type: "http", scheme: "bearer", description: "A personal API token from the account page (`stp_…`)." },
        sessionCookie: { type: "apiKey", in: "cookie", name: "stillpoint_session", description: "The browser session after signing in." },
      },
    },
  };
}

/**
 * A body schema as published: z.toJSONSchema in the 2020-12 dialect, as the request is read
 * (`io: "input"`), without the `$schema` key (the document names its dialect once).
 */
export function bodyJsonSchema(schema: z.ZodType): Record<string, unknown> {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { target: "draft-2020-12", io: "input" }) as Record<string, unknown>;
  return rest;
}
