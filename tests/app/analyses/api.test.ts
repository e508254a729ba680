import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeRequest, run, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";
import { fixtureCsv, makeNetwork, makeTeam, waitFor } from "../jobs/fixtures";
import { stopBosses } from "~/jobs/queue.server";
import { startWorker, type RunningWorker } from "~/jobs/worker.server";

/** The JSON API end to end with a personal token and a live worker: start, poll, fetch the result, scan, cancel. */
describe.skipIf(!hasTestDatabase)("analyses JSON API", () => {
  let t: TestDatabase;
  let worker: RunningWorker;
  let token = "";
  let networkId = "";
  const lab = { labSlug: "alpha" };

  beforeAll(async () => {
    t = await setUpAccountsDb();
    const team = await makeTeam(t.db);
    networkId = (await makeNetwork(t.db, team.lab.id, team.owner.id, "cubic", fixtureCsv("cubic-autocatalysis"))).networkId;
    const { createApiToken } = await import("~/account/api-tokens.server");
    const { db } = await import("~/db.server");
    token = (await createApiToken(db(), { userId: team.owner.id, name: "api", expiresAt: null })).token;
    worker = await startWorker({ databaseUrl: t.url, heartbeatMs: 200, sweepEveryMs: 1000, pollSeconds: 0.5, log: () => {} });
  }, 60_000);
  afterAll(async () => {
    await worker?.stop();
    await stopBosses();
    await tearDownAccountsDb(t);
  });

  const call = async (mod: { loader?: (a: any) => unknown; action?: (a: any) => unknown }, kind: "loader" | "action", path: string, params: Record<string, string>, opts: { method?: string; json?: unknown } = {}) =>
    run(mod[kind]!, makeRequest(path, { bearer: token, ...opts }), params);

  it("starts an analysis, polls it to success and fetches the result; then a scan the same way", async () => {
    const list = await import("~/routes/api/analyses");
    const item = await import("~/routes/api/analyses-item");
    const started = await call(list, "action", "/api/labs/alpha/analyses", lab, { json: { networkId, initial: { X: "1" }, timeLimitSeconds: 30 } });
    expect(started.status).toBe(202);
    const a = (started.body as { analysis: { id: string; status: string; links: { self: string } } }).analysis;
    expect(a.status).toBe("queued");
    expect(a.links.self).toBe(`/api/labs/alpha/analyses/${a.id}`);
    const done = await waitFor(async () => {
      const r = await call(item, "loader", a.links.self, { ...lab, analysisId: a.id });
      const body = r.body as { analysis: { status: string; result?: { steadyStates: { concentrations: { X: number } }[] } } };
      return body.analysis.status === "succeeded" ? body.analysis : undefined;
    }, 60_000, "the analysis");
    expect(done.result!.steadyStates.map((s) => s.concentrations.X)).toEqual([1, 2, 3]);

    const scans = await import("~/routes/api/scans");
    const scanItem = await import("~/routes/api/scans-item");
    const s = await call(scans, "action", `/api/labs/alpha/analyses/${a.id}/scans`, { ...lab, analysisId: a.id }, { json: { parameterKind: "rate", parameter: "k1", from: 5.5, to: 6.5, points: 3 } });
    expect(s.status).toBe(202);
    const scanId = (s.body as { scan: { id: string } }).scan.id;
    const scan = await waitFor(async () => {
      const body = (await call(scanItem, "loader", `/api/labs/alpha/scans/${scanId}`, { ...lab, scanId })).body as { scan: { status: string; result?: { points: { value: number; states: unknown[] }[] } } };
      return body.scan.status === "succeeded" ? body.scan : undefined;
    }, 60_000, "the scan");
    // k1 = 5.5 and 6.5 lie outside the three-state window 6 ± 2/(3√3); k1 = 6 inside (see compute.test.ts).
    expect(scan.result!.points.map((p) => p.states.length)).toEqual([1, 3, 1]);
  }, 120_000);

  it("cancels through the API; a scan id is not an analysis id", async () => {
    const list = await import("~/routes/api/analyses");
    const cancel = await import("~/routes/api/analyses-cancel");
    const item = await import("~/routes/api/analyses-item");
    // A symbolic run of this network with a long limit; cancelled at once, whatever state it is in.
    const started = await call(list, "action", "/api/labs/alpha/analyses", lab, { json: { networkId, rateMode: "symbolic", timeLimitSeconds: 60 } });
    const id = (started.body as { analysis: { id: string } }).analysis.id;
    const c = await call(cancel, "action", `/api/labs/alpha/analyses/${id}/cancel`, { ...lab, analysisId: id }, { method: "POST" });
    expect(c.status).toBe(202);
    const final = await waitFor(async () => {
      const body = (await call(item, "loader", `/api/labs/alpha/analyses/${id}`, { ...lab, analysisId: id })).body as { analysis: { status: string } };
      return ["cancelled", "succeeded"].includes(body.analysis.status) ? body.analysis.status : undefined;
    }, 30_000, "cancellation");
    // A job may finish before the cancel reaches it; it is never left running.
    expect(["cancelled", "succeeded"]).toContain(final);
    const wrong = await call(await import("~/routes/api/scans-item"), "loader", `/api/labs/alpha/scans/${id}`, { ...lab, scanId: id });
    expect(wrong.status).toBe(404);
    expect(wrong.body).toEqual({ error: { code: "not_found", message: "No such scan in this lab." } });
    const bad = await call(list, "action", "/api/labs/alpha/analyses", lab, { method: "PUT", json: {} });
    expect(bad.status).toBe(405);
  }, 60_000);
});
