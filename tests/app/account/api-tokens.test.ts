import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";

describe.skipIf(!hasTestDatabase)("personal API tokens", () => {
  let t: TestDatabase;
  let ada: { id: string };
  let bo: { id: string };
  let adaCookie: string;
  let account: typeof import("~/routes/account");
  let apiLab: typeof import("~/routes/api/lab");
  let apiMe: typeof import("~/routes/api/me");

  beforeAll(async () => {
    t = await setUpAccountsDb();
    ada = await makeUser(t.db, "ada@lab.test", "Ada");
    bo = await makeUser(t.db, "bo@lab.test", "Bo");
    await makeLab(t.db, "kinetics", "Kinetics", [[ada.id, "editor"]]);
    adaCookie = await sessionCookieFor(ada.id);
    account = await import("~/routes/account");
    apiLab = await import("~/routes/api/lab");
    apiMe = await import("~/routes/api/me");
  });
  afterAll(async () => tearDownAccountsDb(t));

  async function createToken(name: string, expiresInDays = "") {
    const out = await run(account.action, makeRequest("/account", { form: { intent: "create-token", name, expiresInDays }, cookie: adaCookie }));
    expect(out.status).toBe(200);
    return (out.body as { secret: string }).secret;
  }

  it("shows the token once and stores only its SHA-256", async () => {
    const token = await createToken("laptop script");
    expect(token).toMatch(/^stp_[A-Za-z0-9_-]{43}$/);
    const rows = await t.db.selectFrom("api_tokens").selectAll().where("user_id", "=", ada.id).execute();
    expect(rows).toHaveLength(1);
    expect(rows[0]!.token_hash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(rows)).not.toContain(token);
    // The account page lists it without the secret.
    const page = await run(account.loader, makeRequest("/account", { cookie: adaCookie }));
    expect(JSON.stringify(page.body)).not.toContain(token);
    expect((page.body as { tokens: { name: string }[] }).tokens.map((x) => x.name)).toEqual(["laptop script"]);
  });

  it("acts with the owner's roles on /api and records last use", async () => {
    const token = await createToken("roles");
    const me = await run(apiMe.loader, makeRequest("/api/me", { bearer: token }));
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ user: { email: "ada@lab.test" }, labs: [{ slug: "kinetics", role: "editor" }] });
    const lab = await run(apiLab.loader, makeRequest("/api/labs/kinetics", { bearer: token }), { labSlug: "kinetics" });
    expect(lab.body).toEqual({ lab: { slug: "kinetics", name: "Kinetics", public: false }, role: "editor", guest: false });
    const row = await t.db.selectFrom("api_tokens").select("last_used_at").where("name", "=", "roles").executeTakeFirstOrThrow();
    expect(row.last_used_at).toBeInstanceOf(Date);
  });

  it("stops working the moment it is revoked; only its owner can revoke it", async () => {
    const token = await createToken("to revoke");
    const id = (await t.db.selectFrom("api_tokens").select("id").where("name", "=", "to revoke").executeTakeFirstOrThrow()).id;
    const boCookie = await sessionCookieFor(bo.id);
    const stranger = await run(account.action, makeRequest("/account", { form: { intent: "revoke-token", tokenId: id }, cookie: boCookie }));
    expect(stranger.status).toBe(404);
    expect((await run(apiMe.loader, makeRequest("/api/me", { bearer: token }))).status).toBe(200);

    const revoked = await run(account.action, makeRequest("/account", { form: { intent: "revoke-token", tokenId: id }, cookie: adaCookie }));
    expect(revoked.status).toBe(200);
    const after = await run(apiMe.loader, makeRequest("/api/me", { bearer: token }));
    expect(after.status).toBe(401);
    expect(after.body).toEqual({ error: { code: "invalid_token", message: expect.any(String) } });
    expect(after.response!.headers.get("WWW-Authenticate")).toMatch(/Bearer error="invalid_token"/);
    const kinds = (await t.db.selectFrom("audit_events").select("kind").where("actor_id", "=", ada.id).execute()).map((r) => r.kind);
    expect(kinds).toContain("api_token.created");
    expect(kinds).toContain("api_token.revoked");
  });

  it("refuses an expired token", async () => {
    const token = await createToken("short-lived", "1");
    expect((await run(apiMe.loader, makeRequest("/api/me", { bearer: token }))).status).toBe(200);
    await t.db.updateTable("api_tokens").set({ expires_at: new Date(Date.now() - 1000) }).where("name", "=", "short-lived").execute();
    expect((await run(apiMe.loader, makeRequest("/api/me", { bearer: token }))).status).toBe(401);
  });

  it("a bad bearer token is refused even when a valid session cookie is sent too", async () => {
    const out = await run(apiMe.loader, makeRequest("/api/me", { bearer: "stp_nonsense", cookie: adaCookie }));
    expect(out.status).toBe(401);
    const cookieOnly = await run(apiMe.loader, makeRequest("/api/me", { cookie: adaCookie }));
    expect(cookieOnly.status).toBe(200);
  });

  it("validates name and expiry", async () => {
    const noName = await run(account.action, makeRequest("/account", { form: { intent: "create-token", name: " " }, cookie: adaCookie }));
    expect(noName.status).toBe(400);
    const badDays = await run(account.action, makeRequest("/account", { form: { intent: "create-token", name: "x", expiresInDays: "4000" }, cookie: adaCookie }));
    expect(badDays.status).toBe(400);
  });
});
