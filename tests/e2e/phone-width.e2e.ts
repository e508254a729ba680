import { mkdirSync } from "node:fs";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, baseUrl, hasApp, openBrowser } from "./support/browser";
import { signInWithCode } from "./accounts-helpers";

/**
 * The viewport is a plain 390-px window (no mobile emulation, which zooms out to fit and so hides overflow).
 * The main pages on a phone (390 CSS pixels wide) are never wider than the screen: tables and
 * charts scroll inside their own box, the header wraps. Each page is also shot at 1366 px so both
 * layouts can be looked at (test-results/phone-width/, git-ignored).
 */
const SHOTS = "test-results/phone-width";
const LAB = "/labs/halvorsen-enzyme-lab";
const CYCLE = "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value\nS0 + K <-> S0K,kinase binding,a1,d1,1,1/2\nS0K -> S1 + K,phosphorylation,c1,,2,\nS1 + F <-> S1F,phosphatase binding,a2,d2,1,1\nS1F -> S0 + F,dephosphorylation,c2,,3/2,\n";

/** Elements that stick out past the right edge of the screen, outside any scrolling box (for the failure message). */
async function overflow(page: Page): Promise<{ scrollWidth: number; innerWidth: number; culprits: string[] }> {
  return page.evaluate(() => {
    const w = window.innerWidth;
    const scrolls = (el: Element | null): boolean => {
      for (let e = el; e && e !== document.body; e = e.parentElement) {
        const o = getComputedStyle(e).overflowX;
        if (o === "auto" || o === "scroll" || o === "hidden" || o === "clip") return true;
      }
      return false;
    };
    const culprits: string[] = [];
    const sticksOut = (el: Element) => {
      const r = el.getBoundingClientRect();
      return r.right > w + 0.5 && r.width > 0 && !scrolls(el.parentElement);
    };
    for (const el of document.body.querySelectorAll("*")) {
      const r = el.getBoundingClientRect();
      // The innermost elements that stick out: the ones to fix.
      if (sticksOut(el) && ![...el.children].some(sticksOut)) {
        const id = el.getAttribute("data-testid");
        culprits.push(`${el.tagName.toLowerCase()}${id ? `[${id}]` : ""}.${String(el.getAttribute("class") ?? "").split(" ").slice(0, 4).join(".")} right=${Math.round(r.right)}`);
      }
    }
    return { scrollWidth: document.documentElement.scrollWidth, innerWidth: w, culprits: culprits.slice(0, 8) };
  });
}

