import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { computePendingStructures } from "~/networks/structure-store.server";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";

/**
 * The network pages' loaders and actions with a real database: saving from the form (refused
 * grids store nothing), versions, restore as a new version, details, archive, delete with
 * confirmation, and the roles each needs (viewer reads, editor edits, owner deletes).
 */
const V1 = "reaction,rate\nA <-> B,k1\n";
const V2 = "reaction,rate\nA <-> B,k1\nB -> C,k3\n";

describe.skipIf(!hasTestDatabase)("network pages", () => {
  let t: TestDatabase;
  const cookies: Record<string, string> = {};
  let show: typeof import("~/routes/networks-show");
  let create: typeof import("~/routes/networks-new");
  let edit: typeof import("~/routes/networks-edit");
  let list: typeof import("~/routes/networks");
  let download: typeof import("~/routes/networks-download");
  let networkId = "";
  const lab = { labSlug: "alpha" };
  const page = () => `/labs/alpha/networks/${networkId}`;

  beforeAll(async () => {
    t = await setUpAccountsDb();
    for (const p of ["owner", "editor", "viewer", "outsider"]) {
      const id = (await makeUser(t.db, `${p}@pages.test`, p)).id;
      cookies[p] = await sessionCookieFor(id);
      if (p !== "outsider") await makeLab(t.db, `lab-${p}`, p, [[id, "owner"]]);
    }
    const ids = Object.fromEntries((await t.db.selectFrom("users").select(["id", "email"]).execute()).map((u) => [u.email.split("@")[0]!, u.id]));
    await makeLab(t.db, "alpha", "Alpha", [[ids.owner!, "owner"], [ids.editor!, "editor"], [ids.viewer!, "viewer"]]);
    show = await import("~/routes/networks-show");
    create = await import("~/routes/networks-new");
    edit = await import("~/routes/networks-edit");
    list = await import("~/routes/networks");
    download = await import("~/routes/networks-download");
  });
  afterAll(async () => tearDownAccountsDb(t));

  it("refuses to store an invalid grid and keeps the reply located; saves a valid one", async () => {
    const bad = await run(create.action, makeRequest("/labs/alpha/networks/new", { cookie: cookies.editor, form: { name: "Chain", csv: "reaction\nA -> B\nB => C\n" } }), lab);
    expect(bad.status).toBe(400);
    expect((bad.body as { error: { details: { problems: { row: number }[] } } }).error.details.problems[0]!.row).toBe(3);
    expect(await t.db.selectFrom("networks").selectAll().execute()).toEqual([]);
    const viewer = await run(create.action, makeRequest("/labs/alpha/networks/new", { cookie: cookies.viewer, form: { name: "Chain", csv: V1 } }), lab);
    expect(viewer.status).toBe(403);
    const ok = await run(create.action, makeRequest("/labs/alpha/networks/new", { cookie: cookies.editor, form: { name: "Chain", csv: V1, changeNote: "" } }), lab);
    expect(ok.status).toBe(302);
    networkId = ok.location!.split("/").pop()!;
    const v = await t.db.selectFrom("network_versions").selectAll().where("network_id", "=", networkId).executeTakeFirstOrThrow();
    expect(v).toMatchObject({ number: 1, csv: V1, change_note: "First version." });
  });

  it("saves a new version from the edit form and shows the diff", async () => {
    const viewer = await run(edit.loader, makeRequest(`${page()}/edit`, { cookie: cookies.viewer }), { ...lab, networkId });
    expect(viewer.status).toBe(403);
    const res = await run(edit.action, makeRequest(`${page()}/edit`, { cookie: cookies.editor, form: { csv: V2, changeNote: "C added" } }), { ...lab, networkId });
    expect(res.status).toBe(302);
    expect(res.location).toBe(`${page()}/versions?from=1&to=2`);
    const same = await run(edit.action, makeRequest(`${page()}/edit`, { cookie: cookies.editor, form: { csv: V2 } }), { ...lab, networkId });
    expect(same.status).toBe(409);
  });

  it("shows a pending structure (no algebra on the request), then the worker's result", async () => {
    const before = await run(show.loader, makeRequest(page(), { cookie: cookies.viewer }), { ...lab, networkId });
    expect(before.body).toMatchObject({ structure: null, structureStatus: "pending" });
    const rows = await run(list.loader, makeRequest("/labs/alpha/networks", { cookie: cookies.viewer }), lab);
    expect((rows.body as { rows: { name: string; deficiency: number | null; speciesCount: number }[] }).rows).toEqual([expect.objectContaining({ name: "Chain", deficiency: null, speciesCount: 3 })]);
    const tex = await run(download.loader, makeRequest(`${page()}/download/odes.tex`, { cookie: cookies.viewer }), { ...lab, networkId, file: "odes.tex" });
    expect(tex.status).toBe(503);
    expect(tex.response?.headers.get("Retry-After")).toMatch(/^\d+$/);
    expect(await computePendingStructures(t.db)).toBeGreaterThanOrEqual(1);
    const after = await run(show.loader, makeRequest(page(), { cookie: cookies.viewer }), { ...lab, networkId });
    expect(after.body).toMatchObject({ structureStatus: "ready", structure: { species: ["A", "B", "C"] } });
  });

  it("lets a viewer read the page, the list and the downloads", async () => {
    await computePendingStructures(t.db);
    const data = await run(show.loader, makeRequest(page(), { cookie: cookies.viewer }), { ...lab, networkId });
    expect(data.status).toBe(200);
    const d = data.body as { canEdit: boolean; version: { number: number }; structure: { species: string[] }; versions: unknown[] };
    expect(d).toMatchObject({ canEdit: false, version: { number: 2 }, structure: { species: ["A", "B", "C"] } });
    const older = await run(show.loader, makeRequest(`${page()}?v=1`, { cookie: cookies.viewer }), { ...lab, networkId });
    expect((older.body as { structure: { species: string[] } }).structure.species).toEqual(["A", "B"]);
    const rows = await run(list.loader, makeRequest("/labs/alpha/networks", { cookie: cookies.viewer }), lab);
    expect((rows.body as { rows: { name: string; deficiency: number }[] }).rows).toEqual([expect.objectContaining({ name: "Chain", deficiency: 0 })]);
    const csv = await run(download.loader, makeRequest(`${page()}/download/network.csv`, { cookie: cookies.viewer }), { ...lab, networkId, file: "network.csv" });
    expect(csv.body).toBe("reaction,rate,reverse_rate\nA <-> B,k1,k2\nB -> C,k3,\n");
    const tex = await run(download.loader, makeRequest(`${page()}/download/odes.tex`, { cookie: cookies.viewer }), { ...lab, networkId, file: "odes.tex" });
    expect(String(tex.body)).toContain("\\frac{d[\\mathrm{C}]}{dt} &= k_{3}\\,[\\mathrm{B}]");
    const matrix = await run(download.loader, makeRequest(`${page()}/download/stoichiometric-matrix.csv?v=1`, { cookie: cookies.viewer }), { ...lab, networkId, file: "stoichiometric-matrix.csv" });
    expect(matrix.body).toBe("species,r1,r2\nA,-1,1\nB,1,-1\n");
    const outsider = await run(show.loader, makeRequest(page(), { cookie: cookies.outsider }), { ...lab, networkId });
    expect(outsider.status).toBe(404);
    const anonymous = await run(show.loader, makeRequest(page()), { ...lab, networkId });
    expect(anonymous.status).toBe(302);
    expect(anonymous.location).toMatch(/^\/sign-in\?returnTo=/);
    const anonymousSave = await run(edit.action, makeRequest(`${page()}/edit`, { form: { csv: "reaction\nA -> B\n" } }), { ...lab, networkId });
    expect(anonymousSave.status).toBe(302);
    const outsiderDownload = await run(download.loader, makeRequest(`${page()}/download/network.csv`, { cookie: cookies.outsider }), { ...lab, networkId, file: "network.csv" });
    expect(outsiderDownload.status).toBe(404);
  });

  it("restores an old version as a new one, marking where it came from", async () => {
    const refused = await run(show.action, makeRequest(page(), { cookie: cookies.viewer, form: { intent: "restore", number: "1" } }), { ...lab, networkId });
    expect(refused.status).toBe(403);
    const res = await run(show.action, makeRequest(page(), { cookie: cookies.editor, form: { intent: "restore", number: "1" } }), { ...lab, networkId });
    expect(res.status).toBe(302);
    const v3 = await t.db.selectFrom("network_versions").selectAll().where("network_id", "=", networkId).where("number", "=", 3).executeTakeFirstOrThrow();
    expect(v3.csv).toBe(`# Restored from version 1 as version 3.\n${V1}`);
    expect(v3.change_note).toBe("Restored version 1.");
    const again = await run(show.action, makeRequest(page(), { cookie: cookies.editor, form: { intent: "restore", number: "1" } }), { ...lab, networkId });
    expect(again.status).toBe(409);
    const back = await run(show.action, makeRequest(page(), { cookie: cookies.editor, form: { intent: "restore", number: "2" } }), { ...lab, networkId });
    expect(back.status).toBe(302);
  });

  it("renames, tags and archives (editor); deletes only for an owner who types the name", async () => {
    const details = await run(show.action, makeRequest(page(), { cookie: cookies.editor, form: { intent: "details", name: "Chain A–C", description: "three species", tags: "Demo, chain" } }), { ...lab, networkId });
    expect(details.status).toBe(200);
    const row = await t.db.selectFrom("networks").selectAll().where("id", "=", networkId).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ name: "Chain A–C", description: "three species", tags: ["demo", "chain"] });
    const archive = await run(show.action, makeRequest(page(), { cookie: cookies.editor, form: { intent: "archive" } }), { ...lab, networkId });
    expect(archive.status).toBe(200);
    const hidden = await run(list.loader, makeRequest("/labs/alpha/networks", { cookie: cookies.viewer }), lab);
    expect((hidden.body as { rows: unknown[] }).rows).toEqual([]);
    const editorDelete = await run(show.action, makeRequest(page(), { cookie: cookies.editor, form: { intent: "delete", confirmName: "Chain A–C" } }), { ...lab, networkId });
    expect(editorDelete.status).toBe(403);
    const wrongName = await run(show.action, makeRequest(page(), { cookie: cookies.owner, form: { intent: "delete", confirmName: "Chain" } }), { ...lab, networkId });
    expect(wrongName.status).toBe(400);
    expect(await t.db.selectFrom("networks").select("id").where("id", "=", networkId).executeTakeFirst()).toBeTruthy();
    const deleted = await run(show.action, makeRequest(page(), { cookie: cookies.owner, form: { intent: "delete", confirmName: "Chain A–C" } }), { ...lab, networkId });
    expect(deleted.status).toBe(302);
    expect(await t.db.selectFrom("network_versions").selectAll().where("network_id", "=", networkId).execute()).toEqual([]);
    const audit = await t.db.selectFrom("audit_events").select(["kind", "details"]).where("kind", "=", "network.deleted").executeTakeFirstOrThrow();
    expect(audit.details).toMatchObject({ networkId, name: "Chain A–C" });
  });
});
