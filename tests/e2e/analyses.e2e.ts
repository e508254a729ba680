import { execFile } from "node:child_process";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { promisify } from "node:util";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, baseUrl, hasApp, openBrowser } from "./support/browser";
import { signInWithCode } from "./accounts-helpers";

/**
 * Analyses in the browser, as the demo lab's editor: open the demo kinase–phosphatase cycle, start
 * a numeric analysis, watch it finish, compare its numbers with the CLI, sort the parametrisation
 * table, run a scan and see the plot, run two relation tests; then the owner makes a share link
 * that a signed-out browser opens. Screenshots go to test-results/analyses/ (git-ignored).
 */
const SHOTS = "test-results/analyses";
const LAB = "/labs/halvorsen-enzyme-lab";
// Version 2 of the seed's "Kinase–phosphatase cycle" (seeds/demo-data.ts), written out for the CLI.
const CYCLE_CSV = [
  "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value",
  "S0 + K <-> S0K,kinase binding,a1,d1,1,1/2",
  "S0K -> S1 + K,phosphorylation,c1,,2,",
  "S1 + F <-> S1F,phosphatase binding,a2,d2,1,1",
  "S1F -> S0 + F,dephosphorylation,c2,,3/2,",
  "",
].join("\n");

async function shot(page: Page, name: string) {
  // KaTeX's fonts block text until loaded; wait so the screenshot shows the formulas.
  await page.evaluate(() => document.fonts.ready);
  await page.screenshot({ path: `${SHOTS}/${name}.png`, fullPage: true });
}

