import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, baseUrl, hasApp, openBrowser } from "./support/browser";
import { signInWithCode } from "./accounts-helpers";

/**
 * Networks in the browser, as the demo lab's editor: upload a CSV with a mistake, see the row
 * marked, have the server refuse it too, fix it in the grid and save; upload a second version
 * and read the differences; sort the lab's table by deficiency; open the complex graph. The
 * demo viewer then sees the same network read-only. Screenshots go to test-results/networks/
 * (git-ignored) for a person to look at.
 */
const SHOTS = "test-results/networks";
const LAB = "/labs/halvorsen-enzyme-lab";

const FIRST_UPLOAD = [
  "# Bench notes: a transporter T carries the ligand L inside (invented example)",
  "reaction,label,rate,reverse_rate,rate_value",
  "T + L <-> TL,loading,kin,kout,2",
  "TL => T + Li,release,krel,,1/2",
  "Li -> 0,consumption,kuse,,1",
].join("\n");

const SECOND_UPLOAD = [
  "reaction,label,rate,reverse_rate,rate_value",
  "T + L <-> TL,loading,kin,kout,5/2",
  "TL -> T + Li,release,krel,,1/2",
  "Li -> 0,consumption,kuse,,1",
  "0 -> L,supply,ksup,,3",
].join("\n");

async function shot(page: Page, name: string) {
  await page.screenshot({ path: `${SHOTS}/${name}.png`, fullPage: true });
}

