import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { labMember, PERSONAS, type Expect, type Persona } from "../support/personas";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, snapshot, tearDownAccountsDb, type Outcome } from "../auth/fixtures";
import { analysisParams, makeJob, makeNetwork } from "../jobs/fixtures";
import { computeJob } from "~/jobs/compute";
import { stopBosses } from "~/jobs/queue.server";

/**
 * The permission matrix of every analyses page, action and API route, called as each kind of
 * visitor. Refused requests must change nothing (analyses, share links, lab limits, audit trail).
 *   anonymous · viewer · editor · owner of lab "alpha" · outsider (owner of lab "beta") · site admin (no lab)
 */

const CYCLE = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nS0 + K <-> S0K,a1,d1,1,1/2\nS0K -> S1 + K,c1,,2,\nS1 + F <-> S1F,a2,d2,1,1\nS1F -> S0 + F,c2,,3/2,\n";
const INITIAL = { S0: "1", K: "1/10", F: "1/10" };

interface Case {
  name: string;
  route: () => Promise<{ loader?: (a: any) => unknown; action?: (a: any) => unknown }>;
  kind: "loader" | "action";
  method?: string;
  path: () => string;
  params: () => Record<string, string>;
  form?: () => Record<string, string>;
  json?: () => unknown;
  api?: boolean;
  expect: Expect;
}