describe.skipIf(!hasApp)("analyses in headless chromium", () => {
  let editor: E2EBrowser;
  let owner: E2EBrowser;
  let stranger: E2EBrowser;
  let analysisUrl = "";
  const consoleErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    editor = await openBrowser();
    owner = await openBrowser();
    stranger = await openBrowser();
    for (const b of [editor, owner, stranger]) b.context.on("console", (m) => void (m.type() === "error" && consoleErrors.push(m.text())));
    const { page } = await editor.page("/sign-in");
    await signInWithCode(page, "editor@halvorsen.test");
    await page.close();
  }, 60_000);
  afterAll(async () => {
    await editor?.close();
    await owner?.close();
    await stranger?.close();
  });

  it("starts a numeric analysis from a demo network and shows the CLI's numbers when it finishes", async () => {
    const { page } = await editor.page(`${LAB}/networks`);
    await page.getByRole("link", { name: "Kinase–phosphatase cycle" }).click();
    await page.getByTestId("start-analysis").click();
    await page.getByRole("button", { name: "Start analysis", exact: true }).waitFor();
    await expect.poll(() => page.getByTestId("order-item").count()).toBe(6);
    // Reorder with the buttons: move the second species up.
    const nameAt = async (i: number) => (await page.getByTestId("order-item").nth(i).innerText()).split("\n")[1];
    const second = await nameAt(1);
    await page.getByRole("button", { name: /^Move .* up$/ }).nth(1).click();
    expect(await nameAt(0)).toBe(second);
    await page.getByRole("button", { name: "Back to the suggested order" }).click();
    await page.getByLabel("Initial concentration of S0", { exact: true }).fill("1");
    await page.getByLabel("Initial concentration of K", { exact: true }).fill("1/10");
    await page.getByLabel("Initial concentration of F", { exact: true }).fill("1/10");
    await shot(page, "01-new-analysis");
    await page.getByRole("button", { name: "Start analysis" }).click();
    // The analysis page by its content (client navigation changes the URL before it renders).
    await page.getByTestId("settings").waitFor();
    analysisUrl = new URL(page.url()).pathname;
    expect(analysisUrl).toMatch(/\/analyses\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.getByTestId("status").first().innerText(), { timeout: 90_000, interval: 500 }).toBe("succeeded");
    await page.getByTestId("steady-states").waitFor();
    await shot(page, "02-finished");

    writeFileSync(`${SHOTS}/cycle.csv`, CYCLE_CSV);
    const { stdout } = await promisify(execFile)("npx", ["tsx", "domain/cli/main.ts", "analyse", `${SHOTS}/cycle.csv`, "--initial", "S0=1,K=1/10,F=1/10", "--json"]);
    const cli = JSON.parse(stdout) as { steadyStates: { concentrations: Record<string, number>; verdict: string }[] };
    const rows = page.getByTestId("steady-state-row");
    expect(await rows.count()).toBe(cli.steadyStates.length);
    for (const [species, value] of Object.entries(cli.steadyStates[0]!.concentrations)) {
      expect(await rows.nth(0).getByTestId(`conc-${species}`).innerText()).toBe(value.toPrecision(12));
    }
    expect(await rows.nth(0).innerText()).toContain(cli.steadyStates[0]!.verdict);
    // The result opens with its answer, before the evidence.
    const n = cli.steadyStates.length;
    expect(await page.getByTestId("answer-headline").innerText()).toMatch(new RegExp(`^${n} positive steady states? in this class: `));
    expect(await page.getByTestId("assumptions").innerText()).toMatch(/Mass-action/);
    expect(await page.getByTestId("pinned").innerText()).toMatch(/version 2 · engine /);
  }, 120_000);

  it("sorts the parametrisation table", async () => {
    const { page } = await editor.page(analysisUrl);
    const species = async () => (await page.getByTestId("parametrisation-row").allInnerTexts()).map((t) => t.split(/\s/)[0]!);
    const before = await species();
    expect(before.length).toBeGreaterThan(1);
    const header = page.getByTestId("parametrisation-table").getByRole("button", { name: /Species/ });
    await header.click();
    const asc = await species();
    expect(asc).toEqual([...before].sort());
    await header.click();
    expect(await species()).toEqual([...asc].reverse());
    await shot(page, "03-sorted-parametrisation");
  }, 60_000);

  it("runs a scan as a job and shows the plot with the steady-state count", async () => {
    const { page } = await editor.page(analysisUrl);
    const form = page.getByTestId("scan-form");
    await form.locator("select[name=parameterChoice]").selectOption("rate:c1");
    await form.locator("input[name=from]").fill("0.5");
    await form.locator("input[name=to]").fill("8");
    await form.locator("input[name=points]").fill("8");
    await form.getByRole("button", { name: "Run scan" }).click();
    const chart = page.getByTestId("scan-chart");
    await chart.waitFor({ timeout: 90_000 });
    await expect.poll(() => chart.locator("path.recharts-curve").count()).toBeGreaterThan(0);
    const csvHref = await chart.getByRole("link", { name: "All steady states, every species (CSV)" }).getAttribute("href");
    expect(csvHref).toMatch(/\/export\/scan-[0-9a-f-]{36}\.csv$/);
    const csv = await (await page.request.get(csvHref!)).text();
    expect(csv.split("\n")[0]).toBe("c1,state,count,verdict,S0,K,S0K,S1,F,S1F");
    expect(csv.trim().split("\n")).toHaveLength(9);
    const [download] = await Promise.all([page.waitForEvent("download"), chart.getByTestId("scan-branches-figure").getByRole("button", { name: "Chart (SVG)" }).click()]);
    expect(download.suggestedFilename()).toBe("scan-c1-S0.svg");
    const svg = readFileSync((await download.path())!, "utf8");
    expect(svg).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(svg).toContain("recharts-curve");
    const [png] = await Promise.all([page.waitForEvent("download"), chart.getByTestId("scan-branches-figure").getByRole("button", { name: "Chart (PNG)" }).click()]);
    expect(png.suggestedFilename()).toBe("scan-c1-S0.png");
    const pngBytes = readFileSync((await png.path())!);
    // PNG signature (ISO/IEC 15948, §5.2) and a non-trivial image.
    expect([...pngBytes.subarray(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    expect(pngBytes.length).toBeGreaterThan(2000);
    await chart.scrollIntoViewIfNeeded();
    await shot(page, "04-scan");
    // Time course from the same initial concentrations, with the steady state overlaid.
    await page.getByTestId("timecourse-form").getByRole("button", { name: "Simulate" }).click();
    const course = page.getByTestId("time-course-chart");
    await course.waitFor({ timeout: 60_000 });
    await expect.poll(() => course.locator("path.recharts-curve").count()).toBe(6);
    await course.scrollIntoViewIfNeeded();
    await shot(page, "04b-time-course");
  }, 120_000);

  it("runs relation tests with exact verdicts", async () => {
    const { page } = await editor.page(analysisUrl);
    const form = page.getByTestId("relation-form");
    await form.locator("input[name=expression]").fill("5*S0K - 2*S0*K");
    await form.getByRole("button", { name: "Test" }).click();
    await page.getByTestId("relation-verdict").first().waitFor({ timeout: 60_000 });
    await form.locator("input[name=expression]").fill("S0 - K");
    await form.getByRole("button", { name: "Test" }).click();
    await expect.poll(() => page.getByTestId("relation-verdict").count(), { timeout: 60_000 }).toBe(2);
    const verdicts = await page.getByTestId("relation-verdict").allInnerTexts();
    // Newest first: S0 - K is not implied (remainder S0 - K); 5 S0K - 2 S0 K is (the parametrisation says S0K = 2/5 S0 K).
    expect(verdicts[0]).toMatch(/does not hold .* remainder S0 - K/);
    expect(verdicts[1]).toMatch(/holds at every positive steady state/);
    await page.getByTestId("relation-verdict").first().scrollIntoViewIfNeeded();
    await shot(page, "05-relations");
  }, 120_000);

  it("compares a symbolic analysis of the same version side by side with the numeric one", async () => {
    const { page } = await editor.page(analysisUrl);
    await page.getByRole("link", { name: "new analysis of this version" }).click();
    await page.getByRole("button", { name: "Start analysis", exact: true }).waitFor();
    await page.getByLabel("all symbolic").check();
    await page.getByRole("button", { name: "Start analysis" }).click();
    await page.getByTestId("settings").waitFor();
    expect(page.url()).toMatch(/\/analyses\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.getByTestId("status").first().innerText(), { timeout: 90_000, interval: 500 }).toBe("succeeded");
    expect(await page.getByTestId("settings").innerText()).toMatch(/Rate constants: symbolic/);
    const first = analysisUrl.split("/").pop()!;
    await page.getByTestId("compare-form").locator("select").selectOption([first]);
    await page.getByRole("button", { name: "Compare" }).click();
    const columns = page.getByTestId("compare-column");
    // The URL changes before the comparison renders: wait for its columns.
    await expect.poll(() => columns.count()).toBe(2);
    // Oldest first: the numeric run was started before the symbolic one.
    expect(await columns.nth(0).innerText()).toMatch(/numeric rates/);
    expect(await columns.nth(1).innerText()).toMatch(/symbolic rates/);
    await shot(page, "05b-compare");
  }, 120_000);

  it("lets the owner share the analysis read-only with a link that works signed out", async () => {
    const { page: signIn } = await owner.page("/sign-in");
    await signInWithCode(signIn, "owner@halvorsen.test");
    await signIn.close();
    const { page } = await owner.page(analysisUrl);
    const starter = /Started by (.+?) on /.exec(await page.locator("header").last().innerText())?.[1];
    expect(starter).toBeTruthy();
    await page.getByRole("button", { name: "Create read-only link" }).click();
    const link = page.getByTestId("share-url");
    await link.waitFor();
    const url = await link.innerText();
    expect(url).toMatch(/\/share\/[A-Za-z0-9_-]{40,}$/);
    const { page: shared, status } = await stranger.page(new URL(url).pathname);
    expect(status).toBe(200);
    await shared.getByTestId("shared-banner").waitFor();
    expect(await shared.getByTestId("steady-state-row").count()).toBe(1);
    expect(await shared.getByTestId("relation-form").count()).toBe(0);
    expect(await shared.getByTestId("scan-chart").count()).toBe(1);
    // The reactions and rate values analysed are part of the shared copy.
    expect(await shared.getByTestId("analysed-reaction").count()).toBe(6);
    expect(await shared.getByTestId("rate-value-r3").innerText()).toBe("2");
    // No member names leave the lab through a share link.
    expect(await shared.locator("main").innerText()).not.toContain(starter!);
    await shot(shared, "06-shared-signed-out");
    // The lab's own page stays closed to the signed-out browser.
    const { page: closed } = await stranger.page(analysisUrl);
    expect(new URL(closed.url()).pathname).toBe("/sign-in");
    expect(consoleErrors.filter((e) => !/favicon/.test(e))).toEqual([]);
    void baseUrl;
  }, 120_000);
});
