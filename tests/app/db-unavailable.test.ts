import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { allowConsoleError } from "../support/console-errors";
import { makeRequest, run } from "./auth/fixtures";

/**
 * With the database down, requests get a 503 with Retry-After in the API's error shape (issue 16
 * #11), not "Unexpected Server Error". Port 9 (discard) on loopback: nothing speaks PostgreSQL.
 */
describe("the database is unreachable", () => {
  const saved = { ...process.env };
  beforeAll(() => {
    process.env.DATABASE_URL = "postgres://postgres@127.0.0.1:9/none";
    process.env.SESSION_SECRET = "test-session-secret-0123456789abcdef0123456789";
    process.env.TOTP_SECRET = "ab".repeat(32);
    process.env.APP_URL = "http://127.0.0.1:3999";
  });
  afterAll(async () => {
    const { closeDb } = await import("~/db.server");
    await closeDb();
    process.env = saved;
  });

  it("an API request answers 503 with Retry-After and the error shape", async () => {
    allowConsoleError(/^\[db\] cannot connect/);
    const labs = await import("~/routes/api/labs");
    const out = await run(labs.loader, makeRequest("/api/labs", { bearer: "stp_" + "a".repeat(40) }));
    expect(out.status).toBe(503);
    expect(out.response!.headers.get("Retry-After")).toMatch(/^\d+$/);
    expect(out.body).toMatchObject({ error: { code: "unavailable" } });
  });

  it("a form post (sign-in) answers 503 too, and health still reports instead of throwing", async () => {
    allowConsoleError(/^\[db\] cannot connect/);
    const signIn = await import("~/routes/sign-in");
    const out = await run(signIn.action, makeRequest("/sign-in", { form: { email: "ada@example.org" } }));
    expect(out.status).toBe(503);
    const health = await import("~/routes/api/health");
    const h = await run(health.loader, makeRequest("/api/health"));
    expect(h.status).toBe(503);
    expect((h.body as { database: { reachable: boolean } }).database.reachable).toBe(false);
  });
});
