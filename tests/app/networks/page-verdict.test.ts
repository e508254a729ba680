import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";
import { analysisParams, makeJob, makeNetwork } from "../jobs/fixtures";
import { computeJob } from "~/jobs/compute";
import { stopBosses } from "~/jobs/queue.server";
import { computePendingStructures } from "~/networks/structure-store.server";
import type { VerdictCard } from "~/networks/verdict";

/**
 * The network page's verdict card takes the newest finished analysis of the shown version when
 * the structure leaves a question open. The fed Schlögl reactor (Schlögl, Z. Physik 253, 1972):
 * with A = 2 and B = 3 held constant, dX/dt = −(X − 1)(X − 2)(X − 3) (expanded by hand), so three
 * positive steady states, the outer two stable.
 */
const SWITCH = "# constant: A = 2, B = 3\nreaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + 2X <-> 3X,k1,k2,3,1\nX <-> B,k3,k4,11,2\n";

describe.skipIf(!hasTestDatabase)("network page verdict from the newest analysis", () => {
  let t: TestDatabase;
  let cookie: string;
  const x = { networkId: "", versionId: "", labId: "", ownerId: "" };

  beforeAll(async () => {
    t = await setUpAccountsDb();
    const owner = await makeUser(t.db, "owner@lab.test", "Owner");
    x.ownerId = owner.id;
    x.labId = (await makeLab(t.db, "alpha", "Alpha", [[owner.id, "owner"]])).id;
    Object.assign(x, await makeNetwork(t.db, x.labId, owner.id, "Switch", SWITCH));
    cookie = await sessionCookieFor(owner.id);
  }, 60_000);
  afterAll(async () => {
    await stopBosses();
    await tearDownAccountsDb(t);
  });

  const load = async () => {
    const page = await import("~/routes/networks-show");
    const out = await run(page.loader, makeRequest(`/labs/alpha/networks/${x.networkId}`, { cookie }), { labSlug: "alpha", networkId: x.networkId });
    expect(out.status).toBe(200);
    return out.body as { verdict: VerdictCard | null; structureStatus: string; odes: { species: string }[] };
  };
  const verdict = async () => {
    const card = (await load()).verdict;
    expect(card).not.toBeNull();
    return card!;
  };

  it("has no card while the worker has not computed the structure (every line rests on it), but the rate equations", async () => {
    const pending = await load();
    expect(pending).toMatchObject({ verdict: null, structureStatus: "pending" });
    // The rate equations come from the file, so the page has them meanwhile (A and B are held: X only).
    expect(pending.odes.map((o) => o.species)).toEqual(["X"]);
    await computePendingStructures(t.db);
    expect((await load()).structureStatus).toBe("ready");
  });

  it("before any analysis the structure leaves the count open and offers to start one", async () => {
    const card = await verdict();
    expect(card.lines[0]).toMatchObject({ statement: "Not decided by the structure.", tone: "open", evidence: { label: "Start an analysis" } });
  });

  it("after a finished analysis it shows the analysis' count and names the constants it used", async () => {
    const params = analysisParams({ initial: { X: "1" } });
    const result = computeJob({ kind: "analysis", csv: SWITCH, params }, { engineTimeoutMs: 30_000 });
    const job = await makeJob(t.db, { kind: "analysis", labId: x.labId, networkVersionId: x.versionId, params, startedBy: x.ownerId, timeLimitSeconds: 60 });
    await t.db.updateTable("analyses").set({ status: "succeeded", result: result as never, finished_at: new Date() }).where("id", "=", job.id).execute();
    const card = await verdict();
    expect(card.lines[0]).toMatchObject({
      statement: "3 positive steady states in this class: 2 stable, 1 unstable.",
      basis: "From the newest analysis of this version, for the rate constants of the analysis.",
      evidence: { href: `/labs/alpha/analyses/${job.id}` },
    });
    // The run's three states are a witness of multistationarity, whatever the stored search verdict says.
    expect(card.lines[1]).toMatchObject({ statement: "Yes: some positive rate constants give two or more in one class.", basis: "The newest analysis found 3 in one class with the given rate constants and totals." });
    expect(card.assumptions).toContain("Held constant: A, B (2 species)");
  });
});
