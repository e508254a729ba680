import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";
import { makeNetwork } from "../jobs/fixtures";

/** The new-analysis form starts from the initial values stored with the version (`# initial:`). */
const CSV = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nE + S <-> C,k1,k2,1,1/2\nC -> E + P,k3,,2,\n# initial: E = 1/10, S = 1\n";

describe.skipIf(!hasTestDatabase)("stored initial values in the new-analysis form", () => {
  let t: TestDatabase;
  let cookie = "";
  let ids = { networkId: "", versionId: "" };
  beforeAll(async () => {
    t = await setUpAccountsDb();
    const editor = (await makeUser(t.db, "editor@initial.test", "editor")).id;
    const lab = await makeLab(t.db, "alpha", "Alpha", [[editor, "owner"]]);
    ids = await makeNetwork(t.db, lab.id, editor, "enzyme", CSV);
    cookie = await sessionCookieFor(editor);
  });
  afterAll(async () => tearDownAccountsDb(t));

  it("fills the initial concentrations from the version, exact, and leaves the others empty", async () => {
    const route = await import("~/routes/analyses-new");
    const out = await run(route.loader, makeRequest(`/labs/alpha/networks/${ids.networkId}/analyse`, { cookie }), { labSlug: "alpha", networkId: ids.networkId });
    expect(out.status).toBe(200);
    const data = out.body as { species: string[]; storedInitial: Record<string, string> };
    expect(data.species).toEqual(["E", "S", "C", "P"]);
    expect(data.storedInitial).toEqual({ E: "1/10", S: "1" });
  });
});
