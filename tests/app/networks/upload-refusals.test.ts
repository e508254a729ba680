import { gzipSync } from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hasTestDatabase, type TestDatabase } from "../support/test-db";
import { APP_URL, makeLab, makeRequest, makeUser, run, sessionCookieFor, setUpAccountsDb, tearDownAccountsDb } from "../auth/fixtures";

/**
 * Uploads the network routes refuse, and how: an oversized file answers 413 (payload_too_large)
 * on the JSON API and on the new-network page alike; a binary file and a file in another encoding
 * answer 400 with ONE located problem; nothing is stored in any case.
 */
const LIST = "/api/labs/gamma/networks";
const gamma = { labSlug: "gamma" };
// Just over the 256 KB limit of a network file, yet under the server's 640 KiB body limit.
const OVERSIZED = "reaction,rate\n" + "Aaaa + Bbbb -> Cccc,k1\n".repeat(12_000);
type ErrorBody = { error: { code: string; message: string; details?: { problems?: { row: number; columnIndex?: number; column?: string; message: string }[] } } };

describe.skipIf(!hasTestDatabase)("refused network uploads", () => {
  let t: TestDatabase;
  let token = "";
  let cookie = "";
  let api: typeof import("~/routes/api/networks");
  let newPage: typeof import("~/routes/networks-new");
  const versionCount = async () => Number((await t.db.selectFrom("network_versions").select(({ fn }) => fn.countAll<string>().as("c")).executeTakeFirstOrThrow()).c);
  const upload = (name: string, bytes: Uint8Array<ArrayBuffer> | string, type = "text/csv") => {
    const form = new FormData();
    form.set("file", new File([bytes], name, { type }));
    form.set("name", "Upload");
    return new Request(new URL(LIST, APP_URL), { method: "POST", body: form, headers: { Authorization: `Bearer ${token}` } });
  };

  beforeAll(async () => {
    t = await setUpAccountsDb();
    const editor = await makeUser(t.db, "editor@refusals.test", "Editor");
    await makeLab(t.db, "gamma", "Gamma", [[editor.id, "owner"]]);
    const { createApiToken } = await import("~/account/api-tokens.server");
    const { db } = await import("~/db.server");
    token = (await createApiToken(db(), { userId: editor.id, name: "refusals", expiresAt: null })).token;
    cookie = await sessionCookieFor(editor.id);
    api = await import("~/routes/api/networks");
    newPage = await import("~/routes/networks-new");
  });
  afterAll(async () => tearDownAccountsDb(t));

  it("answers an oversized network 413 through JSON, a multipart file, a raw body and the new-network page", async () => {
    expect(new TextEncoder().encode(OVERSIZED).length).toBeGreaterThan(256 * 1024);
    const before = await versionCount();
    const json = await run(api.action, makeRequest(LIST, { bearer: token, json: { name: "Big", csv: OVERSIZED } }), gamma);
    expect(json.status).toBe(413);
    expect((json.body as ErrorBody).error).toMatchObject({ code: "payload_too_large", message: "The network file is larger than 256 KB." });

    const file = await run(api.action, upload("big.csv", OVERSIZED), gamma);
    expect(file.status).toBe(413);
    expect((file.body as ErrorBody).error.code).toBe("payload_too_large");

    const raw = new Request(new URL(`${LIST}?name=Big`, APP_URL), { method: "POST", body: OVERSIZED, headers: { "Content-Type": "text/csv", Authorization: `Bearer ${token}` } });
    expect((await run(api.action, raw, gamma)).status).toBe(413);

    const declared = new Request(new URL(LIST, APP_URL), { method: "POST", body: "{}", headers: { "Content-Type": "application/json", "Content-Length": String(2 * 1024 * 1024), Authorization: `Bearer ${token}` } });
    expect((await run(api.action, declared, gamma)).status).toBe(413);

    const page = await run(newPage.action, makeRequest("/labs/gamma/networks/new", { cookie, form: { name: "Big", csv: OVERSIZED } }), gamma);
    expect(page.status).toBe(413);
    expect(await versionCount()).toBe(before);
  });

  it("answers a binary file with one line naming the first binary byte, echoing none of it", async () => {
    const before = await versionCount();
    const gz: Uint8Array<ArrayBuffer> = new Uint8Array(gzipSync(Buffer.from("reaction,rate\n" + 'A -> B,"k1\n'.repeat(300))));
    const res = await run(api.action, upload("network.csv", gz), gamma);
    expect(res.status).toBe(400);
    const error = (res.body as ErrorBody).error;
    expect(error.message).toBe("network.csv: this is not a text file: binary content at byte 1 (0x1F, line 1); nothing was saved.");
    expect(error.details!.problems).toHaveLength(1);
    expect(JSON.stringify(res.body).length).toBeLessThan(600);
    expect(await versionCount()).toBe(before);
  });

  it("says which byte and line are not UTF-8 in a Latin-1 body", async () => {
    const latin1 = Buffer.concat([Buffer.from("reaction,label\nA -> B,Caf"), Buffer.from([0xe9]), Buffer.from("\n")]);
    const raw = new Request(new URL(`${LIST}?name=Latin`, APP_URL), { method: "POST", body: latin1, headers: { "Content-Type": "text/csv", Authorization: `Bearer ${token}` } });
    const res = await run(api.action, raw, gamma);
    expect(res.status).toBe(400);
    const error = (res.body as ErrorBody).error;
    expect(error.message).toMatch(/^The request body: the file is not UTF-8 text: byte 26 \(0xE9, line 2, character 11\) is not valid UTF-8/);
    expect(error.details!.problems).toEqual([expect.objectContaining({ row: 2, columnIndex: 11 })]);
  });

  it("names unknown columns instead of dropping their cells", async () => {
    const res = await run(api.action, makeRequest(LIST, { bearer: token, json: { name: "Columns", csv: "reaction,rate_constant\nA -> B,k1\n" } }), gamma);
    expect(res.status).toBe(400);
    expect((res.body as ErrorBody).error.details!.problems).toEqual([expect.objectContaining({ row: 1, columnIndex: 2, column: "rate_constant", message: "unknown column `rate_constant`" })]);
  });
});