describe.skipIf(!hasApp)("phone widths in headless chromium", () => {
  let owner: E2EBrowser;
  let phone: BrowserContext;
  let desktop: BrowserContext;
  let anonymousPhone: BrowserContext;
  const paths: { name: string; path: string; signedOut?: boolean }[] = [];

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    owner = await openBrowser();
    const { page } = await owner.page("/sign-in");
    await signInWithCode(page, "owner@halvorsen.test");
    const state = await owner.context.storageState();
    const browser: Browser = owner.browser;
    phone = await browser.newContext({ baseURL: baseUrl, viewport: { width: 390, height: 844 }, deviceScaleFactor: 1, storageState: state });
    desktop = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1366, height: 900 }, storageState: state });
    anonymousPhone = await browser.newContext({ baseURL: baseUrl, viewport: { width: 390, height: 844 } });

    // A network, a finished analysis with a scan, and a share link of it.
    const api = owner.context.request;
    const created = await api.post(`/api${LAB}/networks`, { data: { name: `Phone cycle ${Date.now().toString(36)}`, csv: CYCLE } });
    expect(created.status()).toBe(201);
    const networkId = ((await created.json()) as { network: { id: string } }).network.id;
    const started = await api.post(`/api${LAB}/analyses`, { data: { networkId, rateMode: "numeric", initial: { S0: "1", K: "1/10", F: "1/10" } } });
    expect(started.status()).toBe(202);
    const analysisId = ((await started.json()) as { analysis: { id: string } }).analysis.id;
    const status = async () => ((await (await api.get(`/api${LAB}/analyses/${analysisId}`)).json()) as { analysis: { status: string } }).analysis.status;
    for (let i = 0; (await status()) !== "succeeded"; i++) {
      if (i > 180) throw new Error("the analysis did not finish in 90 s");
      await new Promise((r) => setTimeout(r, 500));
    }
    const analysisPage = await owner.context.newPage();
    await analysisPage.goto(`${LAB}/analyses/${analysisId}`);
    await analysisPage.getByRole("button", { name: "Create read-only link" }).click();
    const shareUrl = new URL(await analysisPage.getByTestId("share-url").innerText());
    const form = analysisPage.getByTestId("scan-form");
    await form.locator("select[name=parameterChoice]").selectOption("rate:c1");
    await form.locator("input[name=points]").fill("6");
    await form.getByRole("button", { name: "Run scan" }).click();
    await analysisPage.getByTestId("scan-chart").waitFor({ timeout: 90_000 });
    await analysisPage.close();
    await page.close();

    paths.push(
      { name: "landing", path: "/", signedOut: true },
      { name: "sign-in", path: "/sign-in", signedOut: true },
      { name: "labs", path: "/labs" },
      { name: "lab", path: LAB },
      { name: "members", path: `${LAB}/members` },
      { name: "audit", path: `${LAB}/audit` },
      { name: "networks", path: `${LAB}/networks` },
      { name: "network-new", path: `${LAB}/networks/new` },
      { name: "network", path: `${LAB}/networks/${networkId}` },
      { name: "network-edit", path: `${LAB}/networks/${networkId}/edit` },
      { name: "network-versions", path: `${LAB}/networks/${networkId}/versions` },
      { name: "analysis-new", path: `${LAB}/networks/${networkId}/analyse` },
      { name: "analyses", path: `${LAB}/analyses` },
      { name: "analysis", path: `${LAB}/analyses/${analysisId}` },
      { name: "share", path: shareUrl.pathname, signedOut: true },
      { name: "account", path: "/account" },
    );
  }, 240_000);
  afterAll(async () => {
    await phone?.close();
    await desktop?.close();
    await anonymousPhone?.close();
    await owner?.close();
  });

  it("keeps every main page within a 390-px screen, and shoots it at 390 and 1366 px", async () => {
    const wide: string[] = [];
    for (const p of paths) {
      for (const [label, context] of [["390", p.signedOut ? anonymousPhone : phone], ["1366", desktop]] as const) {
        if (label === "1366" && p.signedOut && p.name !== "share") continue;
        const page = await context.newPage();
        const res = await page.goto(p.path);
        expect(res?.status(), p.path).toBe(200);
        // Content, not the URL: the page's heading and the footer are drawn.
        await page.locator("main h1").first().waitFor();
        await page.evaluate(() => document.fonts.ready);
        if (label === "390") {
          const o = await overflow(page);
          // A mobile emulation would zoom out to fit wide content and widen innerWidth with it: guard the measure.
          expect(o.innerWidth).toBe(390);
          if (o.scrollWidth > o.innerWidth) wide.push(`${p.name} (${p.path}): ${o.scrollWidth} > ${o.innerWidth}; ${o.culprits.join(", ")}`);
        }
        if (p.name === "analysis") {
          // The scan's plot is drawn at its own size and scrolls sideways inside its box.
          const figure = page.getByTestId("scan-branches-figure");
          await figure.locator("path.recharts-curve").first().waitFor({ state: "attached" });
          await figure.scrollIntoViewIfNeeded();
          await figure.screenshot({ path: `${SHOTS}/${label}-scan-figure.png` });
        }
        await page.screenshot({ path: `${SHOTS}/${label}-${p.name}.png`, fullPage: true });
        await page.close();
      }
    }
    expect(wide).toEqual([]);
  }, 240_000);
});
