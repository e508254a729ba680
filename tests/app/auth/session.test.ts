import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { APP_URL, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "./fixtures";

describe.skipIf(!hasTestDatabase)("server-side sessions", () => {
  let t: TestDatabase;
  let userId: string;
  let otherId: string;

  beforeAll(async () => {
    t = await setUpAccountsDb();
    userId = (await makeUser(t.db, "sam@lab.test", "Sam")).id;
    otherId = (await makeUser(t.db, "other@lab.test", "Other")).id;
  });
  afterAll(async () => tearDownAccountsDb(t));

  const isSignedIn = async (cookie: string) => {
    const { getOptionalUser } = await import("~/permissions/permissions.server");
    return (await getOptionalUser(makeRequest("/", { cookie })))?.id ?? null;
  };
  const sessionRows = (id: string) =>
    t.db.selectFrom("sessions").select("id_hash").where("user_id", "=", id).execute();

  it("sets an httpOnly, SameSite=Lax, signed cookie (not Secure on plain http)", async () => {
    const { getSession, commitSession } = await import("~/auth/session.server");
    const session = await getSession(new Request(APP_URL));
    session.set("userId", userId);
    const header = await commitSession(session);
    expect(header).toMatch(/^stillpoint_session=[^;]+\.[^;]+;/); // value.signature
    expect(header).toMatch(/HttpOnly/);
    expect(header).toMatch(/SameSite=Lax/);
    expect(header).toMatch(/Path=\//);
    expect(header).not.toMatch(/Secure/);
  });

  it("stores only the SHA-256 of the session id", async () => {
    const cookie = await sessionCookieFor(userId);
    const { getSession } = await import("~/auth/session.server");
    const id = (await getSession(makeRequest("/", { cookie }))).id;
    expect(id.length).toBeGreaterThan(20);
    const hashes = (await sessionRows(userId)).map((r) => r.id_hash);
    expect(hashes).toContain(createHash("sha256").update(id).digest("hex"));
    expect(hashes).not.toContain(id);
  });

  it("rejects a tampered cookie", async () => {
    const cookie = await sessionCookieFor(userId);
    const [name, value] = cookie.split("=");
    const forged = `${name}=${value!.slice(0, -3)}abc`;
    expect(await isSignedIn(forged)).toBeNull();
  });

  it("sign-out deletes the session row, so a copied cookie stops working", async () => {
    const cookie = await sessionCookieFor(userId);
    expect(await isSignedIn(cookie)).toBe(userId);
    const signOut = await import("~/routes/sign-out");
    const out = await run(signOut.action, makeRequest("/sign-out", { method: "POST", cookie }));
    expect(out.status).toBe(302);
    expect(out.response!.headers.get("Set-Cookie")).toMatch(/Expires=Thu, 01 Jan 1970/);
    expect(await isSignedIn(cookie)).toBeNull();
  });

  it("'sign out everywhere' ends every session of that user and no one else's", async () => {
    const a = await sessionCookieFor(userId);
    const b = await sessionCookieFor(userId);
    const other = await sessionCookieFor(otherId);
    const before = (await sessionRows(userId)).length;
    expect(before).toBeGreaterThanOrEqual(2);
    const account = await import("~/routes/account");
    const out = await run(account.action, makeRequest("/account", { form: { intent: "sign-out-everywhere" }, cookie: a }));
    expect(out.status).toBe(302);
    expect(await isSignedIn(a)).toBeNull();
    expect(await isSignedIn(b)).toBeNull();
    expect(await isSignedIn(other)).toBe(otherId);
    expect(await sessionRows(userId)).toHaveLength(0);
    const audit = await t.db.selectFrom("audit_events").select("details").where("kind", "=", "auth.signed_out_everywhere").executeTakeFirstOrThrow();
    expect(audit.details).toEqual({ sessions: before });
  });

  it("a request that read the session before 'sign out everywhere' cannot bring it back by saving", async () => {
    const { getSession, commitSession, destroyAllSessionsOf } = await import("~/auth/session.server");
    const stolen = await sessionCookieFor(userId);
    // A stolen cookie's request (say, the lab switch) reads its session...
    const inFlight = await getSession(makeRequest("/", { cookie: stolen }));
    expect(inFlight.get("userId")).toBe(userId);
    // ...the victim signs out everywhere...
    await destroyAllSessionsOf(userId);
    // ...and then the in-flight request saves what it read.
    inFlight.set("labSlug", "somewhere");
    await commitSession(inFlight);
    expect(await isSignedIn(stolen)).toBeNull();
    expect(await sessionRows(userId)).toHaveLength(0);
  });

  it("an anonymous session whose row is gone still keeps what it is given (sign-in needs returnTo)", async () => {
    const { getSession, commitSession } = await import("~/auth/session.server");
    const first = await getSession(new Request(APP_URL));
    first.set("returnTo", "/labs/x");
    const cookie = (await commitSession(first)).split(";")[0]!;
    await t.db.deleteFrom("sessions").where("user_id", "is", null).execute();
    const again = await getSession(makeRequest("/", { cookie }));
    again.set("returnTo", "/labs/y");
    await commitSession(again);
    expect((await getSession(makeRequest("/", { cookie }))).get("returnTo")).toBe("/labs/y");
  });

  it("a signed-out cookie reused for a new sign-in gets a fresh session id (no fixation)", async () => {
    const { getSession, rotateSession } = await import("~/auth/session.server");
    const planted = await sessionCookieFor(otherId);
    const oldId = (await getSession(makeRequest("/", { cookie: planted }))).id;
    const header = await rotateSession(await getSession(makeRequest("/", { cookie: planted })), { userId });
    const fresh = header.split(";")[0]!;
    const newId = (await getSession(makeRequest("/", { cookie: fresh }))).id;
    expect(newId).not.toBe(oldId);
    expect(await isSignedIn(planted)).toBeNull();
    expect(await isSignedIn(fresh)).toBe(userId);
  });

  it("marks the cookie Secure when the app is served over https", async () => {
    vi.resetModules();
    const previous = process.env.APP_URL;
    process.env.APP_URL = "https://stillpoint.example.org";
    try {
      const { getSession, commitSession } = await import("~/auth/session.server");
      const header = await commitSession(await getSession(new Request("https://stillpoint.example.org/")));
      expect(header).toMatch(/; Secure/);
    } finally {
      process.env.APP_URL = previous;
      const { closeDb } = await import("~/db.server");
      await closeDb();
      vi.resetModules();
    }
  });
});
