import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeRequest, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";
import { analysisParams, fixtureCsv, makeJob, makeNetwork, makeTeam } from "../jobs/fixtures";

/**
 * One user or lab cannot starve everyone (issue 16 #9): a cap on jobs waiting or running per person
 * and per lab (atomic under parallel requests), a site maximum on lab time limits, and a worker that
 * picks the queued job of the lab with the fewest running jobs rather than the oldest one.
 */
describe.skipIf(!hasTestDatabase)("fair queues", () => {
  let t: TestDatabase;
  let alpha: Awaited<ReturnType<typeof makeTeam>>;
  let beta: Awaited<ReturnType<typeof makeTeam>>;
  let alphaVersion: string;
  let betaVersion: string;

  beforeAll(async () => {
    t = await setUpAccountsDb();
    alpha = await makeTeam(t.db, "alpha");
    beta = await makeTeam(t.db, "beta");
    alphaVersion = (await makeNetwork(t.db, alpha.lab.id, alpha.owner.id, "cubic", fixtureCsv("cubic-autocatalysis"))).versionId;
    betaVersion = (await makeNetwork(t.db, beta.lab.id, beta.owner.id, "cubic", fixtureCsv("cubic-autocatalysis"))).versionId;
  });
  afterAll(async () => tearDownAccountsDb(t));
  beforeEach(async () => {
    await t.db.deleteFrom("analyses").execute();
  });

  const newJob = (lab: typeof alpha, versionId: string) => ({
    kind: "analysis" as const,
    labId: lab.lab.id,
    networkVersionId: versionId,
    parentId: null,
    params: analysisParams() as never,
    startedBy: lab.owner.id,
    timeLimitSeconds: 60,
    notify: false,
  });

  it("caps the jobs one person may have waiting or running, even for a parallel burst", async () => {
    const { insertJobWithinCaps, SITE_LIMITS } = await import("~/analyses/repository.server");
    const db = t.db;
    const results = await Promise.all(Array.from({ length: 25 }, () => insertJobWithinCaps(db, newJob(alpha, alphaVersion))));
    const accepted = results.filter((r) => r.ok).length;
    expect(accepted).toBe(SITE_LIMITS.maxActiveJobsPerUser);
    const refused = results.find((r) => !r.ok);
    expect(refused && !refused.ok && refused.message).toMatch(/at most 10/);
    const rows = await t.db.selectFrom("analyses").select("id").execute();
    expect(rows).toHaveLength(SITE_LIMITS.maxActiveJobsPerUser);
  });

  it("keeps a lab's time limit under the site maximum", async () => {
    const { SITE_LIMITS, labLimits, setLabLimits } = await import("~/analyses/repository.server");
    const analyses = await import("~/routes/analyses");
    const cookie = await sessionCookieFor(alpha.owner.id);
    const out = await run(analyses.action, makeRequest("/labs/alpha/analyses", { cookie, form: { maxTimeLimitSeconds: "3600", maxBasisSize: "3000" } }), { labSlug: "alpha" });
    expect(out.status).toBe(400);
    expect(JSON.stringify(out.body)).toMatch(/site's maximum/);
    // A value stored earlier is capped when read.
    await setLabLimits(t.db, alpha.lab.id, { maxTimeLimitSeconds: 3600, maxBasisSize: 3000 });
    expect((await labLimits(t.db, alpha.lab.id)).maxTimeLimitSeconds).toBe(SITE_LIMITS.maxTimeLimitSeconds);
  });

  it("a worker picks another lab's waiting job before a busy lab's older ones", async () => {
    const { claimNextJob } = await import("~/jobs/process-job.server");
    const db = t.db;
    const job = (lab: typeof alpha, v: string) => makeJob(t.db, { kind: "analysis", labId: lab.lab.id, networkVersionId: v, params: analysisParams(), startedBy: lab.owner.id, timeLimitSeconds: 60 });
    const busy = await job(alpha, alphaVersion);
    await t.db.updateTable("analyses").set({ status: "running", worker_id: "w0", heartbeat_at: new Date() }).where("id", "=", busy.id).execute();
    const older = [await job(alpha, alphaVersion), await job(alpha, alphaVersion), await job(alpha, alphaVersion)];
    const tiny = await job(beta, betaVersion);
    // The queue message names alpha's oldest waiting job; beta's job goes first anyway.
    const first = await claimNextJob(db, "w1", older[0]!.id);
    expect(first?.id).toBe(tiny.id);
    // Now both labs run one: alpha's oldest (the message's own job) is next.
    const second = await claimNextJob(db, "w2", older[1]!.id);
    expect(second?.id).toBe(older[1]!.id);
    expect((await claimNextJob(db, "w3", null))?.id).toBe(older[0]!.id);
  });
});
