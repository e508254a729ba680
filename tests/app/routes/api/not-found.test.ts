import { describe, expect, it } from "vitest";
import { action, loader } from "~/routes/api/not-found";

/** Unknown /api/ paths answer the documented JSON error shape with 404, for reads and writes alike. */
describe("unknown API routes", () => {
  it("GET answers 404 with { error: { code, message, details } }", async () => {
    const request = new Request("http://127.0.0.1/api/no/such/thing");
    const res = loader({ request, params: {}, context: {} } as never) as Response;
    expect(res.status).toBe(404);
    expect(res.headers.get("content-type")).toMatch(/application\/json/);
    expect(await res.json()).toEqual({ error: { code: "not_found", message: "No API route GET /api/no/such/thing.", details: { path: "/api/no/such/thing" } } });
  });

  it("POST answers the same shape", async () => {
    const request = new Request("http://127.0.0.1/api/labs/x/nothing", { method: "POST", body: "{}" });
    const res = action({ request, params: {}, context: {} } as never) as Response;
    expect(res.status).toBe(404);
    expect((await res.json()).error.code).toBe("not_found");
  });
});
