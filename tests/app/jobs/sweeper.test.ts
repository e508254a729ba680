import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";
import { analysisParams, fixtureCsv, makeJob, makeNetwork, makeTeam } from "./fixtures";
import { releaseRunningJobs, sweepStaleJobs } from "~/jobs/sweeper.server";

/** The sweeper's three outcomes for a running row whose heartbeat went quiet, and the clean hand-back. */
describe.skipIf(!hasTestDatabase)("sweeping jobs of dead workers", () => {
  let t: TestDatabase;
  const ids = { retry: "", last: "", cancelled: "", fresh: "", mine: "" };

  beforeAll(async () => {
    t = await setUpAccountsDb();
    const team = await makeTeam(t.db);
    const { versionId } = await makeNetwork(t.db, team.lab.id, team.owner.id, "cubic", fixtureCsv("cubic-autocatalysis"));
    const adb = t.db;
    const stale = new Date(Date.now() - 60_000);
    for (const key of Object.keys(ids) as (keyof typeof ids)[]) {
      const row = await makeJob(t.db, { kind: "analysis", labId: team.lab.id, networkVersionId: versionId, params: analysisParams(), startedBy: team.owner.id, timeLimitSeconds: 10 });
      ids[key] = row.id;
      await adb
        .updateTable("analyses")
        .set({
          status: "running",
          worker_id: key === "mine" ? "me" : "dead",
          attempts: key === "last" ? 2 : 1,
          heartbeat_at: key === "fresh" || key === "mine" ? new Date() : stale,
          cancel_requested_at: key === "cancelled" ? new Date() : null,
        })
        .where("id", "=", row.id)
        .execute();
    }
  });
  afterAll(async () => tearDownAccountsDb(t));

  const row = (id: string) => t.db.selectFrom("analyses").selectAll().where("id", "=", id).executeTakeFirstOrThrow();

  it("requeues with attempts left, fails with the reason without, cancels when asked, leaves live rows alone", async () => {
    const result = await sweepStaleJobs(t.db, 30_000);
    expect(result.requeued.map((r) => r.id)).toEqual([ids.retry]);
    expect(result.failed.sort()).toEqual([ids.last, ids.cancelled].sort());
    expect((await row(ids.retry)).status).toBe("queued");
    const last = await row(ids.last);
    expect(last.status).toBe("failed");
    expect(last.error).toMatch(/^The worker running this job stopped responding \(no heartbeat since \d\d:\d\d:\d\d UTC\) on each of its 2 attempts/);
    expect(last.finished_at).not.toBeNull();
    expect((await row(ids.cancelled)).status).toBe("cancelled");
    expect((await row(ids.fresh)).status).toBe("running");
    // A second sweep finds nothing more to do.
    expect(await sweepStaleJobs(t.db, 30_000)).toEqual({ requeued: [], failed: [] });
  });

  it("a stopping worker hands back only its own running rows, attempt not counted", async () => {
    const back = await releaseRunningJobs(t.db, "me");
    expect(back.map((b) => b.id)).toEqual([ids.mine]);
    const r = await row(ids.mine);
    expect([r.status, r.attempts, r.worker_id]).toEqual(["queued", 0, null]);
    expect((await row(ids.fresh)).status).toBe("running");
  });
});
