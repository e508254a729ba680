import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import type { BrowserContext, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, hasApp } from "./support/browser";
import { openSignedInBrowser } from "./accounts-helpers";

/**
 * Every plot's three exports in the browser, on a 2× screen: the scan's branches (with fold
 * points), the steady-state count and a time course of the one-species cubic switch
 * (dX/dt = k1 − 11X + 6X² − X³, as in folds.e2e.ts). The PNG must be the figure as shown
 * (on-screen size × devicePixelRatio), the SVG must carry the axis labels and the legend, the
 * CSV a header row and the plotted rows.
 */
const SHOTS = "test-results/chart-exports";
const LAB = "/labs/halvorsen-enzyme-lab";
const CUBIC = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\n0 <-> X,k1,k2,6,11\n2X <-> 3X,k3,k4,6,1\n";

/** Width and height from a PNG's IHDR chunk (ISO/IEC 15948, §11.2.2: bytes 16–23, big-endian). */
function pngSize(bytes: Buffer): { width: number; height: number } {
  expect([...bytes.subarray(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
  expect(bytes.subarray(12, 16).toString("latin1")).toBe("IHDR");
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

async function download(page: Page, figure: Locator, button: string): Promise<{ name: string; bytes: Buffer }> {
  const [d] = await Promise.all([page.waitForEvent("download"), figure.getByRole("button", { name: button, exact: true }).click()]);
  return { name: d.suggestedFilename(), bytes: readFileSync((await d.path())!) };
}

/** The three exports of one figure, checked against what the page shows. */
async function checkExports(page: Page, testId: string, expected: { file: string; axisLabels: string[]; legend: string[]; header: string }) {
  const figure = page.getByTestId(testId);
  const picture = page.getByTestId(`${testId}-picture`);
  await figure.scrollIntoViewIfNeeded();
  const box = (await picture.boundingBox())!;
  const dpr = await page.evaluate(() => window.devicePixelRatio);
  expect(dpr).toBe(2);

  const png = await download(page, figure, "Chart (PNG)");
  expect(png.name).toBe(`${expected.file}.png`);
  writeFileSync(`${SHOTS}/export-${expected.file}.png`, png.bytes); // to look at
  expect(pngSize(png.bytes)).toEqual({ width: Math.round(Math.round(box.width) * dpr), height: Math.round(Math.round(box.height) * dpr) });

  const svg = await download(page, figure, "Chart (SVG)");
  expect(svg.name).toBe(`${expected.file}.svg`);
  const text = svg.bytes.toString("utf8");
  expect(text).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
  const root = /^<svg[^>]*>/.exec(text)![0];
  expect(root).toContain(`width="${Math.round(box.width)}"`);
  expect(root).toContain(`height="${Math.round(box.height)}"`);
  expect(text).toContain("recharts-curve");
  const texts = [...text.matchAll(/<text[^>]*>([\s\S]*?)<\/text>/g)].map((m) => m[1]!.replace(/<[^>]+>/g, "").trim());
  for (const label of expected.axisLabels) expect(texts, `axis label ${label}`).toContain(label);
  for (const label of expected.legend) expect(texts, `legend ${label}`).toContain(label);
  // The on-screen legend shows the same entries the picture carries.
  expect(await figure.getByTestId("chart-legend").locator("li").allInnerTexts()).toEqual(expected.legend);

  const csv = await download(page, figure, "Data (CSV)");
  expect(csv.name).toBe(`${expected.file}.csv`);
  const lines = csv.bytes.toString("utf8").trim().split("\n");
  expect(lines[0]).toBe(expected.header);
  expect(lines.length).toBeGreaterThan(1);
  for (const line of lines.slice(1)) expect(line.split(",")).toHaveLength(expected.header.split(",").length);
  return lines.slice(1).map((l) => l.split(","));
}

describe.skipIf(!hasApp)("chart exports in headless chromium", () => {
  let editor: E2EBrowser;
  let hiDpi: BrowserContext;
  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    editor = await openSignedInBrowser("editor@halvorsen.test");
    hiDpi = await editor.browser.newContext({ baseURL: process.env.E2E_BASE_URL, viewport: { width: 1366, height: 900 }, deviceScaleFactor: 2, acceptDownloads: true, storageState: await editor.context.storageState() });
  }, 60_000);
  afterAll(async () => {
    await hiDpi?.close();
    await editor?.close();
  });

  it("exports the scan, count and time-course charts as CSV, SVG and PNG at the size shown", async () => {
    const created = await editor.context.request.post(`/api${LAB}/networks`, { data: { name: `Export switch ${Date.now().toString(36)}`, csv: CUBIC } });
    expect(created.status()).toBe(201);
    const { network } = (await created.json()) as { network: { id: string } };
    const page = await hiDpi.newPage();
    await page.goto(`${LAB}/networks/${network.id}`);
    await page.getByTestId("start-analysis").click();
    await page.getByLabel("Initial concentration of X", { exact: true }).fill("1");
    await page.getByRole("button", { name: "Start analysis" }).click();
    await expect.poll(() => page.getByTestId("status").first().innerText(), { timeout: 90_000, interval: 500 }).toBe("succeeded");

    const form = page.getByTestId("scan-form");
    await form.locator("select[name=parameterChoice]").selectOption("rate:k1");
    await form.locator("input[name=from]").fill("5");
    await form.locator("input[name=to]").fill("7");
    await form.locator("input[name=points]").fill("11");
    await form.locator("select[name=spacing]").selectOption("linear");
    await form.getByRole("button", { name: "Run scan" }).click();
    const chart = page.locator("[data-testid=scan-chart][data-exact=true]");
    await chart.waitFor({ timeout: 90_000 });
    await expect.poll(() => chart.getByTestId("fold-marker").count()).toBe(2);

    const branches = await checkExports(page, "scan-branches-figure", {
      file: "scan-k1-X",
      axisLabels: ["k1", "X"],
      legend: ["stable", "unstable", "fold point", "several positive steady states"],
      header: "k1,branch,stability,X",
    });
    expect(new Set(branches.map((r) => r[2]))).toEqual(new Set(["stable", "unstable"]));
    const counts = await checkExports(page, "scan-count-figure", {
      file: "scan-count-k1",
      axisLabels: ["k1", "count"],
      legend: ["number of positive steady states"],
      header: "k1 from,k1 to,positive steady states",
    });
    // One row per exact window the page lists (1, 3, 1 positive steady states).
    expect(counts).toHaveLength(await chart.getByTestId("scan-windows").locator("li").count());
    expect(counts.map((r) => r[2])).toEqual(["1", "3", "1"]);

    await page.getByTestId("timecourse-form").getByRole("button", { name: "Simulate" }).click();
    await page.getByTestId("time-course-figure").locator("path.recharts-curve").first().waitFor({ state: "attached", timeout: 60_000 });
    const course = await checkExports(page, "time-course-figure", {
      file: "time-course",
      axisLabels: ["time", "concentration"],
      legend: ["X", "stable steady state", "unstable steady state"],
      header: "time,X",
    });
    // The trajectory starts at the analysis' initial concentration X = 1.
    expect(course[0]).toEqual(["0", "1"]);
    await page.evaluate(() => document.fonts.ready);
    await page.screenshot({ path: `${SHOTS}/01-charts.png`, fullPage: true });
  }, 240_000);
});
