import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb, type Outcome } from "../auth/fixtures";
import { makeNetwork } from "../jobs/fixtures";
import { stopBosses } from "~/jobs/queue.server";

/**
 * The public lab of worked examples, called as each kind of visitor:
 *   anonymous · stranger (signed in, in no lab) · outsider (owner of another lab) · member (viewer of the public lab)
 * Strangers and outsiders read it as guests: every read answers 200, every write is refused and
 * changes nothing, and the member list stays hidden (404, as for a lab one is not in).
 */

const CSV = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,1,2\n";
const VISITORS = ["anonymous", "stranger", "outsider", "member"] as const;
type Visitor = (typeof VISITORS)[number];

interface Case {
  name: string;
  route: () => Promise<{ loader?: (a: any) => unknown; action?: (a: any) => unknown }>;
  kind: "loader" | "action";
  path: () => string;
  params: () => Record<string, string>;
  form?: () => Record<string, string>;
  json?: () => unknown;
  api?: boolean;
  /** Status for a signed-in guest (stranger, outsider); the viewer member gets `member` or the same. */
  guest: number;
  member?: number;
}

describe.skipIf(!hasTestDatabase)("public example lab", () => {
  let t: TestDatabase;
  const ids = {} as Record<Exclude<Visitor, "anonymous"> | "lonely" | "reader", string>;
  const cookies = {} as Record<Visitor | "lonely" | "reader", string | undefined>;
  const tokens = {} as Record<Visitor, string | undefined>;
  const x = { labId: "", networkId: "", privateNetworkId: "" };

  beforeAll(async () => {
    t = await setUpAccountsDb();
    for (const p of ["stranger", "outsider", "member", "lonely", "reader"] as const) ids[p] = (await makeUser(t.db, `${p}@lab.test`, p)).id;
    const lab = await makeLab(t.db, "examples", "Examples", [[ids.member, "viewer"]]);
    await t.db.updateTable("labs").set({ is_public: true }).where("id", "=", lab.id).execute();
    x.labId = lab.id;
    x.networkId = (await makeNetwork(t.db, lab.id, ids.member, "Two-state exchange", CSV)).networkId;
    await makeNetwork(t.db, lab.id, ids.member, "Second example", CSV.replace("A <-> B", "X <-> Y"));
    const beta = await makeLab(t.db, "beta", "Beta", [[ids.outsider, "owner"], [ids.reader, "viewer"]]);
    x.privateNetworkId = (await makeNetwork(t.db, beta.id, ids.outsider, "Private", CSV)).networkId;
    const { createApiToken } = await import("~/account/api-tokens.server");
    const { db } = await import("~/db.server");
    for (const p of ["stranger", "outsider", "member", "lonely", "reader"] as const) cookies[p] = await sessionCookieFor(ids[p]);
    for (const p of ["stranger", "outsider", "member"] as const) tokens[p] = (await createApiToken(db(), { userId: ids[p], name: "t", expiresAt: null })).token;
  }, 60_000);
  afterAll(async () => {
    await stopBosses();
    await tearDownAccountsDb(t);
  });

  const lab = () => ({ labSlug: "examples" });
  const net = () => ({ labSlug: "examples", networkId: x.networkId });
  const netPath = () => `/labs/examples/networks/${x.networkId}`;
  const CASES: Case[] = [
    // Reads
    { name: "GET lab page", route: () => import("~/routes/lab"), kind: "loader", path: () => "/labs/examples", params: lab, guest: 200 },
    { name: "GET networks list", route: () => import("~/routes/networks"), kind: "loader", path: () => "/labs/examples/networks", params: lab, guest: 200 },
    { name: "GET network page", route: () => import("~/routes/networks-show"), kind: "loader", path: netPath, params: net, guest: 200 },
    { name: "GET versions page", route: () => import("~/routes/networks-versions"), kind: "loader", path: () => `${netPath()}/versions`, params: net, guest: 200 },
    { name: "GET download network.csv", route: () => import("~/routes/networks-download"), kind: "loader", path: () => `${netPath()}/download/network.csv`, params: () => ({ ...net(), file: "network.csv" }), guest: 200 },
    { name: "GET analyses list", route: () => import("~/routes/analyses"), kind: "loader", path: () => "/labs/examples/analyses", params: lab, guest: 200 },
    { name: "GET /api lab", route: () => import("~/routes/api/lab"), kind: "loader", path: () => "/api/labs/examples", params: lab, api: true, guest: 200 },
    { name: "GET /api networks", route: () => import("~/routes/api/networks"), kind: "loader", path: () => "/api/labs/examples/networks", params: lab, api: true, guest: 200 },
    { name: "GET /api network", route: () => import("~/routes/api/networks-item"), kind: "loader", path: () => `/api/labs/examples/networks/${x.networkId}`, params: net, api: true, guest: 200 },
    // Members only: who is in the lab
    { name: "GET members page", route: () => import("~/routes/lab-members"), kind: "loader", path: () => "/labs/examples/members", params: lab, guest: 404, member: 200 },
    { name: "GET /api members", route: () => import("~/routes/api/lab-members"), kind: "loader", path: () => "/api/labs/examples/members", params: lab, api: true, guest: 404, member: 200 },
    { name: "GET audit log", route: () => import("~/routes/lab-audit"), kind: "loader", path: () => "/labs/examples/audit", params: lab, guest: 403 },
    // Writes
    { name: "GET new-network form", route: () => import("~/routes/networks-new"), kind: "loader", path: () => "/labs/examples/networks/new", params: lab, guest: 403 },
    { name: "GET edit form", route: () => import("~/routes/networks-edit"), kind: "loader", path: () => `${netPath()}/edit`, params: net, guest: 403 },
    { name: "GET new-analysis form", route: () => import("~/routes/analyses-new"), kind: "loader", path: () => `${netPath()}/analyse`, params: net, guest: 403 },
    { name: "POST network details", route: () => import("~/routes/networks-show"), kind: "action", path: netPath, params: net, form: () => ({ intent: "details", name: "Mine now", description: "", tags: "" }), guest: 403 },
    { name: "POST network archive", route: () => import("~/routes/networks-show"), kind: "action", path: netPath, params: net, form: () => ({ intent: "archive" }), guest: 403 },
    { name: "POST network delete", route: () => import("~/routes/networks-show"), kind: "action", path: netPath, params: net, form: () => ({ intent: "delete", confirmName: "Two-state exchange" }), guest: 403 },
    { name: "POST lab rename", route: () => import("~/routes/lab"), kind: "action", path: () => "/labs/examples", params: lab, form: () => ({ intent: "rename", name: "Ours" }), guest: 404, member: 403 },
    { name: "POST lab leave", route: () => import("~/routes/lab"), kind: "action", path: () => "/labs/examples", params: lab, form: () => ({ intent: "leave" }), guest: 404, member: 302 },
    { name: "POST switch to the lab", route: () => import("~/routes/labs"), kind: "action", path: () => "/labs", params: () => ({}), form: () => ({ intent: "switch", slug: "examples" }), guest: 404, member: 302 },
    { name: "POST /api networks (create)", route: () => import("~/routes/api/networks"), kind: "action", path: () => "/api/labs/examples/networks", params: lab, api: true, json: () => ({ name: "Mine", csv: CSV }), guest: 403 },
    { name: "POST /api analyses (start)", route: () => import("~/routes/api/analyses"), kind: "action", path: () => "/api/labs/examples/analyses", params: lab, api: true, json: () => ({ networkId: x.networkId, initial: { A: "1", B: "1" } }), guest: 403 },
  ];

  async function snapshot() {
    const tables = ["labs", "memberships", "networks", "network_versions", "analyses", "audit_events"] as const;
    const rows = await Promise.all(tables.map((name) => t.db.selectFrom(name).selectAll().execute()));
    return JSON.stringify(rows.map((r) => [...r].map((row) => JSON.stringify(row)).sort()));
  }

  async function call(c: Case, v: Visitor): Promise<Outcome> {
    const mod = await c.route();
    const request = makeRequest(c.path(), {
      method: c.kind === "action" ? "POST" : "GET",
      form: c.form?.(),
      json: c.json?.(),
      cookie: c.api ? undefined : cookies[v],
      bearer: c.api ? tokens[v] : undefined,
    });
    return run(mod[c.kind]!, request, c.params());
  }

  for (const c of CASES) {
    for (const v of VISITORS) {
      const expected = v === "anonymous" ? (c.api ? 401 : 302) : v === "member" ? (c.member ?? c.guest) : c.guest;
      it(`${c.name} as ${v} → ${expected}`, async () => {
        const before = await snapshot();
        const out = await call(c, v);
        expect(out.status).toBe(expected);
        if (expected >= 300 && !(v === "member" && c.name === "POST lab leave") && !(v === "member" && c.name.startsWith("POST switch"))) {
          expect(await snapshot()).toBe(before);
          if (c.api) expect(out.body).toMatchObject({ error: { code: expect.any(String) } });
        }
        if (v === "member" && c.name === "POST lab leave") {
          await t.db.insertInto("memberships").values({ lab_id: x.labId, user_id: ids.member, role: "viewer" }).execute();
        }
      });
    }
  }

  it("a guest's network page offers no editing and says it is an example", async () => {
    const page = await import("~/routes/networks-show");
    const out = await run(page.loader, makeRequest(netPath(), { cookie: cookies.stranger }), net());
    expect(out.body).toMatchObject({ canEdit: false, canDelete: false, guest: true, lab: { slug: "examples" } });
  });

  it("the API tells a guest it reads as a guest of a public lab", async () => {
    const api = await import("~/routes/api/lab");
    const out = await run(api.loader, makeRequest("/api/labs/examples", { bearer: tokens.stranger }), lab());
    expect(out.body).toEqual({ lab: { slug: "examples", name: "Examples", public: true }, role: "viewer", guest: true });
  });

  it("/api/me lists the public labs a stranger may read", async () => {
    const me = await import("~/routes/api/me");
    const out = await run(me.loader, makeRequest("/api/me", { bearer: tokens.stranger }), {});
    expect(out.body).toMatchObject({ labs: [], publicLabs: [{ slug: "examples", name: "Examples", networks: 2 }] });
  });

  it("a private lab still answers 404 to a stranger", async () => {
    const page = await import("~/routes/networks-show");
    const out = await run(page.loader, makeRequest(`/labs/beta/networks/${x.privateNetworkId}`, { cookie: cookies.stranger }), { labSlug: "beta", networkId: x.privateNetworkId });
    expect(out.status).toBe(404);
  });

  describe("copy these examples into my lab", () => {
    const copy = async (who: "lonely" | "reader" | "outsider" | "stranger", form: Record<string, string>) => {
      const labs = await import("~/routes/labs");
      return run(labs.action, makeRequest("/labs", { form: { intent: "copy-examples", ...form }, cookie: cookies[who] }), {});
    };
    const networksOf = async (labId: string) =>
      (await t.db.selectFrom("networks").select("name").where("lab_id", "=", labId).orderBy("name").execute()).map((r) => r.name);

    it("makes a lab of their own for someone in no lab, copies every example and opens its list", async () => {
      const before = await networksOf(x.labId);
      const out = await copy("lonely", { from: "examples" });
      expect(out.status).toBe(302);
      const mine = await t.db
        .selectFrom("labs")
        .innerJoin("memberships", "memberships.lab_id", "labs.id")
        .select(["labs.id", "labs.slug", "labs.name", "memberships.role"])
        .where("memberships.user_id", "=", ids.lonely)
        .executeTakeFirstOrThrow();
      expect(mine).toMatchObject({ name: "lonely’s lab", role: "owner" });
      expect(out.location).toBe(`/labs/${mine.slug}/networks`);
      expect(await networksOf(mine.id)).toEqual(["Second example", "Two-state exchange"]);
      const copied = await t.db
        .selectFrom("network_versions")
        .innerJoin("networks", "networks.id", "network_versions.network_id")
        .select(["network_versions.number", "network_versions.csv", "network_versions.change_note", "network_versions.author_id"])
        .where("networks.lab_id", "=", mine.id)
        .where("networks.name", "=", "Two-state exchange")
        .execute();
      expect(copied).toEqual([{ number: 1, csv: CSV, change_note: "Copied from Examples (their version 1).", author_id: ids.lonely }]);
      expect(await networksOf(x.labId)).toEqual(before);
      const audit = await t.db.selectFrom("audit_events").select(["kind", "details"]).where("lab_id", "=", mine.id).where("kind", "=", "examples.copied").execute();
      expect(audit).toEqual([{ kind: "examples.copied", details: { from: "Examples", networks: ["Second example", "Two-state exchange"] } }]);

      // Again: nothing is copied twice, nothing of theirs is overwritten.
      await t.db.updateTable("networks").set({ description: "my notes" }).where("lab_id", "=", mine.id).where("name", "=", "Two-state exchange").execute();
      expect((await copy("lonely", { from: "examples" })).status).toBe(302);
      expect(await networksOf(mine.id)).toEqual(["Second example", "Two-state exchange"]);
      expect((await t.db.selectFrom("networks").select("description").where("lab_id", "=", mine.id).where("name", "=", "Two-state exchange").executeTakeFirstOrThrow()).description).toBe("my notes");
    });

    it("copies into the owner's own lab when named", async () => {
      const out = await copy("outsider", { from: "examples", to: "beta" });
      expect([out.status, out.location]).toEqual([302, "/labs/beta/networks"]);
      const beta = await t.db.selectFrom("labs").select("id").where("slug", "=", "beta").executeTakeFirstOrThrow();
      expect(await networksOf(beta.id)).toEqual(["Private", "Second example", "Two-state exchange"]);
    });

    it("refuses a viewer of every lab they are in, a copy into the examples themselves, and a private source", async () => {
      const before = await snapshot();
      expect((await copy("reader", { from: "examples" })).status).toBe(403);
      expect((await copy("reader", { from: "examples", to: "beta" })).status).toBe(403);
      expect((await copy("stranger", { from: "examples", to: "examples" })).status).toBe(403);
      expect((await copy("outsider", { from: "beta", to: "beta" })).status).toBe(400);
      expect((await copy("stranger", { from: "beta" })).status).toBe(404);
      expect(await snapshot()).toBe(before);
    });
  });
});