describe.skipIf(!hasApp)("networks in headless chromium", () => {
  let editor: E2EBrowser;
  let viewer: E2EBrowser;
  const name = `Ligand transport ${Date.now().toString(36)}`;
  let networkPath = "";
  const consoleErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    editor = await openBrowser();
    viewer = await openBrowser();
    // Hydration mismatches and client exceptions show up here.
    for (const b of [editor, viewer]) b.context.on("console", (m) => void (m.type() === "error" && consoleErrors.push(m.text())));
    const { page } = await editor.page("/sign-in");
    await signInWithCode(page, "editor@halvorsen.test");
    await page.close();
  });
  afterAll(async () => {
    await editor?.close();
    await viewer?.close();
  });

  it("uploads a CSV with an error, marks the row, refuses it on the server, then saves the fixed grid", async () => {
    const { page } = await editor.page(`${LAB}/networks/new`);
    await page.getByLabel("Name").fill(name);
    await page.getByLabel(/^Tags/).fill("transport, e2e");
    await page.getByTestId("file-input").setInputFiles({ name: "transport.csv", mimeType: "text/csv", buffer: Buffer.from(FIRST_UPLOAD) });

    const rows = page.getByTestId("grid-row");
    await expect.poll(() => rows.count()).toBe(3);
    expect(await rows.nth(1).getAttribute("data-invalid")).toBe("true");
    expect(await rows.nth(0).getAttribute("data-invalid")).toBe("false");
    expect(await page.getByTestId("row-problems").first().innerText()).toMatch(/reaction/i);
    // The file's own line numbers: the comment is line 1, the header line 2, the bad row line 4.
    expect(await page.getByTestId("file-problems").innerText()).toMatch(/line 4/);
    await shot(page, "01-upload-with-error");

    // The server is the authority: saving anyway is refused, and the edits stay.
    await page.getByRole("button", { name: "Save network" }).click();
    await page.getByTestId("save-error").waitFor();
    expect(await page.getByTestId("save-error").innerText()).toMatch(/problem/);
    expect(await page.getByLabel("Name").inputValue()).toBe(name);
    expect(await page.getByTestId("grid-row").nth(1).getAttribute("data-invalid")).toBe("true");
    await shot(page, "02-server-refused");

    await page.getByLabel("Reaction, row 2").fill("TL -> T + Li");
    await expect.poll(() => page.getByTestId("grid-status").innerText()).toMatch(/Looks valid/);
    expect(await page.getByTestId("grid-row").nth(1).getAttribute("data-invalid")).toBe("false");
    await page.getByLabel(/^Change note/).fill("From the bench notes, arrow fixed.");
    await page.getByRole("button", { name: "Save network" }).click();
    // The saved network's page, by its content: client navigation changes the URL before it renders.
    await page.getByTestId("stat-species").waitFor();
    networkPath = new URL(page.url()).pathname;
    expect(networkPath).toMatch(/\/networks\/[0-9a-f-]{36}$/);
    expect(await page.getByTestId("network-name").innerText()).toContain(name);
    expect(await page.getByTestId("stat-species").innerText()).toBe("4");
    expect(await page.getByTestId("stat-reactions").innerText()).toBe("4");
    expect(await page.getByTestId("conservation-laws").innerText()).toContain("T + TL = total");
    expect(await page.locator("[data-testid=odes] .katex-display").count()).toBe(1);
    expect(await page.getByTestId("ode-text").allTextContents()).toContain("dLi/dt = krel·TL - kuse·Li");
    await shot(page, "03-saved-network-page");
    await page.screenshot({ path: `${SHOTS}/03b-network-page-top.png` });
    await page.locator("#odes").screenshot({ path: `${SHOTS}/03c-odes.png` });
    await page.locator("#stoichiometric-matrix").screenshot({ path: `${SHOTS}/03d-matrix.png` });
    await page.locator("#deficiency-zero").screenshot({ path: `${SHOTS}/03e-deficiency-zero.png` });
    await page.locator("#conservation").screenshot({ path: `${SHOTS}/03f-conservation.png` });
    expect(await page.getByTestId("deficiency-zero").innerText()).toMatch(/no positive steady state[\s\S]*Every rate constant is positive/);
  });

  it("uploads a second version and shows what changed", async () => {
    const { page } = await editor.page(`${networkPath}/edit`);
    // Dropped onto the drop zone this time, as a person dragging the file from their desktop.
    const transfer = await page.evaluateHandle((text) => {
      const dt = new DataTransfer();
      dt.items.add(new File([text], "transport-v2.csv", { type: "text/csv" }));
      return dt;
    }, SECOND_UPLOAD);
    await page.getByTestId("drop-zone").dispatchEvent("drop", { dataTransfer: transfer });
    await expect.poll(() => page.getByTestId("grid-row").count()).toBe(4);
    await expect.poll(() => page.getByTestId("grid-status").innerText()).toMatch(/Looks valid/);
    await page.getByLabel(/^Change note/).fill("Ligand supply added; faster loading.");
    await page.getByRole("button", { name: "Save as new version" }).click();
    await page.getByTestId("reactions-added").waitFor();
    expect(page.url()).toMatch(/\/versions\?from=1&to=2$/);
    expect(await page.getByTestId("reactions-added").innerText()).toContain("0 → L");
    expect(await page.getByTestId("reactions-changed").innerText()).toContain("rate value 2 → 5/2");
    expect(await page.getByTestId("reactions-removed").count()).toBe(0);
    await shot(page, "04-version-diff");
  });

  it("sorts the lab's network table by deficiency", async () => {
    const { page } = await editor.page(`${LAB}/networks`);
    const deficiencies = async () => (await page.locator("[data-testid=network-row] td:nth-child(4)").allInnerTexts()).map(Number);
    expect((await deficiencies()).length).toBeGreaterThanOrEqual(4);
    await page.getByRole("button", { name: /Deficiency/ }).click();
    const first = await deficiencies();
    const ascending = [...first].sort((a, b) => a - b);
    const descending = [...ascending].reverse();
    expect([JSON.stringify(ascending), JSON.stringify(descending)]).toContain(JSON.stringify(first));
    await page.getByRole("button", { name: /Deficiency/ }).click();
    const second = await deficiencies();
    expect(second).toEqual([...first].reverse());
    expect(new Set(first).size).toBeGreaterThan(1);
    await shot(page, "05-table-sorted-by-deficiency");
    // Search by species: networks with a species named like `Li` stay, the demo enzyme network goes.
    await page.getByLabel("Has a species named").fill("Li");
    await expect.poll(() => page.getByTestId("network-row").filter({ hasText: "Invertase" }).count()).toBe(0);
    expect(await page.getByTestId("network-row").filter({ hasText: name }).count()).toBe(1);
  });

  it("opens the complex graph drawing", async () => {
    const { page, requests } = await editor.page(networkPath);
    // KaTeX's fonts come from our own server (bundled from node_modules), never a CDN.
    expect(requests.filter((u) => !u.startsWith(baseUrl))).toEqual([]);
    expect(requests.some((u) => /KaTeX_Main-Regular.*\.woff2$/.test(u))).toBe(true);
    expect(await page.evaluate(() => document.fonts.check("16px KaTeX_Main"))).toBe(true);
    const graph = page.getByTestId("complex-graph");
    await graph.scrollIntoViewIfNeeded();
    // Version 2: complexes T + L, TL, T + Li, Li, 0 and L; one or more linkage classes, each framed.
    expect(await graph.getByTestId("complex-node").count()).toBe(6);
    expect(await graph.getByTestId("linkage-class-frame").count()).toBe(Number(await page.getByTestId("stat-linkage").innerText()));
    await graph.screenshot({ path: `${SHOTS}/06-complex-graph.png` });
  });

  it("draws a network of 38 complexes readably (created through the JSON API with the session cookie)", async () => {
    // Invented nine-site modification chain: a kinase K adds, a phosphatase F removes, one site at a time.
    const rows = ["reaction,rate,reverse_rate"];
    for (let i = 0; i < 9; i++) rows.push(`S${i} + K <-> S${i}K,a${i},d${i}`, `S${i}K -> S${i + 1} + K,c${i},`);
    for (let i = 1; i <= 9; i++) rows.push(`S${i} + F <-> S${i}F,e${i},f${i}`, `S${i}F -> S${i - 1} + F,g${i},`);
    const created = await editor.context.request.post(`/api${LAB}/networks`, { data: { name: `Nine-site chain ${Date.now().toString(36)}`, csv: rows.join("\n") + "\n" } });
    expect(created.status()).toBe(201);
    const body = (await created.json()) as { network: { id: string } };
    // The worker computes the structure; the API says "pending" until then.
    let structure: { complexes: string[] } | null = null;
    for (let i = 0; i < 60 && !structure; i++) {
      const read = (await (await editor.context.request.get(`/api${LAB}/networks/${body.network.id}`)).json()) as { structure: { complexes: string[] } | null; structureStatus: string };
      expect(["pending", "ready"]).toContain(read.structureStatus);
      structure = read.structure;
      if (!structure) await new Promise((r) => setTimeout(r, 250));
    }
    expect(structure?.complexes).toHaveLength(38);
    const { page } = await editor.page(`${LAB}/networks/${body.network.id}`);
    const graph = page.getByTestId("complex-graph");
    await graph.scrollIntoViewIfNeeded();
    expect(await graph.getByTestId("complex-node").count()).toBe(38);
    const boxes = await graph.getByTestId("complex-node").evaluateAll((nodes) => nodes.map((n) => (n as SVGGElement).getBoundingClientRect()).map((r) => ({ x: r.x, y: r.y, w: r.width, h: r.height })));
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        const [a, b] = [boxes[i]!, boxes[j]!];
        const apart = a.x + a.w <= b.x || b.x + b.w <= a.x || a.y + a.h <= b.y || b.y + b.h <= a.y;
        expect(apart, `complexes ${i} and ${j} overlap`).toBe(true);
      }
    }
    // Boxes keep a legible size (not shrunk to fit): at least 20 px tall on screen.
    expect(Math.min(...boxes.map((b) => b.h))).toBeGreaterThanOrEqual(20);
    await graph.screenshot({ path: `${SHOTS}/07-complex-graph-38-complexes.png` });
  });

  it("starts a new network from a demo and edits the grid (add, reorder, remove)", async () => {
    const { page } = await editor.page(`${LAB}/networks/new`);
    await page.getByRole("button", { name: "Three-state channel" }).click();
    const rows = page.getByTestId("grid-row");
    await expect.poll(() => rows.count()).toBe(3);
    await expect.poll(() => page.getByTestId("grid-status").innerText()).toMatch(/Looks valid: 3 rows/);
    await page.getByRole("button", { name: "+ Add a reaction" }).click();
    await page.getByLabel("Reaction, row 4").fill("Open -> Gone");
    await page.getByRole("button", { name: "Move row 4 up" }).click();
    expect(await page.getByLabel("Reaction, row 3").inputValue()).toBe("Open -> Gone");
    await page.getByRole("button", { name: "Remove row 1" }).click();
    await expect.poll(() => rows.count()).toBe(3);
    expect(await page.getByLabel("Reaction, row 2").inputValue()).toBe("Open -> Gone");
    await shot(page, "08-demo-in-grid");
  });

  it("shows the network read-only to the lab's viewer", async () => {
    const { page } = await viewer.page("/sign-in");
    await signInWithCode(page, "viewer@halvorsen.test");
    await page.goto(networkPath, { waitUntil: "networkidle" });
    expect(await page.getByTestId("network-name").innerText()).toContain(name);
    expect(await page.getByRole("link", { name: "Edit as new version" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Save details" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: /restore/i }).count()).toBe(0);
    await page.screenshot({ path: `${SHOTS}/09-viewer-read-only.png` });
    const edit = await page.goto(`${networkPath}/edit`);
    expect(edit?.status()).toBe(403);
  });

  it("logged no errors in the browser console", () => {
    // A refused save answers 400 and a viewer's edit page 403; the browser logs those loads.
    expect(consoleErrors.filter((e) => !/status of (400|403)/.test(e))).toEqual([]);
  });
});
