import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, hasApp, openBrowser } from "./support/browser";
import { signInWithCode } from "./accounts-helpers";

/**
 * First use, as a brand-new address: sign in with the e-mailed code, find the first-steps panel
 * on the labs page, open the public worked examples (read only, as a guest), read an example
 * network's verdict card, then copy the examples into a lab of one's own where analyses can be
 * started. Screenshots at 1366 and 390 px go to test-results/first-steps/ (git-ignored).
 */
const SHOTS = "test-results/first-steps";

/** Full page, plus the first screenful alone (easier to read), at a desktop and a phone width. */
async function shotAt(page: Page, name: string) {
  for (const width of [1366, 390]) {
    await page.setViewportSize({ width, height: 900 });
    await page.screenshot({ path: `${SHOTS}/${name}-${width}.png`, fullPage: true });
    await page.screenshot({ path: `${SHOTS}/${name}-${width}-top.png` });
  }
  await page.setViewportSize({ width: 1280, height: 900 });
}

/** Elements (by test id or tag and class) whose right edge passes the viewport: empty when the page fits. */
async function overflowing(page: Page, within: string): Promise<string[]> {
  return page.locator(within).evaluateAll((roots) => {
    const out: string[] = [];
    const width = document.documentElement.clientWidth;
    for (const root of roots)
      for (const el of [root, ...root.querySelectorAll("*")]) {
        // Scroll boxes may hold wide tables and formulas; what they clip does not widen the page.
        if (el.closest("[class*=overflow-x-auto]") && el !== el.closest("[class*=overflow-x-auto]")) continue;
        const r = el.getBoundingClientRect();
        if (r.width > 0 && r.right > width + 1) out.push(`${el.tagName.toLowerCase()}.${(el.getAttribute("class") ?? "").split(" ").slice(0, 3).join(".")} → ${Math.round(r.right)}`);
      }
    return out.slice(0, 20);
  });
}

describe.skipIf(!hasApp)("first steps for a new address", () => {
  let b: E2EBrowser;
  const email = `newcomer-${Date.now().toString(36)}@e2e.test`;

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    b = await openBrowser();
  });
  afterAll(async () => b?.close());

  it("a new address lands on the labs page with the first steps and the worked examples", async () => {
    const { page } = await b.page("/sign-in");
    await signInWithCode(page, email, "Nadia Newcomer");
    await page.getByTestId("first-steps").waitFor();
    const steps = await page.getByTestId("first-steps").innerText();
    expect(steps).toMatch(/Read a worked example[\s\S]*Upload a network[\s\S]*Run a steady-state analysis[\s\S]*Share it/);
    expect(await page.getByTestId("public-labs").innerText()).toContain("Worked examples");
    await shotAt(page, "01-labs-first-steps");
  });

  it("follows the first step to an example network with its verdict and evidence, read only", async () => {
    const { page } = await b.page("/labs");
    await page.getByTestId("first-steps-examples").click();
    await page.getByTestId("guest-notice").waitFor();
    await page.getByRole("link", { name: "Invertase binding and turnover" }).click();
    await page.getByTestId("verdict-card").waitFor();
    expect(await page.getByTestId("network-name").innerText()).toContain("Invertase binding and turnover");
    expect(await page.getByTestId("verdict-steady-states-statement").innerText()).toBe("None: every positive state keeps changing.");
    expect(await page.getByTestId("verdict-assumptions").innerText()).toMatch(/Mass-action kinetics[\s\S]*Positive concentrations only/);
    expect(Number(await page.getByTestId("stat-species").innerText())).toBeGreaterThan(1);
    expect(await page.getByTestId("reactions-table").locator("tbody tr").count()).toBeGreaterThan(0);
    expect(await page.getByTestId("version-line").innerText()).toContain("worked example");
    expect(await page.getByRole("link", { name: "Edit as new version" }).count()).toBe(0);
    expect(await page.getByTestId("start-analysis").count()).toBe(0);
    await shotAt(page, "02-example-network");
    await page.setViewportSize({ width: 390, height: 900 });
    await page.getByTestId("verdict-card").screenshot({ path: `${SHOTS}/02-verdict-card-390.png` });
    // The verdict card and the evidence fit a phone (wide tables scroll inside their own boxes).
    expect(await overflowing(page, "[data-testid=verdict-card], [data-testid=structure]")).toEqual([]);
    console.log("[first-steps] wider than 390 px elsewhere on the page:", await overflowing(page, "body"));
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  it("copies the examples into a lab of one's own, where analyses can start", async () => {
    const { page } = await b.page("/labs/worked-examples/networks");
    await page.getByTestId("guest-notice").getByTestId("copy-examples").click();
    await page.waitForURL((u) => /^\/labs\/(?!worked-examples)[^/]+\/networks$/.test(u.pathname));
    await page.getByRole("link", { name: "Invertase binding and turnover" }).waitFor();
    expect(await page.getByTestId("network-row").count()).toBe(3);
    await page.getByRole("link", { name: "Invertase binding and turnover" }).click();
    await page.getByTestId("start-analysis").waitFor();
    expect(await page.getByTestId("version-line").innerText()).toMatch(/Version 1 of 1 · Nadia Newcomer[\s\S]*Copied from Worked examples/);
    // The panel is gone once the person has networks of their own.
    await page.goto("/labs", { waitUntil: "networkidle" });
    await page.getByTestId("lab-list").waitFor();
    expect(await page.getByTestId("first-steps").count()).toBe(0);
    expect(await page.getByTestId("lab-list").innerText()).toContain("Nadia Newcomer’s lab");
  });

  it("in one's own lab, the switch's verdict is open until an analysis, then shows its count and witness", async () => {
    const { page } = await b.page("/networks");
    await page.getByRole("link", { name: "Autocatalytic switch" }).click();
    await page.getByTestId("verdict-card").waitFor();
    expect(await page.getByTestId("verdict-steady-states-statement").innerText()).toBe("Not decided by the structure.");
    expect(await page.getByTestId("verdict-steady-states").getByRole("link", { name: /Start an analysis/ }).count()).toBe(1);
    const networkUrl = page.url();
    await page.getByTestId("start-analysis").click();
    await page.waitForURL(/\/analyse/);
    await page.getByLabel("Initial concentration of X", { exact: true }).fill("1");
    await page.getByRole("button", { name: "Start analysis" }).click();
    await page.waitForURL(/\/analyses\/[0-9a-f-]{36}$/);
    await page.getByTestId("steady-states").waitFor({ timeout: 90_000 });
    await page.goto(networkUrl, { waitUntil: "networkidle" });
    await page.getByTestId("verdict-card").waitFor();
    expect(await page.getByTestId("verdict-steady-states-statement").innerText()).toBe("3 positive steady states in this class: 2 stable, 1 unstable.");
    expect(await page.getByTestId("verdict-multistationarity-statement").innerText()).toBe("Yes: some positive rate constants give two or more in one class.");
    expect(await page.getByTestId("verdict-assumptions").innerText()).toContain("Held constant: A, B");
    await shotAt(page, "03-switch-after-analysis");
  });
});
