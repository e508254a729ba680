import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { cookiesFrom, makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";

describe.skipIf(!hasTestDatabase)("requireActiveLabRole (the lab the user switched to)", () => {
  let t: TestDatabase;
  let ada: { id: string };
  let loner: { id: string };

  beforeAll(async () => {
    t = await setUpAccountsDb();
    ada = await makeUser(t.db, "ada@lab.test", "Ada");
    loner = await makeUser(t.db, "loner@lab.test", "Loner");
    await makeLab(t.db, "alpha", "Alpha", [[ada.id, "owner"]]);
    await makeLab(t.db, "beta", "Beta", [[ada.id, "viewer"]]);
  });
  afterAll(async () => tearDownAccountsDb(t));

  const active = async (cookie: string, min: "viewer" | "editor" | "owner") => {
    const { requireActiveLabRole } = await import("~/permissions/permissions.server");
    return run(async () => requireActiveLabRole(makeRequest("/networks", { cookie }), min), makeRequest("/"));
  };

  it("falls back to the first lab by name, then follows a switch", async () => {
    const cookie = await sessionCookieFor(ada.id);
    expect((await active(cookie, "viewer")).body).toMatchObject({ lab: { slug: "alpha" }, role: "owner" });
    const labs = await import("~/routes/labs");
    const switched = await run(labs.action, makeRequest("/labs", { form: { intent: "switch", slug: "beta" }, cookie }));
    expect(switched.location).toBe("/labs/beta");
    const after = cookiesFrom(switched.response!, cookie);
    expect((await active(after, "viewer")).body).toMatchObject({ lab: { slug: "beta" }, role: "viewer" });
    expect((await active(after, "editor")).status).toBe(403);
  });

  it("sends someone without a lab to /labs, and anonymous visitors to sign in", async () => {
    const none = await active(await sessionCookieFor(loner.id), "viewer");
    expect([none.status, none.location]).toEqual([302, "/labs"]);
    const anon = await active("", "viewer");
    expect(anon.location).toMatch(/^\/sign-in\?returnTo=%2Fnetworks/);
  });
});
