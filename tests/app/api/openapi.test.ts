import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { z } from "zod/v4";
import { API_OPERATIONS, BODY_SCHEMAS, openApiDocument } from "~/api/openapi";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";

/** The /api routes registered in app/routes.ts, as OpenAPI paths (`:labSlug` → `{labSlug}`). */
function registeredApiPaths(): string[] {
  const text = readFileSync("app/routes.ts", "utf8");
  const api = text.slice(text.indexOf('...prefix("api"'));
  return [...api.matchAll(/route\("([^"]+)"/g)].filter((m) => m[1] !== "*").map((m) => `/api/${m[1].replace(/:(\w+)/g, "{$1}")}`).sort();
}

describe("the OpenAPI 3.1 document", () => {
  const doc = openApiDocument("0.0.0-test") as { openapi: string; paths: Record<string, Record<string, { operationId: string; responses: Record<string, unknown>; requestBody?: { content: Record<string, { schema: { $ref?: string } }> } }>>; components: { schemas: Record<string, unknown> } };

  it("is OpenAPI 3.1 and describes exactly the /api routes of app/routes.ts", () => {
    expect(doc.openapi).toBe("3.1.0");
    expect(Object.keys(doc.paths).sort()).toEqual([...new Set(registeredApiPaths())].sort());
  });

  it("publishes, for every route with a body, the JSON Schema of the zod schema that route checks it with", () => {
    const withBody = API_OPERATIONS.filter((op) => op.body);
    expect(withBody.map((op) => `${op.method} ${op.path}`)).toEqual([
      "post /api/labs",
      "post /api/labs/{labSlug}/networks",
      "post /api/labs/{labSlug}/networks/{networkId}/versions",
      "post /api/labs/{labSlug}/analyses",
      "post /api/labs/{labSlug}/analyses/{analysisId}/scans",
    ]);
    for (const op of withBody) {
      const name = op.body!.schema;
      const ref = doc.paths[op.path]![op.method]!.requestBody!.content["application/json"]!.schema.$ref;
      expect(ref).toBe(`#/components/schemas/${name}`);
      // Computed here from zod directly, not through the document's own helper.
      const { $schema: _dialect, ...expected } = z.toJSONSchema(BODY_SCHEMAS[name], { target: "draft-2020-12", io: "input" }) as Record<string, unknown>;
      expect(doc.components.schemas[name]).toEqual(expected);
      expect((doc.paths[op.path]![op.method] as unknown as Record<string, unknown>)["x-enforced-by-schema"]).toBe(true);
    }
    // Spot checks that the generated schema says what the routes need.
    const analysis = doc.components.schemas.AnalysisCreate as { required: string[]; properties: Record<string, { type?: string; enum?: string[] }> };
    expect(analysis.required).toEqual(["networkId"]);
    expect(analysis.properties.rateMode.enum).toEqual(["numeric", "symbolic"]);
    expect(analysis.properties.timeLimitSeconds.type).toBe("integer");
    expect((doc.components.schemas.ScanCreate as { required: string[] }).required).toEqual(["parameterKind", "parameter", "from", "to"]);
  });

  it("every $ref resolves and the network upload lists its other body types", () => {
    const refs = JSON.stringify(doc).match(/"\$ref":"#\/components\/schemas\/(\w+)"/g) ?? [];
    expect(refs.length).toBeGreaterThan(0);
    for (const r of refs) expect(doc.components.schemas).toHaveProperty(r.split("/").pop()!.replace('"', ""));
    const post = doc.paths["/api/labs/{labSlug}/networks"]!.post!;
    expect(Object.keys(post.requestBody!.content)).toEqual(["application/json", "multipart/form-data", "text/csv", "application/sbml+xml"]);
    expect(Object.keys(post.responses).sort()).toEqual(["201", "400", "401", "403", "404"]);
  });

  it("gives every operation a unique id and a success response", () => {
    const ids = Object.values(doc.paths).flatMap((ops) => Object.values(ops).map((o) => o.operationId));
    expect(new Set(ids).size).toBe(API_OPERATIONS.length);
  });
});

describe.skipIf(!hasTestDatabase)("GET /api/openapi.json and the schema check on uploads", () => {
  let t: TestDatabase;
  let token = "";
  beforeAll(async () => {
    t = await setUpAccountsDb();
    const id = (await makeUser(t.db, "reader@openapi.test", "reader")).id;
    await makeLab(t.db, "alpha", "Alpha", [[id, "owner"]]);
    const { createApiToken } = await import("~/account/api-tokens.server");
    const { db } = await import("~/db.server");
    token = (await createApiToken(db(), { userId: id, name: "openapi", expiresAt: null })).token;
  });
  afterAll(async () => tearDownAccountsDb(t));

  it("answers a signed-in caller and refuses an anonymous one", async () => {
    const route = await import("~/routes/api/openapi");
    const ok = await run(route.loader, makeRequest("/api/openapi.json", { bearer: token }));
    expect(ok.status).toBe(200);
    expect((ok.body as { openapi: string }).openapi).toBe("3.1.0");
    const anonymous = await run(route.loader, makeRequest("/api/openapi.json"));
    expect(anonymous.status).toBe(401);
  });

  it("refuses a JSON body that breaks the published schema, with the JSON Pointer of the field", async () => {
    const api = await import("~/routes/api/networks");
    const res = await run(api.action, makeRequest("/api/labs/alpha/networks", { bearer: token, json: { name: "X", csv: 42 } }), { labSlug: "alpha" });
    expect(res.status).toBe(400);
    expect((res.body as { error: { details: { schema: unknown } } }).error.details.schema).toEqual([{ path: "/csv", message: "expected a string, got an integer" }]);
    expect(await t.db.selectFrom("networks").selectAll().execute()).toEqual([]);
  });
});
