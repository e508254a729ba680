import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, hasApp } from "./support/browser";
import { openSignedInBrowser } from "./accounts-helpers";

/**
 * A scan through a bistable window in the browser: the one-species cubic switch
 * dX/dt = k1 − 11X + 6X² − X³ has three positive steady states exactly for 6 − 2√3/9 < k1 < 6 + 2√3/9
 * (hand computation from the discriminant −(27k1² − 324k1 + 968)). The editor uploads it, runs a
 * numeric analysis (which also gives the multistationarity verdict), scans k1 from 5 to 7 and checks
 * the fold points, the fold markers and the drawn branches (solid stable, dashed unstable).
 */
const SHOTS = "test-results/folds";
const LAB = "/labs/halvorsen-enzyme-lab";
const CUBIC = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\n0 <-> X,k1,k2,6,11\n2X <-> 3X,k3,k4,6,1\n";

async function shot(page: Page, name: string) {
  await page.evaluate(() => document.fonts.ready);
  await page.screenshot({ path: `${SHOTS}/${name}.png`, fullPage: true });
}

describe.skipIf(!hasApp)("exact fold points of a scan in headless chromium", () => {
  let editor: E2EBrowser;
  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    editor = await openSignedInBrowser("editor@halvorsen.test");
  }, 60_000);
  afterAll(async () => {
    await editor?.close();
  });

  it("scans k1 through the bistable window and draws branches joined at two marked fold points", async () => {
    const created = await editor.context.request.post(`/api${LAB}/networks`, { data: { name: `Cubic switch ${Date.now().toString(36)}`, csv: CUBIC } });
    expect(created.status()).toBe(201);
    const body = (await created.json()) as { network: { id: string } };
    const { page } = await editor.page(`${LAB}/networks/${body.network.id}`);
    await page.getByTestId("start-analysis").click();
    await page.getByLabel("Initial concentration of X", { exact: true }).fill("1");
    await page.getByRole("button", { name: "Start analysis" }).click();
    await expect.poll(() => page.getByTestId("status").first().innerText(), { timeout: 90_000, interval: 500 }).toBe("succeeded");
    await page.getByTestId("multistationarity").waitFor();
    expect(await page.getByTestId("multistationarity-verdict").innerText()).toBe("multistationary");
    expect(await page.getByTestId("multistationarity-witness").innerText()).toMatch(/k1 = /);
    expect(await page.getByTestId("multistationarity-assumptions").innerText()).toMatch(/Mass-action[\s\S]*some positive rate constants/);

    const form = page.getByTestId("scan-form");
    await form.locator("select[name=parameterChoice]").selectOption("rate:k1");
    await form.locator("input[name=from]").fill("5");
    await form.locator("input[name=to]").fill("7");
    await form.locator("input[name=points]").fill("11");
    await form.locator("select[name=spacing]").selectOption("linear");
    await form.getByRole("button", { name: "Run scan" }).click();
    const chart = page.locator("[data-testid=scan-chart][data-exact=true]");
    await chart.waitFor({ timeout: 90_000 });
    await expect.poll(() => chart.getByTestId("fold-point").count()).toBe(2);
    const folds = await chart.getByTestId("fold-point").allInnerTexts();
    expect(folds[0]).toContain("k1 = 5.615099821");
    expect(folds[1]).toContain("k1 = 6.384900179");
    expect(await chart.getByTestId("multistable").innerText()).toContain("3 positive steady states for 5.615099821 < k1 < 6.384900179");
    expect(await chart.locator("[data-testid=fold-marker]").count()).toBe(2);
    const curves = chart.locator("path.recharts-curve");
    await expect.poll(() => curves.count()).toBeGreaterThan(2);
    const dashes = await curves.evaluateAll((ps) => ps.map((p) => p.getAttribute("stroke-dasharray") ?? ""));
    // Three runs on the S-curve: lower stable, middle unstable (dashed), upper stable; plus the count line.
    expect(dashes.filter((d) => d === "6 4")).toHaveLength(1);
    expect(dashes.filter((d) => d === "").length).toBeGreaterThanOrEqual(3);
    // The markers sit at the ends of the dashed branch: both marker x positions equal its end points.
    const dashedEnds = await chart.locator('path.recharts-curve[stroke-dasharray="6 4"]').evaluate((p) => {
      const path = p as SVGPathElement;
      const a = path.getPointAtLength(0), b = path.getPointAtLength(path.getTotalLength());
      return [a.x, b.x].sort((u, v) => u - v);
    });
    const markerXs = await chart.locator("[data-testid=fold-marker]").evaluateAll((cs) => cs.map((c) => Number(c.getAttribute("cx"))).sort((u, v) => u - v));
    expect(markerXs[0]).toBeCloseTo(dashedEnds[0]!, 0);
    expect(markerXs[1]).toBeCloseTo(dashedEnds[1]!, 0);
    await chart.scrollIntoViewIfNeeded();
    await shot(page, "01-exact-scan");
  }, 180_000);
});
