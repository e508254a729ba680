import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { computePendingStructures } from "~/networks/structure-store.server";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { APP_URL, makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";

/**
 * The networks JSON API against a real database: create by CSV upload with a personal token,
 * read the structure back, list and read versions, located CSV problems in the error details,
 * and refusals for every kind of caller without the right role (nothing changed by them).
 */
const CSV = "reaction,label,rate,reverse_rate,rate_value\nE + S <-> C,binding,kon,koff,2\nC -> E + P,turnover,kcat,,3\n";
const BAD = "reaction,rate\nA -> B,k1\nB => C,k2\nC -> D,1k\n";
const sha = (s: string) => createHash("sha256").update(s, "utf8").digest("hex");

function upload(path: string, csv: string, fields: Record<string, string>, auth: { bearer?: string; cookie?: string } = {}) {
  const form = new FormData();
  form.set("file", new File([csv], "enzyme.csv", { type: "text/csv" }));
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  const headers = new Headers();
  if (auth.bearer) headers.set("Authorization", `Bearer ${auth.bearer}`);
  if (auth.cookie) headers.set("Cookie", auth.cookie);
  return new Request(new URL(path, APP_URL), { method: "POST", body: form, headers });
}

describe.skipIf(!hasTestDatabase)("networks API", () => {
  let t: TestDatabase;
  const tokens: Record<string, string> = {};
  const cookies: Record<string, string> = {};
  let api: typeof import("~/routes/api/networks");
  let item: typeof import("~/routes/api/networks-item");
  let versions: typeof import("~/routes/api/networks-versions");
  let version: typeof import("~/routes/api/networks-version");
  let networkId = "";
  const LIST = "/api/labs/alpha/networks";
  const alpha = { labSlug: "alpha" };

  const counts = async () => {
    const n = await t.db.selectFrom("networks").select(({ fn }) => fn.countAll<string>().as("c")).executeTakeFirstOrThrow();
    const v = await t.db.selectFrom("network_versions").select(({ fn }) => fn.countAll<string>().as("c")).executeTakeFirstOrThrow();
    return `${n.c}/${v.c}`;
  };

  beforeAll(async () => {
    t = await setUpAccountsDb();
    const ids: Record<string, string> = {};
    for (const p of ["owner", "editor", "viewer", "outsider"]) ids[p] = (await makeUser(t.db, `${p}@net.test`, p)).id;
    await makeLab(t.db, "alpha", "Alpha", [[ids.owner!, "owner"], [ids.editor!, "editor"], [ids.viewer!, "viewer"]]);
    await makeLab(t.db, "beta", "Beta", [[ids.outsider!, "owner"]]);
    const { createApiToken } = await import("~/account/api-tokens.server");
    const { db } = await import("~/db.server");
    for (const p of Object.keys(ids)) {
      tokens[p] = (await createApiToken(db(), { userId: ids[p]!, name: "api test", expiresAt: null })).token;
      cookies[p] = await sessionCookieFor(ids[p]!);
    }
    api = await import("~/routes/api/networks");
    item = await import("~/routes/api/networks-item");
    versions = await import("~/routes/api/networks-versions");
    version = await import("~/routes/api/networks-version");
  });
  afterAll(async () => tearDownAccountsDb(t));

  it("creates a network from a CSV upload with a bearer token", async () => {
    const res = await run(api.action, upload(LIST, CSV, { name: "Enzyme", tags: "enzyme, Test", changeNote: "from the bench" }, { bearer: tokens.editor }), alpha);
    expect(res.status).toBe(201);
    const body = res.body as { network: { id: string; name: string; tags: string[] }; version: { number: number; contentHash: string; csv: string; changeNote: string; author: string }; structure: unknown };
    expect(body.network.name).toBe("Enzyme");
    expect(body.network.tags).toEqual(["enzyme", "test"]);
    expect(body.version).toMatchObject({ number: 1, contentHash: sha(CSV), csv: CSV, changeNote: "from the bench", author: "editor" });
    // The upload request computes no structure: it is requested, and the worker computes it.
    expect(body).toMatchObject({ structure: null, structureStatus: "pending" });
    expect(res.response?.headers.get("Location")).toBe(`/api/labs/alpha/networks/${body.network.id}`);
    networkId = body.network.id;
    const pending = await run(item.loader, makeRequest(`${LIST}/${networkId}`, { bearer: tokens.editor }), { ...alpha, networkId });
    expect(pending.body).toMatchObject({ structure: null, structureStatus: "pending" });
    expect(await computePendingStructures(t.db)).toBe(1);
    const ready = await run(item.loader, makeRequest(`${LIST}/${networkId}`, { bearer: tokens.editor }), { ...alpha, networkId });
    expect(ready.body).toMatchObject({ structureStatus: "ready" });
    expect((ready.body as { structure: unknown }).structure).toEqual(JSON.parse(JSON.stringify(analyseStructure(parseNetworkCsv(CSV)))));
  });

  it("reads the network back with its structure, lists and reads versions (viewer token and cookie)", async () => {
    const params = { ...alpha, networkId };
    const got = await run(item.loader, makeRequest(`${LIST}/${networkId}`, { bearer: tokens.viewer }), params);
    expect(got.status).toBe(200);
    const body = got.body as { structure: { deficiency: number; species: string[]; conservationLaws: Record<string, number>[] }; version: { csv: string } };
    expect(body.structure.species).toEqual(["E", "S", "C", "P"]);
    expect(body.structure.deficiency).toBe(0);
    expect(body.version.csv).toBe(CSV);

    const list = await run(api.loader, makeRequest(LIST, { cookie: cookies.viewer }), alpha);
    expect(list.status).toBe(200);
    expect((list.body as { networks: { id: string; reactions: number; deficiency: number }[] }).networks).toEqual([
      expect.objectContaining({ id: networkId, reactions: 3, deficiency: 0, species: ["E", "S", "C", "P"] }),
    ]);

    const vs = await run(versions.loader, makeRequest(`${LIST}/${networkId}/versions`, { bearer: tokens.viewer }), params);
    expect((vs.body as { versions: { number: number }[] }).versions.map((v) => v.number)).toEqual([1]);
    const v1 = await run(version.loader, makeRequest(`${LIST}/${networkId}/versions/1`, { bearer: tokens.viewer }), { ...params, number: "1" });
    expect((v1.body as { version: { csv: string } }).version.csv).toBe(CSV);
    const v9 = await run(version.loader, makeRequest(`${LIST}/${networkId}/versions/9`, { bearer: tokens.viewer }), { ...params, number: "9" });
    expect(v9.status).toBe(404);
    expect((v9.body as { error: { code: string } }).error.code).toBe("not_found");
  });

  it("creates from a JSON body and from a text/csv body", async () => {
    const json = await run(api.action, makeRequest(LIST, { bearer: tokens.owner, json: { name: "Cycle", csv: "reaction\nA <-> B\nB <-> C\nC <-> A\n" } }), alpha);
    expect(json.status).toBe(201);
    await computePendingStructures(t.db);
    const cycleId = (json.body as { network: { id: string } }).network.id;
    const cycle = await run(item.loader, makeRequest(`${LIST}/${cycleId}`, { bearer: tokens.owner }), { ...alpha, networkId: cycleId });
    expect((cycle.body as { structure: { weaklyReversible: boolean } }).structure.weaklyReversible).toBe(true);
    const raw = new Request(new URL(`${LIST}?name=Decay`, APP_URL), { method: "POST", body: "reaction\nX -> 0\n", headers: { "Content-Type": "text/csv", Authorization: `Bearer ${tokens.editor}` } });
    const text = await run(api.action, raw, alpha);
    expect(text.status).toBe(201);
    expect((text.body as { network: { name: string } }).network.name).toBe("Decay");
  });

  it("refuses a file with problems, locating each in the details, and stores nothing", async () => {
    const before = await counts();
    const res = await run(api.action, upload(LIST, BAD, { name: "Broken" }, { bearer: tokens.editor }), alpha);
    expect(res.status).toBe(400);
    const error = (res.body as { error: { code: string; message: string; details: { problems: { row: number; column?: string; columnIndex?: number; message: string; expected?: string }[] } } }).error;
    expect(error.code).toBe("invalid_request");
    expect(error.details.problems.map((p) => [p.row, p.column, p.columnIndex])).toEqual([
      [3, "reaction", 1],
      [4, "rate", 2],
    ]);
    expect(error.details.problems.every((p) => p.expected)).toBe(true);
    const noName = await run(api.action, makeRequest(LIST, { bearer: tokens.editor, json: { csv: CSV } }), alpha);
    expect(noName.status).toBe(400);
    expect((noName.body as { error: { details: { fields: Record<string, string> } } }).error.details.fields.name).toBeTruthy();
    expect(await counts()).toBe(before);
  });

  it("adds versions, refusing identical content", async () => {
    const params = { ...alpha, networkId };
    const same = await run(versions.action, makeRequest(`${LIST}/${networkId}/versions`, { bearer: tokens.editor, json: { csv: CSV } }), params);
    expect(same.status).toBe(409);
    const next = CSV + "P -> 0,removal,kout2,,1\n";
    const added = await run(versions.action, makeRequest(`${LIST}/${networkId}/versions`, { bearer: tokens.editor, json: { csv: next, changeNote: "outflow" } }), params);
    expect(added.status).toBe(201);
    expect((added.body as { version: { number: number; contentHash: string } }).version).toMatchObject({ number: 2, contentHash: sha(next) });
  });

  it("refuses callers without the right role and changes nothing", async () => {
    const before = await counts();
    const params = { ...alpha, networkId };
    const cases: [string, Promise<{ status: number; body: unknown }>, number, string][] = [
      ["anonymous list", run(api.loader, makeRequest(LIST), alpha), 401, "unauthenticated"],
      ["bad token", run(api.loader, makeRequest(LIST, { bearer: "sp_not-a-token" }), alpha), 401, "invalid_token"],
      ["anonymous create", run(api.action, upload(LIST, CSV, { name: "X" }), alpha), 401, "unauthenticated"],
      ["viewer create", run(api.action, upload(LIST, CSV, { name: "X" }, { bearer: tokens.viewer }), alpha), 403, "forbidden"],
      ["viewer new version", run(versions.action, makeRequest(`${LIST}/${networkId}/versions`, { bearer: tokens.viewer, json: { csv: "reaction\nA -> B\n" } }), params), 403, "forbidden"],
      ["outsider list", run(api.loader, makeRequest(LIST, { bearer: tokens.outsider }), alpha), 404, "not_found"],
      ["outsider create", run(api.action, upload(LIST, CSV, { name: "X" }, { bearer: tokens.outsider }), alpha), 404, "not_found"],
      ["outsider read", run(item.loader, makeRequest(`${LIST}/${networkId}`, { bearer: tokens.outsider }), params), 404, "not_found"],
      // The network exists, but not in the outsider's own lab: same answer as a missing one.
      ["via other lab", run(item.loader, makeRequest(`/api/labs/beta/networks/${networkId}`, { bearer: tokens.outsider }), { labSlug: "beta", networkId }), 404, "not_found"],
      ["malformed id", run(item.loader, makeRequest(`${LIST}/nope`, { bearer: tokens.viewer }), { ...alpha, networkId: "nope" }), 404, "not_found"],
    ];
    for (const [label, outcome, status, code] of cases) {
      const res = await outcome;
      expect(res.status, label).toBe(status);
      expect((res.body as { error: { code: string } }).error.code, label).toBe(code);
    }
    expect(await counts()).toBe(before);
  });
});
