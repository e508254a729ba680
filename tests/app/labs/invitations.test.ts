import { createHash } from "node:crypto";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, snapshot, tearDownAccountsDb } from "../auth/fixtures";

describe.skipIf(!hasTestDatabase)("invitations", () => {
  let t: TestDatabase;
  let owner: { id: string };
  let invitee: { id: string };
  let stranger: { id: string };
  let ownerCookie: string;
  let inviteeCookie: string;
  let strangerCookie: string;
  let outbox: { to: string; subject: string; text: string }[];
  let members: typeof import("~/routes/lab-members");
  let invitation: typeof import("~/routes/invitation");

  beforeAll(async () => {
    t = await setUpAccountsDb();
    outbox = (await import("~/mail/mailer.server")).captureMail().outbox;
    owner = await makeUser(t.db, "olga@lab.test", "Olga Owner");
    invitee = await makeUser(t.db, "ivan@lab.test", "Ivan Invitee");
    stranger = await makeUser(t.db, "sid@lab.test", "Sid Stranger");
    await makeLab(t.db, "kinetics", "Kinetics", [[owner.id, "owner"]]);
    ownerCookie = await sessionCookieFor(owner.id);
    inviteeCookie = await sessionCookieFor(invitee.id);
    strangerCookie = await sessionCookieFor(stranger.id);
    members = await import("~/routes/lab-members");
    invitation = await import("~/routes/invitation");
  });
  afterAll(async () => tearDownAccountsDb(t));
  beforeEach(async () => {
    outbox.length = 0;
    await t.db.deleteFrom("invitations").execute();
    await t.db.deleteFrom("rate_limit_events").execute();
    await t.db.deleteFrom("memberships").where("user_id", "=", invitee.id).execute();
  });

  async function invite(email: string, role = "editor") {
    const out = await run(members.action, makeRequest("/labs/kinetics/members", { form: { intent: "invite", email, role }, cookie: ownerCookie }), { labSlug: "kinetics" });
    const token = /\/invitations\/([A-Za-z0-9_-]+)/.exec(outbox.at(-1)?.text ?? "")?.[1];
    return { out, token };
  }
  const accept = (token: string, cookie?: string) =>
    run(invitation.action, makeRequest(`/invitations/${token}`, { method: "POST", cookie }), { token });
  const roleOf = async (userId: string) =>
    (await t.db.selectFrom("memberships").select("role").where("user_id", "=", userId).executeTakeFirst())?.role;

  it("mails a single-use link whose token is stored only as a hash, valid for 7 days", async () => {
    const { out, token } = await invite("Ivan@Lab.test");
    expect(out.status).toBe(200);
    expect(outbox.at(-1)!.to).toBe("ivan@lab.test");
    expect(outbox.at(-1)!.text).toContain("http://127.0.0.1:3999/invitations/");
    const row = await t.db.selectFrom("invitations").selectAll().executeTakeFirstOrThrow();
    expect(row.token_hash).toBe(createHash("sha256").update(token!).digest("hex"));
    expect(JSON.stringify(row)).not.toContain(token!);
    const days = (row.expires_at.getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThanOrEqual(7);
  });

  it("requires signing in with the invited address, then adds the member once", async () => {
    const { token } = await invite("ivan@lab.test", "editor");
    const anonymous = await accept(token!);
    expect(anonymous.status).toBe(302);
    expect(anonymous.location).toMatch(/^\/sign-in\?returnTo=%2Finvitations%2F/);

    const before = await snapshot(t.db);
    const wrongPerson = await accept(token!, strangerCookie);
    expect(wrongPerson.status).toBe(403);
    expect(await snapshot(t.db)).toBe(before);

    const ok = await accept(token!, inviteeCookie);
    expect(ok.status).toBe(302);
    expect(ok.location).toBe("/labs/kinetics");
    expect(await roleOf(invitee.id)).toBe("editor");

    const again = await accept(token!, inviteeCookie);
    expect(again.status).toBe(410);
    expect((again.body as { error: string }).error).toMatch(/already been used/);
  });

  it("refuses an expired link", async () => {
    const { token } = await invite("ivan@lab.test");
    await t.db.updateTable("invitations").set({ expires_at: new Date(Date.now() - 1000) }).execute();
    const out = await accept(token!, inviteeCookie);
    expect(out.status).toBe(410);
    expect(await roleOf(invitee.id)).toBeUndefined();
    const page = await run(invitation.loader, makeRequest(`/invitations/${token}`, { cookie: inviteeCookie }), { token: token! });
    expect((page.body as { invitation: { status: string } }).invitation.status).toBe("expired");
  });

  it("revoking kills the link", async () => {
    const { token } = await invite("ivan@lab.test");
    const id = (await t.db.selectFrom("invitations").select("id").executeTakeFirstOrThrow()).id;
    const revoke = await run(members.action, makeRequest("/labs/kinetics/members", { form: { intent: "revoke", invitationId: id }, cookie: ownerCookie }), { labSlug: "kinetics" });
    expect(revoke.status).toBe(200);
    expect((await accept(token!, inviteeCookie)).status).toBe(410);
    expect(await roleOf(invitee.id)).toBeUndefined();
  });

  it("resending sends a new link, renews the expiry and kills the old link", async () => {
    const { token: oldToken } = await invite("ivan@lab.test", "viewer");
    await t.db.updateTable("invitations").set({ expires_at: new Date(Date.now() - 1000) }).execute();
    const id = (await t.db.selectFrom("invitations").select("id").executeTakeFirstOrThrow()).id;
    const resend = await run(members.action, makeRequest("/labs/kinetics/members", { form: { intent: "resend", invitationId: id }, cookie: ownerCookie }), { labSlug: "kinetics" });
    expect(resend.status).toBe(200);
    const newToken = /\/invitations\/([A-Za-z0-9_-]+)/.exec(outbox.at(-1)!.text)![1]!;
    expect(newToken).not.toBe(oldToken);
    expect((await accept(oldToken!, inviteeCookie)).status).toBe(404);
    expect((await accept(newToken, inviteeCookie)).status).toBe(302);
    expect(await roleOf(invitee.id)).toBe("viewer");
  });

  it("limits invitation re-sends, even when they arrive in parallel", async () => {
    await invite("ivan@lab.test", "viewer");
    const id = (await t.db.selectFrom("invitations").select("id").executeTakeFirstOrThrow()).id;
    outbox.length = 0;
    const resend = () => run(members.action, makeRequest("/labs/kinetics/members", { form: { intent: "resend", invitationId: id }, cookie: ownerCookie }), { labSlug: "kinetics" });
    const results = await Promise.all(Array.from({ length: 12 }, resend));
    const { perInvitation } = (await import("~/labs/lab-actions.server")).INVITATION_MAIL_POLICY;
    expect(results.filter((r) => r.status === 200)).toHaveLength(perInvitation);
    expect(results.filter((r) => r.status === 429)).toHaveLength(12 - perInvitation);
    expect((results.find((r) => r.status === 429)!.body as { error: string }).error).toMatch(/Too many invitation e-mails/);
    expect(outbox).toHaveLength(perInvitation);
  });

  it("does not invite someone who is already a member", async () => {
    const { out } = await invite("olga@lab.test");
    expect(out.status).toBe(409);
    expect(outbox).toHaveLength(0);
  });

  it("answers 404 for an unknown link, and lists pending invitations to owners", async () => {
    const page = await run(invitation.loader, makeRequest("/invitations/abcdefghijklmnopqrstuvwxyz012345"), { token: "abcdefghijklmnopqrstuvwxyz012345" });
    expect(page.status).toBe(404);
    await invite("ivan@lab.test");
    const list = await run(members.loader, makeRequest("/labs/kinetics/members", { cookie: ownerCookie }), { labSlug: "kinetics" });
    expect((list.body as { invitations: { email: string; status: string }[] }).invitations).toEqual([
      expect.objectContaining({ email: "ivan@lab.test", status: "pending" }),
    ]);
  });
});
