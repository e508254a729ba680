import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { APP_URL, makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";

/**
 * Cookie-authenticated API writes (issue 16 #4): a page on another origin (here another port of
 * the same host) must not be able to make the victim's browser create things with the session
 * cookie, whatever body type it picks. Bearer-token clients keep every body type.
 */
const CSV = "reaction,rate\nA -> B,k1\n";
const LIST = "/api/labs/alpha/networks";
const alpha = { labSlug: "alpha" };

describe.skipIf(!hasTestDatabase)("cookie-authenticated API writes", () => {
  let t: TestDatabase;
  let cookie: string;
  let token: string;
  let api: typeof import("~/routes/api/networks");
  const networks = async () => (await t.db.selectFrom("networks").select("id").execute()).length;

  beforeAll(async () => {
    t = await setUpAccountsDb();
    const editor = await makeUser(t.db, "ed@origin.test", "Ed");
    await makeLab(t.db, "alpha", "Alpha", [[editor.id, "editor"]]);
    cookie = await sessionCookieFor(editor.id);
    const { createApiToken } = await import("~/account/api-tokens.server");
    const { db } = await import("~/db.server");
    token = (await createApiToken(db(), { userId: editor.id, name: "origin test", expiresAt: null })).token;
    api = await import("~/routes/api/networks");
  });
  afterAll(async () => tearDownAccountsDb(t));

  const post = (body: BodyInit, headers: Record<string, string>) =>
    new Request(new URL(`${LIST}?name=Planted`, APP_URL), { method: "POST", body, headers });

  it("refuses form, multipart, text/plain and typeless bodies sent with the cookie, changing nothing", async () => {
    const form = new FormData();
    form.set("file", new File([CSV], "x.csv"));
    form.set("name", "Planted");
    const attempts: Request[] = [
      post(CSV, { Cookie: cookie, "Content-Type": "text/plain", Origin: "http://127.0.0.1:4000" }),
      post(CSV, { Cookie: cookie, "Content-Type": "text/plain" }),
      post(new URLSearchParams({ name: "Planted", csv: CSV }), { Cookie: cookie }),
      new Request(new URL(LIST, APP_URL), { method: "POST", body: form, headers: { Cookie: cookie } }),
      post(CSV, { Cookie: cookie, "Content-Type": "text/csv" }),
    ];
    for (const request of attempts) {
      const out = await run(api.action, request, alpha);
      expect([403, 415]).toContain(out.status);
      expect((out.body as { error: { code: string } }).error.code).toMatch(/^(cross_origin|unsupported_media_type)$/);
    }
    expect(await networks()).toBe(0);
  });

  it("refuses JSON with the cookie from another origin (another port of the same host) or a cross-site fetch", async () => {
    const json = JSON.stringify({ name: "Planted", csv: CSV });
    const other = await run(api.action, post(json, { Cookie: cookie, "Content-Type": "application/json", Origin: "http://127.0.0.1:4000" }), alpha);
    expect(other.status).toBe(403);
    expect((other.body as { error: { code: string } }).error.code).toBe("cross_origin");
    const site = await run(api.action, post(json, { Cookie: cookie, "Content-Type": "application/json", "Sec-Fetch-Site": "same-site" }), alpha);
    expect(site.status).toBe(403);
    expect(await networks()).toBe(0);
  });

  it("accepts same-origin JSON with the cookie, and any body type with a bearer token", async () => {
    const own = await run(api.action, makeRequest(LIST, { cookie, json: { name: "Own page", csv: CSV }, headers: { Origin: APP_URL } }), alpha);
    expect(own.status).toBe(201);
    const bearer = await run(api.action, post(CSV, { Authorization: `Bearer ${token}`, "Content-Type": "text/csv", Origin: "http://127.0.0.1:4000" }), alpha);
    expect(bearer.status).toBe(201);
    expect(await networks()).toBe(2);
  });

  it("leaves cookie reads alone", async () => {
    const list = await run(api.loader, makeRequest(LIST, { cookie, headers: { Origin: "http://127.0.0.1:4000" } }), alpha);
    expect(list.status).toBe(200);
  });
});
