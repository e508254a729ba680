import { describe, expect, it } from "vitest";
import { apiError } from "~/permissions/api-errors";

describe("apiError", () => {
  it("uses the one error shape with the matching status", async () => {
    const res = apiError("forbidden", "Needs owner.", { role: "viewer" });
    expect(res.status).toBe(403);
    expect(res.headers.get("Content-Type")).toMatch(/application\/json/);
    expect(await res.json()).toEqual({ error: { code: "forbidden", message: "Needs owner.", details: { role: "viewer" } } });
  });

  it("leaves out details when there are none and asks for a bearer token on 401", async () => {
    const res = apiError("unauthenticated", "Sign in.");
    expect(res.status).toBe(401);
    expect(res.headers.get("WWW-Authenticate")).toBe("Bearer");
    expect(await res.json()).toEqual({ error: { code: "unauthenticated", message: "Sign in." } });
  });
});
