import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseUrl, type E2EBrowser, hasApp, openBrowser } from "./support/browser";

describe.skipIf(!hasApp)("unknown addresses", () => {
  let b: E2EBrowser;
  beforeAll(async () => {
    b = await openBrowser();
  });
  afterAll(async () => {
    await b?.close();
  });

  it("answers 404 with a helpful page inside the app shell", async () => {
    const { page, status } = await b.page("/no/such/page");
    expect(status).toBe(404);
    expect(await page.locator("h1").innerText()).toBe("Page not found");
    expect(await page.locator("main code").innerText()).toBe("/no/such/page");
    expect(await page.locator("header").getByRole("link", { name: "Stillpoint" }).count()).toBe(1);
    await page.getByRole("link", { name: "Go to the start page" }).click();
    // Client navigation changes the URL before the start page renders: wait for its heading.
    await page.locator("h1", { hasText: /rest/i }).waitFor();
    expect(new URL(page.url()).href).toBe(`${baseUrl}/`);
  });
});
