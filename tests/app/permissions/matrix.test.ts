import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { labMember, PERSONAS, type Expect, type Persona } from "../support/personas";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, snapshot, tearDownAccountsDb, type Outcome } from "../auth/fixtures";

/**
 * The whole permission matrix: every protected loader, action and API route of the accounts
 * feature, called as each kind of visitor. Refused requests must change nothing in the database.
 *
 *   anonymous · viewer · editor · owner of lab "alpha" · outsider (owner of another lab) · site admin (no lab)
 */

const signInOr = (ok: number, refused: Partial<Expect> = {}): Expect => ({
  anonymous: 302,
  viewer: ok,
  editor: ok,
  owner: ok,
  outsider: ok,
  admin: ok,
  ...refused,
});

interface Case {
  name: string;
  route: () => Promise<{ loader?: (a: any) => unknown; action?: (a: any) => unknown }>;
  kind: "loader" | "action";
  path: string;
  params?: Record<string, string>;
  form?: Record<string, string> | (() => Record<string, string>);
  json?: unknown;
  api?: boolean;
  expect: Expect;
  /** Undo what an allowed request did, so later cases start from the same state. */
  cleanUp?: () => Promise<void>;
}

describe.skipIf(!hasTestDatabase)("permission matrix", () => {
  let t: TestDatabase;
  const ids = {} as Record<Persona | "tara", string>;
  const cookies = {} as Record<Persona, string | undefined>;
  const tokens = {} as Record<Persona, string | undefined>;
  let labId: string;
  let invitationId: string;

  beforeAll(async () => {
    t = await setUpAccountsDb();
    (await import("~/mail/mailer.server")).captureMail();
    for (const p of ["viewer", "editor", "owner", "outsider", "admin", "tara"] as const) {
      ids[p] = (await makeUser(t.db, `${p}@lab.test`, p, { admin: p === "admin" })).id;
    }
    labId = (await makeLab(t.db, "alpha", "Alpha", [[ids.owner, "owner"], [ids.editor, "editor"], [ids.viewer, "viewer"], [ids.tara, "viewer"]])).id;
    await makeLab(t.db, "beta", "Beta", [[ids.outsider, "owner"]]);
    invitationId = (
      await t.db
        .insertInto("invitations")
        .values({ lab_id: labId, email: "pending@lab.test", role: "viewer", token_hash: "a".repeat(64), expires_at: new Date(Date.now() + 86_400_000) })
        .returning("id")
        .executeTakeFirstOrThrow()
    ).id;
    const { createApiToken } = await import("~/account/api-tokens.server");
    const { db } = await import("~/db.server");
    for (const p of PERSONAS) {
      if (p === "anonymous") continue;
      cookies[p] = await sessionCookieFor(ids[p]);
      tokens[p] = (await createApiToken(db(), { userId: ids[p], name: "matrix", expiresAt: null })).token;
    }
  });
  afterAll(async () => tearDownAccountsDb(t));

  const alpha = { labSlug: "alpha" };
  const setRole = (userId: string, role: "viewer" | "editor" | "owner") =>
    t.db.updateTable("memberships").set({ role }).where("lab_id", "=", labId).where("user_id", "=", userId).execute();
  const rejoin = (userId: string, role: "viewer" | "editor") =>
    t.db.insertInto("memberships").values({ lab_id: labId, user_id: userId, role }).onConflict((oc) => oc.doNothing()).execute();

  const CASES: Case[] = [
    // Page loaders
    { name: "GET /labs", route: () => import("~/routes/labs"), kind: "loader", path: "/labs", expect: signInOr(200) },
    { name: "GET /labs/alpha", route: () => import("~/routes/lab"), kind: "loader", path: "/labs/alpha", params: alpha, expect: labMember(200, "viewer") },
    { name: "GET /labs/alpha/members", route: () => import("~/routes/lab-members"), kind: "loader", path: "/labs/alpha/members", params: alpha, expect: labMember(200, "viewer") },
    { name: "GET /labs/alpha/audit", route: () => import("~/routes/lab-audit"), kind: "loader", path: "/labs/alpha/audit", params: alpha, expect: labMember(200, "owner") },
    { name: "GET /account", route: () => import("~/routes/account"), kind: "loader", path: "/account", expect: signInOr(200) },
    { name: "GET /admin", route: () => import("~/routes/admin"), kind: "loader", path: "/admin", expect: signInOr(403, { admin: 200 }) },
    // Page actions
    {
      name: "POST /labs/alpha rename", route: () => import("~/routes/lab"), kind: "action", path: "/labs/alpha", params: alpha,
      form: { intent: "rename", name: "Alpha (renamed)" }, expect: labMember(200, "owner"),
      cleanUp: async () => void (await t.db.updateTable("labs").set({ name: "Alpha" }).where("id", "=", labId).execute()),
    },
    {
      name: "POST /labs/alpha leave", route: () => import("~/routes/lab"), kind: "action", path: "/labs/alpha", params: alpha,
      form: { intent: "leave" }, expect: { ...labMember(302, "viewer"), owner: 409 },
      cleanUp: async () => {
        await rejoin(ids.viewer, "viewer");
        await rejoin(ids.editor, "editor");
      },
    },
    {
      name: "POST /labs/alpha/members invite", route: () => import("~/routes/lab-members"), kind: "action", path: "/labs/alpha/members", params: alpha,
      form: { intent: "invite", email: "newbie@lab.test", role: "owner" }, expect: labMember(200, "owner"),
    },
    {
      name: "POST /labs/alpha/members change-role", route: () => import("~/routes/lab-members"), kind: "action", path: "/labs/alpha/members", params: alpha,
      form: () => ({ intent: "change-role", userId: ids.tara, role: "owner" }), expect: labMember(200, "owner"),
      cleanUp: async () => void (await setRole(ids.tara, "viewer")),
    },
    {
      name: "POST /labs/alpha/members remove", route: () => import("~/routes/lab-members"), kind: "action", path: "/labs/alpha/members", params: alpha,
      form: () => ({ intent: "remove", userId: ids.tara }), expect: labMember(200, "owner"),
      cleanUp: async () => void (await rejoin(ids.tara, "viewer")),
    },
    {
      name: "POST /labs/alpha/members resend", route: () => import("~/routes/lab-members"), kind: "action", path: "/labs/alpha/members", params: alpha,
      form: () => ({ intent: "resend", invitationId }), expect: labMember(200, "owner"),
    },
    {
      name: "POST /labs/alpha/members revoke", route: () => import("~/routes/lab-members"), kind: "action", path: "/labs/alpha/members", params: alpha,
      form: () => ({ intent: "revoke", invitationId }), expect: labMember(200, "owner"),
      cleanUp: async () => void (await t.db.updateTable("invitations").set({ revoked_at: null }).where("id", "=", invitationId).execute()),
    },
    { name: "POST /labs create", route: () => import("~/routes/labs"), kind: "action", path: "/labs", form: { intent: "create", name: "Gamma" }, expect: signInOr(302) },
    {
      name: "POST /labs switch to alpha", route: () => import("~/routes/labs"), kind: "action", path: "/labs",
      form: { intent: "switch", slug: "alpha" }, expect: labMember(302, "viewer"),
    },
    { name: "POST /account create-token", route: () => import("~/routes/account"), kind: "action", path: "/account", form: { intent: "create-token", name: "t" }, expect: signInOr(200) },
    // JSON API (bearer tokens)
    { name: "GET /api/me", route: () => import("~/routes/api/me"), kind: "loader", path: "/api/me", api: true, expect: signInOr(200, { anonymous: 401 }) },
    { name: "GET /api/labs", route: () => import("~/routes/api/labs"), kind: "loader", path: "/api/labs", api: true, expect: signInOr(200, { anonymous: 401 }) },
    { name: "POST /api/labs", route: () => import("~/routes/api/labs"), kind: "action", path: "/api/labs", api: true, json: { name: "Delta" }, expect: signInOr(201, { anonymous: 401 }) },
    { name: "GET /api/labs/alpha", route: () => import("~/routes/api/lab"), kind: "loader", path: "/api/labs/alpha", params: alpha, api: true, expect: labMember(200, "viewer", 401) },
    { name: "GET /api/labs/alpha/members", route: () => import("~/routes/api/lab-members"), kind: "loader", path: "/api/labs/alpha/members", params: alpha, api: true, expect: labMember(200, "viewer", 401) },
    { name: "GET /api/labs/alpha/audit", route: () => import("~/routes/api/lab-audit"), kind: "loader", path: "/api/labs/alpha/audit", params: alpha, api: true, expect: labMember(200, "owner", 401) },
    // Read-only API resources answer other methods with 405 in the JSON error shape, after the same check.
    { name: "POST /api/me", route: () => import("~/routes/api/me"), kind: "action", path: "/api/me", api: true, json: {}, expect: signInOr(405, { anonymous: 401 }) },
    { name: "POST /api/labs/alpha", route: () => import("~/routes/api/lab"), kind: "action", path: "/api/labs/alpha", params: alpha, api: true, json: { name: "x" }, expect: labMember(405, "viewer", 401) },
    { name: "POST /api/labs/alpha/members", route: () => import("~/routes/api/lab-members"), kind: "action", path: "/api/labs/alpha/members", params: alpha, api: true, json: {}, expect: labMember(405, "viewer", 401) },
    { name: "POST /api/labs/alpha/audit", route: () => import("~/routes/api/lab-audit"), kind: "action", path: "/api/labs/alpha/audit", params: alpha, api: true, json: {}, expect: labMember(405, "owner", 401) },
  ];

  const isRefusal = (o: Outcome) => [401, 403, 404, 405, 409].includes(o.status) || (o.status === 302 && (o.location ?? "").startsWith("/sign-in"));

  async function call(c: Case, p: Persona, via: "cookie" | "bearer") {
    const mod = await c.route();
    const handler = mod[c.kind];
    if (!handler) throw new Error(`${c.name}: no ${c.kind}`);
    const form = typeof c.form === "function" ? c.form() : c.form;
    const request = makeRequest(c.path, {
      method: c.kind === "action" ? "POST" : "GET",
      form,
      json: c.json,
      cookie: via === "cookie" ? cookies[p] : undefined,
      bearer: via === "bearer" ? tokens[p] : undefined,
    });
    return run(handler, request, c.params ?? {});
  }

  for (const c of CASES) {
    for (const p of PERSONAS) {
      it(`${c.name} as ${p} → ${c.expect[p]}`, async () => {
        const before = await snapshot(t.db);
        const out = await call(c, p, c.api ? "bearer" : "cookie");
        expect(out.status).toBe(c.expect[p]);
        if (isRefusal(out)) {
          expect(await snapshot(t.db)).toBe(before);
          if (c.api) expect(out.body).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
          if (out.status === 302) expect(out.location).toMatch(/^\/sign-in\?returnTo=/);
        } else {
          await c.cleanUp?.();
        }
      });
    }
  }

  it("the API accepts the session cookie too, with the same roles", async () => {
    const lab = await import("~/routes/api/lab-audit");
    const asOwner = await run(lab.loader, makeRequest("/api/labs/alpha/audit", { cookie: cookies.owner }), alpha);
    const asEditor = await run(lab.loader, makeRequest("/api/labs/alpha/audit", { cookie: cookies.editor }), alpha);
    expect([asOwner.status, asEditor.status]).toEqual([200, 403]);
  });

  it("a lab you are not in answers exactly like a lab that does not exist", async () => {
    const api = await import("~/routes/api/lab");
    const page = await import("~/routes/lab");
    const hidden = await run(api.loader, makeRequest("/api/labs/alpha", { bearer: tokens.outsider }), alpha);
    const missing = await run(api.loader, makeRequest("/api/labs/nope", { bearer: tokens.outsider }), { labSlug: "nope" });
    expect(hidden.status).toBe(404);
    expect(hidden.body).toEqual(missing.body);
    const hiddenPage = await run(page.loader, makeRequest("/labs/alpha", { cookie: cookies.outsider }), alpha);
    const missingPage = await run(page.loader, makeRequest("/labs/nope", { cookie: cookies.outsider }), { labSlug: "nope" });
    expect([hiddenPage.status, hiddenPage.body]).toEqual([missingPage.status, missingPage.body]);
  });

  it("only owners see pending invitations on the members page", async () => {
    const members = await import("~/routes/lab-members");
    const seen = async (p: Persona) =>
      ((await run(members.loader, makeRequest("/labs/alpha/members", { cookie: cookies[p] }), alpha)).body as { invitations: { email: string }[] }).invitations;
    expect((await seen("owner")).map((i) => i.email)).toContain("pending@lab.test");
    expect(await seen("editor")).toEqual([]);
    expect(await seen("viewer")).toEqual([]);
  });
});
