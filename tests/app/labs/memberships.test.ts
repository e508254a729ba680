import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, snapshot, tearDownAccountsDb } from "../auth/fixtures";

describe.skipIf(!hasTestDatabase)("memberships and the last-owner rule", () => {
  let t: TestDatabase;
  let olga: { id: string };
  let otto: { id: string };
  let vera: { id: string };
  let cookie: Record<string, string>;
  let members: typeof import("~/routes/lab-members");
  let lab: typeof import("~/routes/lab");

  beforeAll(async () => {
    t = await setUpAccountsDb();
    olga = await makeUser(t.db, "olga@lab.test", "Olga");
    otto = await makeUser(t.db, "otto@lab.test", "Otto");
    vera = await makeUser(t.db, "vera@lab.test", "Vera");
    await makeLab(t.db, "kinetics", "Kinetics", [[olga.id, "owner"], [vera.id, "viewer"]]);
    cookie = { olga: await sessionCookieFor(olga.id), otto: await sessionCookieFor(otto.id), vera: await sessionCookieFor(vera.id) };
    members = await import("~/routes/lab-members");
    lab = await import("~/routes/lab");
  });
  afterAll(async () => tearDownAccountsDb(t));

  const post = (who: string, form: Record<string, string>) =>
    run(members.action, makeRequest("/labs/kinetics/members", { form, cookie: cookie[who] }), { labSlug: "kinetics" });
  const leave = (who: string) => run(lab.action, makeRequest("/labs/kinetics", { form: { intent: "leave" }, cookie: cookie[who] }), { labSlug: "kinetics" });
  const roles = async () =>
    Object.fromEntries((await t.db.selectFrom("memberships").select(["user_id", "role"]).execute()).map((r) => [r.user_id, r.role]));

  it("the only owner can neither be demoted, removed nor leave", async () => {
    const before = await snapshot(t.db);
    const demote = await post("olga", { intent: "change-role", userId: olga.id, role: "editor" });
    expect(demote.status).toBe(409);
    expect((demote.body as { error: string }).error).toMatch(/at least one owner/);
    expect((await post("olga", { intent: "remove", userId: olga.id })).status).toBe(409);
    expect((await leave("olga")).status).toBe(409);
    expect(await snapshot(t.db)).toBe(before);
  });

  it("with a second owner, the first may step down and leave", async () => {
    await t.db.insertInto("memberships").values({ lab_id: (await t.db.selectFrom("labs").select("id").executeTakeFirstOrThrow()).id, user_id: otto.id, role: "owner" }).execute();
    expect((await post("olga", { intent: "change-role", userId: olga.id, role: "editor" })).status).toBe(200);
    expect((await roles())[olga.id]).toBe("editor");
    // Olga is no longer an owner: she cannot manage members any more.
    expect((await post("olga", { intent: "change-role", userId: vera.id, role: "editor" })).status).toBe(403);
    // Otto is now the last owner.
    expect((await post("otto", { intent: "change-role", userId: otto.id, role: "viewer" })).status).toBe(409);
    const left = await leave("olga");
    expect(left.status).toBe(302);
    expect((await roles())[olga.id]).toBeUndefined();
  });

  it("an owner changes roles and removes members, and each change is audited", async () => {
    expect((await post("otto", { intent: "change-role", userId: vera.id, role: "editor" })).status).toBe(200);
    expect((await roles())[vera.id]).toBe("editor");
    expect((await post("otto", { intent: "remove", userId: vera.id })).status).toBe(200);
    expect((await roles())[vera.id]).toBeUndefined();
    const kinds = (await t.db.selectFrom("audit_events").select("kind").orderBy("created_at").execute()).map((r) => r.kind);
    expect(kinds).toEqual(["membership.role_changed", "membership.left", "membership.role_changed", "membership.removed"]);
  });

  it("refuses unknown roles and members", async () => {
    expect((await post("otto", { intent: "change-role", userId: otto.id, role: "admin" })).status).toBe(400);
    expect((await post("otto", { intent: "remove", userId: vera.id })).status).toBe(404);
    expect((await post("otto", { intent: "explode" })).status).toBe(400);
  });
});
