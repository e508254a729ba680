import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseUrl, type E2EBrowser, hasApp, openBrowser } from "./support/browser";

describe.skipIf(!hasApp)("landing page in headless chromium", () => {
  let b: E2EBrowser;
  beforeAll(async () => {
    b = await openBrowser();
  });
  afterAll(async () => {
    await b?.close();
  });

  it("says what the product does, with the shipped Noto Sans font and our styles applied", async () => {
    const { page, requests, status } = await b.page("/");
    expect(status).toBe(200);
    expect(await page.title()).toContain("Stillpoint");
    expect(await page.locator("header").getByRole("link", { name: "Stillpoint" }).isVisible()).toBe(true);
    expect(await page.locator("h1").innerText()).toMatch(/rest/i);
    expect(await page.getByText("biochemists, modellers and lab leads").count()).toBe(1);

    const fonts = await page.evaluate(async () => {
      await document.fonts.ready;
      const body = getComputedStyle(document.body);
      const loaded = [...document.fonts].filter((f) => f.family.replace(/"/g, "") === "Noto Sans" && f.status === "loaded");
      return {
        family: body.fontFamily,
        check: document.fonts.check('16px "Noto Sans"'),
        loadedWeights: [...new Set(loaded.map((f) => f.weight))].sort(),
      };
    });
    expect(fonts.family.startsWith('"Noto Sans"')).toBe(true);
    expect(fonts.check).toBe(true);
    // At least the body weight must really have been downloaded from our own server.
    expect(fonts.loadedWeights).toContain("400");
    const fontFiles = requests.filter((u) => /noto-sans.*\.woff2?$/.test(u));
    expect(fontFiles.length).toBeGreaterThan(0);

    // Design tokens reached the page: paper background, white header, teal primary button.
    const colours = await page.evaluate(() => ({
      body: getComputedStyle(document.body).backgroundColor,
      header: getComputedStyle(document.querySelector("header")!).backgroundColor,
      primary: getComputedStyle(document.querySelector(".btn-primary")!).backgroundColor,
      radius: getComputedStyle(document.querySelector(".btn-primary")!).borderTopLeftRadius,
    }));
    expect(colours).toEqual({
      body: "rgb(246, 245, 240)",
      header: "rgb(255, 255, 255)",
      primary: "rgb(44, 107, 102)",
      radius: "8px",
    });
  });

  it("loads nothing from any other host (no CDN)", async () => {
    const { requests } = await b.page("/");
    const foreign = requests.filter((u) => !u.startsWith(baseUrl) && !u.startsWith("data:"));
    expect(foreign).toEqual([]);
  });
});
