import { readFileSync } from "node:fs";
import { computePendingStructures } from "~/networks/structure-store.server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readSbml } from "@domain/network/sbml/index";
import { hasTestDatabase } from "../support/test-db";
import type { TestDatabase } from "../support/test-db";
import { APP_URL, makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";

/**
 * SBML and reaction lists through the JSON API (multipart file, JSON field, raw body), each
 * becoming a normal network version; refused files answer 400 with located problems and store
 * nothing; the network page's new downloads (SBML, reaction list, Python, Julia) with their roles.
 */
const HATCHERY = readFileSync("tests/fixtures/sbml/hatchery.xml", "utf8");
const HATCHERY_CSV = "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value\nEgg -> Fry,hatching,kh,,3,\nFry + Feed <-> Fingerling,growing,kg,kb,1/2,1/4\n";
// The file's initial concentrations are stored with the version, after the rows.
const HATCHERY_STORED = `${HATCHERY_CSV}# initial: Egg = 2, Fry = 0, Feed = 1, Fingerling = 0\n`;

describe.skipIf(!hasTestDatabase)("importing SBML and reaction lists", () => {
  let t: TestDatabase;
  const tokens: Record<string, string> = {};
  const cookies: Record<string, string> = {};
  let api: typeof import("~/routes/api/networks");
  let versions: typeof import("~/routes/api/networks-versions");
  let download: typeof import("~/routes/networks-download");
  const LIST = "/api/labs/alpha/networks";
  const alpha = { labSlug: "alpha" };
  let networkId = "";

  const counts = async () => {
    const v = await t.db.selectFrom("network_versions").select(({ fn }) => fn.countAll<string>().as("c")).executeTakeFirstOrThrow();
    return v.c;
  };
  const upload = (name: string, text: string, type: string, fields: Record<string, string>, bearer: string) => {
    const form = new FormData();
    form.set("file", new File([text], name, { type }));
    for (const [k, v] of Object.entries(fields)) form.set(k, v);
    return new Request(new URL(LIST, APP_URL), { method: "POST", body: form, headers: { Authorization: `Bearer ${bearer}` } });
  };

  beforeAll(async () => {
    t = await setUpAccountsDb();
    const ids: Record<string, string> = {};
    for (const p of ["editor", "viewer", "outsider"]) ids[p] = (await makeUser(t.db, `${p}@import.test`, p)).id;
    await makeLab(t.db, "alpha", "Alpha", [[ids.editor!, "owner"], [ids.viewer!, "viewer"]]);
    await makeLab(t.db, "beta", "Beta", [[ids.outsider!, "owner"]]);
    const { createApiToken } = await import("~/account/api-tokens.server");
    const { db } = await import("~/db.server");
    for (const p of Object.keys(ids)) {
      tokens[p] = (await createApiToken(db(), { userId: ids[p]!, name: "import test", expiresAt: null })).token;
      cookies[p] = await sessionCookieFor(ids[p]!);
    }
    api = await import("~/routes/api/networks");
    versions = await import("~/routes/api/networks-versions");
    download = await import("~/routes/networks-download");
  });
  afterAll(async () => tearDownAccountsDb(t));

  it("creates a network version from an uploaded .xml file", async () => {
    const res = await run(api.action, upload("hatchery.xml", HATCHERY, "application/xml", { name: "Hatchery" }, tokens.editor!), alpha);
    expect(res.status).toBe(201);
    const body = res.body as { network: { id: string; name: string }; version: { number: number; csv: string }; structure: { species: string[]; deficiency: number } };
    expect(body.version).toMatchObject({ number: 1, csv: HATCHERY_STORED });
    networkId = body.network.id;
    await computePendingStructures(t.db);
    const item = await import("~/routes/api/networks-item");
    const read = await run(item.loader, makeRequest(`${LIST}/${networkId}`, { bearer: tokens.editor }), { ...alpha, networkId });
    expect((read.body as { structure: { species: string[] } }).structure.species).toEqual(["Egg", "Fry", "Feed", "Fingerling"]);
  });

  it("adds a version from JSON `sbml`, and creates from JSON `reactions` and a raw application/sbml+xml body", async () => {
    const next = HATCHERY.replace('<parameter id="kh" value="3"', '<parameter id="kh" value="4"');
    const added = await run(versions.action, makeRequest(`${LIST}/${networkId}/versions`, { bearer: tokens.editor, json: { sbml: next, changeNote: "faster hatching" } }), { ...alpha, networkId });
    expect(added.status).toBe(201);
    expect((added.body as { version: { number: number; csv: string } }).version.csv).toContain("Egg -> Fry,hatching,kh,,4,");

    const text = await run(api.action, makeRequest(LIST, { bearer: tokens.editor, json: { name: "Listed", reactions: "decay: X -> 0, d = 1/2\n" } }), alpha);
    expect(text.status).toBe(201);
    expect((text.body as { version: { csv: string } }).version.csv).toBe("reaction,label,rate,rate_value\nX -> 0,decay,d,1/2\n");

    const raw = new Request(new URL(`${LIST}?name=Raw`, APP_URL), { method: "POST", body: HATCHERY, headers: { "Content-Type": "application/sbml+xml", Authorization: `Bearer ${tokens.editor}` } });
    const rawRes = await run(api.action, raw, alpha);
    expect(rawRes.status).toBe(201);
  });

  it("refuses a file with a non-mass-action law: 400, the reaction's id and line, every reaction's fate, nothing stored", async () => {
    const before = await counts();
    const bad = HATCHERY.replace("<ci>kh</ci><ci>Egg</ci>", "<ci>kh</ci><apply><divide/><ci>Egg</ci><apply><plus/><ci>kh</ci><ci>Egg</ci></apply></apply>");
    const res = await run(api.action, upload("bad.sbml", bad, "", { name: "Bad" }, tokens.editor!), alpha);
    expect(res.status).toBe(400);
    const error = (res.body as { error: { code: string; details: { format: string; problems: { row: number; id?: string; element?: string; message: string }[]; reactions: { id: string; status: string }[] } } }).error;
    expect(error.code).toBe("invalid_request");
    expect(error.details.format).toBe("sbml");
    expect(error.details.problems).toEqual([expect.objectContaining({ row: 22, id: "hatch", element: "reaction" })]);
    expect(error.details.reactions.map((r) => [r.id, r.status])).toEqual([
      ["hatch", "refused"],
      ["grow", "read"],
    ]);
    expect(await counts()).toBe(before);
  });

  it("refuses SBML from a viewer (403) and an outsider (404) before reading it", async () => {
    expect((await run(api.action, upload("h.xml", HATCHERY, "application/xml", { name: "X" }, tokens.viewer!), alpha)).status).toBe(403);
    expect((await run(api.action, upload("h.xml", HATCHERY, "application/xml", { name: "X" }, tokens.outsider!), alpha)).status).toBe(404);
  });

  it("offers SBML, a reaction list, Python and Julia downloads to viewers, not to outsiders", async () => {
    const params = (file: string) => ({ ...alpha, networkId, file });
    const page = `/labs/alpha/networks/${networkId}`;
    const xml = await run(download.loader, makeRequest(`${page}/download/network.xml?v=1`, { cookie: cookies.viewer }), params("network.xml"));
    expect(xml.status).toBe(200);
    expect(xml.response?.headers.get("Content-Type")).toMatch(/^application\/sbml\+xml/);
    const back = readSbml(String(xml.body));
    expect(back.problems).toEqual([]);
    expect(back.csv).toBe(HATCHERY_STORED);
    const txt = await run(download.loader, makeRequest(`${page}/download/network.txt?v=1`, { cookie: cookies.viewer }), params("network.txt"));
    expect(txt.body).toBe("# initial: Egg = 2, Fry = 0, Feed = 1, Fingerling = 0\nhatching: Egg -> Fry, kh = 3\ngrowing: Fry + Feed <-> Fingerling, kg = 1/2, kb = 1/4\n");
    const py = await run(download.loader, makeRequest(`${page}/download/odes.py?v=1`, { cookie: cookies.viewer }), params("odes.py"));
    expect(String(py.body)).toContain('PARAMETERS = {"kh": 3.0, "kg": 1 / 2, "kb": 1 / 4}');
    expect(py.response?.headers.get("Content-Disposition")).toMatch(/hatchery_v1_odes\.py/);
    const jl = await run(download.loader, makeRequest(`${page}/download/odes.jl`, { cookie: cookies.viewer }), params("odes.jl"));
    expect(String(jl.body)).toContain('"kh" => 4.0');
    const outsider = await run(download.loader, makeRequest(`${page}/download/network.xml`, { cookie: cookies.outsider }), params("network.xml"));
    expect(outsider.status).toBe(404);
  });

  it("offers every download of a version with constant species (no refusal), each carrying them", async () => {
    const csv = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + 2X <-> 3X,k1,k2,2,1\nX <-> B,k3,k4,1,3\n# constant: A = 5/2, B = 3\n# initial: X = 1/4\n";
    const created = await run(api.action, makeRequest(LIST, { bearer: tokens.editor, json: { name: "Held switch", csv } }), alpha);
    expect(created.status).toBe(201);
    const id = (created.body as { network: { id: string } }).network.id;
    const get = (file: string) => run(download.loader, makeRequest(`/labs/alpha/networks/${id}/download/${file}`, { cookie: cookies.viewer }), { ...alpha, networkId: id, file });
    const xml = await get("network.xml");
    expect(xml.status).toBe(200);
    expect(String(xml.body)).toContain('<species id="A" compartment="compartment" initialConcentration="2.5" hasOnlySubstanceUnits="false" boundaryCondition="true" constant="true"/>');
    const back = readSbml(String(xml.body));
    expect(back.network?.constants?.map((c) => c.name)).toEqual(["A", "B"]);
    expect(back.network?.initial?.map((i) => i.name)).toEqual(["X"]);
    const txt = await get("network.txt");
    expect(txt.status).toBe(200);
    expect(String(txt.body)).toMatch(/^# constant: A = 5\/2, B = 3\n# initial: X = 1\/4\n/);
    const py = await get("odes.py");
    expect(py.status).toBe(200);
    expect(String(py.body)).toContain('"A": 5 / 2, "B": 3.0}');
    expect((await get("odes.jl")).status).toBe(200);
    // And an SBML file whose boundary species is held arrives as a version with the `# constant:` line.
    const imported = await run(api.action, makeRequest(LIST, { bearer: tokens.editor, json: { name: "Held again", sbml: String(xml.body) } }), alpha);
    expect(imported.status).toBe(201);
    expect((imported.body as { version: { csv: string } }).version.csv).toMatch(/\n# constant: A = 5\/2, B = 3\n# initial: X = 1\/4\n$/);
  });
});