describe.skipIf(!hasTestDatabase)("analyses permission matrix", () => {
  let t: TestDatabase;
  const ids = {} as Record<Persona, string>;
  const cookies = {} as Record<Persona, string | undefined>;
  const tokens = {} as Record<Persona, string | undefined>;
  const x = { networkId: "", versionId: "", done: "", other: "", third: "", doomed: "", queued: "", scan: "", link: "" };

  beforeAll(async () => {
    t = await setUpAccountsDb();
    (await import("~/mail/mailer.server")).captureMail();
    for (const p of PERSONAS) if (p !== "anonymous") ids[p] = (await makeUser(t.db, `${p}@lab.test`, p, { admin: p === "admin" })).id;
    const lab = await makeLab(t.db, "alpha", "Alpha", [[ids.owner, "owner"], [ids.editor, "editor"], [ids.viewer, "viewer"]]);
    await makeLab(t.db, "beta", "Beta", [[ids.outsider, "owner"]]);
    Object.assign(x, await makeNetwork(t.db, lab.id, ids.owner, "cycle", CYCLE));
    const params = analysisParams({ initial: INITIAL });
    const result = computeJob({ kind: "analysis", csv: CYCLE, params }, { engineTimeoutMs: 30_000 });
    const adb = t.db;
    for (const key of ["done", "other", "third", "doomed"] as const) {
      const row = await makeJob(t.db, { kind: "analysis", labId: lab.id, networkVersionId: x.versionId, params, startedBy: ids.editor, timeLimitSeconds: 60 });
      await adb.updateTable("analyses").set({ status: "succeeded", result: result as never, finished_at: new Date() }).where("id", "=", row.id).execute();
      x[key] = row.id;
    }
    x.queued = (await makeJob(t.db, { kind: "analysis", labId: lab.id, networkVersionId: x.versionId, params, startedBy: ids.editor, timeLimitSeconds: 60 })).id;
    x.scan = (await makeJob(t.db, { kind: "scan", parentId: x.done, labId: lab.id, networkVersionId: x.versionId, params: { parameter: { kind: "rate", name: "c1" }, from: 1, to: 2, points: 2, spacing: "linear" }, startedBy: ids.editor, timeLimitSeconds: 60 })).id;
    x.link = (await (await import("~/analyses/share.server")).createShareLink(adb, x.done, ids.owner, 7)).id;
    const { createApiToken } = await import("~/account/api-tokens.server");
    const { db } = await import("~/db.server");
    for (const p of PERSONAS) {
      if (p === "anonymous") continue;
      cookies[p] = await sessionCookieFor(ids[p]);
      tokens[p] = (await createApiToken(db(), { userId: ids[p], name: "matrix", expiresAt: null })).token;
    }
  }, 60_000);
  afterAll(async () => {
    await stopBosses();
    await tearDownAccountsDb(t);
  });

  const alpha = () => ({ labSlug: "alpha" });
  const CASES: Case[] = [
    { name: "GET analyses list", route: () => import("~/routes/analyses"), kind: "loader", path: () => "/labs/alpha/analyses", params: alpha, expect: labMember(200, "viewer") },
    { name: "GET analysis page", route: () => import("~/routes/analysis"), kind: "loader", path: () => `/labs/alpha/analyses/${x.done}`, params: () => ({ labSlug: "alpha", analysisId: x.done }), expect: labMember(200, "viewer") },
    { name: "GET new-analysis form", route: () => import("~/routes/analyses-new"), kind: "loader", path: () => `/labs/alpha/networks/${x.networkId}/analyse`, params: () => ({ labSlug: "alpha", networkId: x.networkId }), expect: labMember(200, "editor") },
    { name: "GET export result.json", route: () => import("~/routes/analysis-export"), kind: "loader", path: () => `/labs/alpha/analyses/${x.done}/export/result.json`, params: () => ({ labSlug: "alpha", analysisId: x.done, file: "result.json" }), expect: labMember(200, "viewer") },
    { name: "GET compare", route: () => import("~/routes/analyses-compare"), kind: "loader", path: () => `/labs/alpha/analyses/compare?a=${x.done}&b=${x.other}`, params: alpha, expect: labMember(200, "viewer") },
    { name: "GET compare three", route: () => import("~/routes/analyses-compare"), kind: "loader", path: () => `/labs/alpha/analyses/compare?id=${x.done}&id=${x.other}&id=${x.third}`, params: alpha, expect: labMember(200, "viewer") },
    { name: "GET analyses list filtered", route: () => import("~/routes/analyses"), kind: "loader", path: () => `/labs/alpha/analyses?status=succeeded&sort=author&dir=asc&archived=1`, params: alpha, expect: labMember(200, "viewer") },
    {
      name: "POST start analysis (form)", route: () => import("~/routes/analyses-new"), kind: "action", path: () => `/labs/alpha/networks/${x.networkId}/analyse`,
      params: () => ({ labSlug: "alpha", networkId: x.networkId }), form: () => ({ "initial.S0": "1", "initial.K": "1/10", "initial.F": "1/10", rateMode: "numeric" }), expect: labMember(302, "editor"),
    },
    ...(["relation", "scan", "timecourse"] as const).map((intent): Case => ({
      name: `POST ${intent}`, route: () => import("~/routes/analysis"), kind: "action", path: () => `/labs/alpha/analyses/${x.done}`,
      params: () => ({ labSlug: "alpha", analysisId: x.done }),
      form: () => ({ intent, expression: "S0 - K", parameterChoice: "rate:c1", from: "1", to: "2", points: "3", spacing: "linear", endTime: "5" }), expect: labMember(200, "editor"),
    })),
    { name: "POST cancel", route: () => import("~/routes/analysis"), kind: "action", path: () => `/labs/alpha/analyses/${x.done}`, params: () => ({ labSlug: "alpha", analysisId: x.done }), form: () => ({ intent: "cancel", jobId: x.scan }), expect: labMember(200, "editor") },
    { name: "POST share-create", route: () => import("~/routes/analysis"), kind: "action", path: () => `/labs/alpha/analyses/${x.done}`, params: () => ({ labSlug: "alpha", analysisId: x.done }), form: () => ({ intent: "share-create", days: "3" }), expect: labMember(200, "owner") },
    { name: "POST share-revoke", route: () => import("~/routes/analysis"), kind: "action", path: () => `/labs/alpha/analyses/${x.done}`, params: () => ({ labSlug: "alpha", analysisId: x.done }), form: () => ({ intent: "share-revoke", linkId: x.link }), expect: labMember(200, "owner") },
    { name: "POST details (rename, note)", route: () => import("~/routes/analysis"), kind: "action", path: () => `/labs/alpha/analyses/${x.other}`, params: () => ({ labSlug: "alpha", analysisId: x.other }), form: () => ({ intent: "details", name: "Baseline", note: "first try" }), expect: labMember(200, "editor") },
    { name: "POST archive", route: () => import("~/routes/analysis"), kind: "action", path: () => `/labs/alpha/analyses/${x.other}`, params: () => ({ labSlug: "alpha", analysisId: x.other }), form: () => ({ intent: "archive" }), expect: labMember(200, "editor") },
    { name: "POST unarchive", route: () => import("~/routes/analysis"), kind: "action", path: () => `/labs/alpha/analyses/${x.other}`, params: () => ({ labSlug: "alpha", analysisId: x.other }), form: () => ({ intent: "unarchive" }), expect: labMember(200, "editor") },
    { name: "POST delete", route: () => import("~/routes/analysis"), kind: "action", path: () => `/labs/alpha/analyses/${x.doomed}`, params: () => ({ labSlug: "alpha", analysisId: x.doomed }), form: () => ({ intent: "delete" }), expect: labMember(302, "owner") },
    { name: "POST lab limits", route: () => import("~/routes/analyses"), kind: "action", path: () => "/labs/alpha/analyses", params: alpha, form: () => ({ maxTimeLimitSeconds: "600", maxBasisSize: "3000" }), expect: labMember(200, "owner") },
    // JSON API (bearer tokens)
    { name: "GET /api analyses", route: () => import("~/routes/api/analyses"), kind: "loader", api: true, path: () => "/api/labs/alpha/analyses", params: alpha, expect: labMember(200, "viewer", 401) },
    { name: "POST /api analyses", route: () => import("~/routes/api/analyses"), kind: "action", api: true, path: () => "/api/labs/alpha/analyses", params: alpha, json: () => ({ networkId: x.networkId, initial: INITIAL }), expect: labMember(202, "editor", 401) },
    { name: "GET /api analysis", route: () => import("~/routes/api/analyses-item"), kind: "loader", api: true, path: () => `/api/labs/alpha/analyses/${x.done}`, params: () => ({ labSlug: "alpha", analysisId: x.done }), expect: labMember(200, "viewer", 401) },
    { name: "DELETE /api analysis", route: () => import("~/routes/api/analyses-item"), kind: "action", method: "DELETE", api: true, path: () => `/api/labs/alpha/analyses/${x.queued}`, params: () => ({ labSlug: "alpha", analysisId: x.queued }), expect: labMember(202, "editor", 401) },
    { name: "POST /api analysis cancel", route: () => import("~/routes/api/analyses-cancel"), kind: "action", api: true, path: () => `/api/labs/alpha/analyses/${x.queued}/cancel`, params: () => ({ labSlug: "alpha", analysisId: x.queued }), expect: labMember(202, "editor", 401) },
    { name: "GET /api scans", route: () => import("~/routes/api/scans"), kind: "loader", api: true, path: () => `/api/labs/alpha/analyses/${x.done}/scans`, params: () => ({ labSlug: "alpha", analysisId: x.done }), expect: labMember(200, "viewer", 401) },
    { name: "POST /api scans", route: () => import("~/routes/api/scans"), kind: "action", api: true, path: () => `/api/labs/alpha/analyses/${x.done}/scans`, params: () => ({ labSlug: "alpha", analysisId: x.done }), json: () => ({ parameterKind: "rate", parameter: "c1", from: 1, to: 3, points: 3 }), expect: labMember(202, "editor", 401) },
    { name: "GET /api scan", route: () => import("~/routes/api/scans-item"), kind: "loader", api: true, path: () => `/api/labs/alpha/scans/${x.scan}`, params: () => ({ labSlug: "alpha", scanId: x.scan }), expect: labMember(200, "viewer", 401) },
    { name: "POST /api scan cancel", route: () => import("~/routes/api/scans-cancel"), kind: "action", api: true, path: () => `/api/labs/alpha/scans/${x.scan}/cancel`, params: () => ({ labSlug: "alpha", scanId: x.scan }), expect: labMember(202, "editor", 401) },
  ];

  const mine = async () => {
    const adb = t.db;
    const [analyses, links, limits] = await Promise.all([
      adb.selectFrom("analyses").selectAll().orderBy("id").execute(),
      adb.selectFrom("analysis_share_links").selectAll().orderBy("id").execute(),
      adb.selectFrom("lab_analysis_settings").selectAll().execute(),
    ]);
    return (await snapshot(t.db)) + JSON.stringify({ analyses, links, limits });
  };
  const isRefusal = (o: Outcome) => [401, 403, 404, 405].includes(o.status) || (o.status === 302 && (o.location ?? "").startsWith("/sign-in"));

  for (const c of CASES) {
    for (const p of PERSONAS) {
      it(`${c.name} as ${p} → ${c.expect[p]}`, async () => {
        const mod = await c.route();
        const request = makeRequest(c.path(), {
          method: c.method ?? (c.kind === "action" ? "POST" : "GET"),
          form: c.form?.(),
          json: c.json?.(),
          cookie: c.api ? undefined : cookies[p],
          bearer: c.api ? tokens[p] : undefined,
        });
        const before = await mine();
        const out = await run(mod[c.kind]!, request, c.params());
        expect(out.status).toBe(c.expect[p]);
        if (isRefusal(out)) {
          expect(await mine()).toBe(before);
          if (c.api) expect(out.body).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
        }
      });
    }
  }

  it("a share link opens the analysis signed out until it is revoked or expires; exports follow the same token", async () => {
    const share = await import("~/analyses/share.server");
    const page = await import("~/routes/share");
    const exporter = await import("~/routes/share-export");
    const adb = t.db;
    const link = await share.createShareLink(adb, x.done, ids.owner, 1);
    const open = await run(page.loader, makeRequest(`/share/${link.token}`), { token: link.token });
    expect(open.status).toBe(200);
    expect((open.body as { page: { job: { id: string } } }).page.job.id).toBe(x.done);
    const csv = await run(exporter.loader, makeRequest(`/share/${link.token}/export/steady-states.csv`), { token: link.token, file: "steady-states.csv" });
    expect(csv.status).toBe(200);
    expect(String(csv.body)).toMatch(/^state,S0,K,S0K,S1,F,S1F,verdict,eigenvalues\n1,0\.40173444/);
    expect((await run(page.loader, makeRequest("/share/not-a-real-token-at-all-xyz"), { token: "not-a-real-token-at-all-xyz" })).status).toBe(404);
    await adb.updateTable("analysis_share_links").set({ expires_at: new Date(Date.now() - 1000) }).where("id", "=", link.id).execute();
    expect((await run(page.loader, makeRequest(`/share/${link.token}`), { token: link.token })).status).toBe(404);
    const live = await share.createShareLink(adb, x.done, ids.owner, 1);
    expect(await share.revokeShareLink(adb, x.done, live.id)).toBe(true);
    expect((await run(page.loader, makeRequest(`/share/${live.token}`), { token: live.token })).status).toBe(404);
    // Only the hash is stored.
    const stored = await adb.selectFrom("analysis_share_links").select("token_hash").where("id", "=", live.id).executeTakeFirstOrThrow();
    expect(stored.token_hash).not.toContain(live.token);
    expect(stored.token_hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it("a share link shows the analysed version's reactions and rate values, and nothing of later versions", async () => {
    const share = await import("~/analyses/share.server");
    const page = await import("~/routes/share");
    const { appendVersion } = await import("~/networks/networks.server");
    const adb = t.db;
    const link = await share.createShareLink(adb, x.done, ids.owner, 1);
    // A later version of the network with other values and an extra reaction: not part of what the link grants.
    await appendVersion(t.db, x.networkId, { csv: CYCLE.replace("S1F -> S0 + F,c2,,3/2,", "S1F -> S0 + F,c2,,9,\nS1 -> 0,secret_k,,5,"), changeNote: "later", authorId: ids.owner });
    const open = await run(page.loader, makeRequest(`/share/${link.token}`), { token: link.token });
    expect(open.status).toBe(200);
    type Shared = { page: { network: { reactions: { id: string; reaction: string; rate: string; usedValue: string | null }[] } } };
    const reactions = (open.body as Shared).page.network.reactions;
    expect(reactions.map((r) => [r.id, r.reaction, r.rate, r.usedValue])).toEqual([
      ["r1", "K + S0 → S0K", "a1", "1"],
      ["r2", "S0K → K + S0", "d1", "1/2"],
      ["r3", "S0K → K + S1", "c1", "2"],
      ["r4", "F + S1 → S1F", "a2", "1"],
      ["r5", "S1F → F + S1", "d2", "1"],
      ["r6", "S1F → F + S0", "c2", "3/2"],
    ]);
    expect(JSON.stringify(open.body)).not.toContain("secret_k");
  });

  it("rename, archive and delete write the lab's audit trail; a run still waiting cannot be deleted; bad names are refused", async () => {
    const adb = t.db;
    const kinds = (await adb.selectFrom("audit_events").select("kind").where("kind", "like", "analysis.%").execute()).map((r) => r.kind);
    expect(kinds).toEqual(expect.arrayContaining(["analysis.renamed", "analysis.note_changed", "analysis.archived", "analysis.unarchived", "analysis.deleted"]));
    const renamed = await adb.selectFrom("audit_events").select("details").where("kind", "=", "analysis.renamed").executeTakeFirstOrThrow();
    expect(renamed.details).toMatchObject({ analysisId: x.other, networkName: "cycle", version: 1, from: "", to: "Baseline" });
    expect(await adb.selectFrom("analyses").select("id").where("id", "=", x.doomed).executeTakeFirst()).toBeUndefined();
    const page = await import("~/routes/analysis");
    const lab = await t.db.selectFrom("labs").select("id").where("slug", "=", "alpha").executeTakeFirstOrThrow();
    const waiting = (await makeJob(t.db, { kind: "analysis", labId: lab.id, networkVersionId: x.versionId, params: analysisParams({ initial: INITIAL }), startedBy: ids.editor, timeLimitSeconds: 60 })).id;
    const queued = await run(page.action, makeRequest(`/labs/alpha/analyses/${waiting}`, { method: "POST", form: { intent: "delete" }, cookie: cookies.owner }), { labSlug: "alpha", analysisId: waiting });
    expect(queued.status).toBe(409);
    expect(await adb.selectFrom("analyses").select("id").where("id", "=", waiting).executeTakeFirst()).toBeDefined();
    await adb.updateTable("analyses").set({ status: "cancelled" }).where("id", "=", waiting).execute();
    const long = await run(page.action, makeRequest(`/labs/alpha/analyses/${x.other}`, { method: "POST", form: { intent: "details", name: "x".repeat(121), note: "" }, cookie: cookies.editor }), { labSlug: "alpha", analysisId: x.other });
    expect(long.status).toBe(400);
    expect((await adb.selectFrom("analyses").select("name").where("id", "=", x.other).executeTakeFirstOrThrow()).name).toBe("Baseline");
  });

  it("the list filters, sorts and hides archived runs unless asked", async () => {
    const adb = t.db;
    const list = await import("~/routes/analyses");
    const names = async (query: string) => {
      const out = await run(list.loader, makeRequest(`/labs/alpha/analyses${query}`, { cookie: cookies.viewer }), alpha());
      return (out.body as { analyses: { id: string; name: string; status: string }[] }).analyses;
    };
    await adb.updateTable("analyses").set({ archived_at: new Date() }).where("id", "=", x.third).execute();
    expect((await names("")).map((a) => a.id)).not.toContain(x.third);
    expect((await names("?archived=1")).map((a) => a.id)).toContain(x.third);
    expect((await names("?status=queued")).map((a) => a.status)).toEqual(expect.arrayContaining(["queued"]));
    expect(new Set((await names("?status=queued")).map((a) => a.status))).toEqual(new Set(["queued"]));
    const byName = (await names("?sort=name&dir=desc")).map((a) => a.name);
    expect(byName[0]).toBe("Baseline");
    expect((await names(`?author=${ids.outsider}`)).length).toBe(0);
    expect(new Set((await names(`?author=${ids.editor}`)).map((a) => (a as { startedBy?: string }).startedBy))).toEqual(new Set(["editor"]));
    expect((await names("?kind=symbolic")).length).toBe(0);
    expect((await names("?kind=class")).length).toBeGreaterThan(0);
    expect((await names("?from=2000-01-01&to=2000-01-02")).length).toBe(0);
    // Nonsense filter values are ignored, not errors.
    expect((await names("?status=exploded&sort=drop&version=-1")).length).toBe((await names("")).length);
    await adb.updateTable("analyses").set({ archived_at: null }).where("id", "=", x.third).execute();
  });

  it("validation problems come back located, in the API's error shape", async () => {
    const api = await import("~/routes/api/analyses");
    const out = await run(api.action, makeRequest("/api/labs/alpha/analyses", { bearer: tokens.editor, json: { networkId: x.networkId, initial: { Q: "1", S0: "-2" }, timeLimitSeconds: 99999 } }), alpha());
    expect(out.status).toBe(400);
    const problems = (out.body as { error: { code: string; details: { problems: { field: string }[] } } }).error;
    expect(problems.code).toBe("invalid_request");
    expect(problems.details.problems.map((p) => p.field).sort()).toEqual(["initial.Q", "initial.S0", "timeLimitSeconds"]);
  });
});
