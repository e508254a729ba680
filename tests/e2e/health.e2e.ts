import { describe, expect, it } from "vitest";
import { baseUrl, hasApp } from "./support/browser";

describe.skipIf(!hasApp)("GET /api/health on the running server", () => {
  it("reports the database reachable and every migration applied", async () => {
    const res = await fetch(`${baseUrl}/api/health`);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({ ok: true, database: { reachable: true }, migrations: { current: true, pending: [] } });
    expect(typeof body.version).toBe("string");
  });
});
