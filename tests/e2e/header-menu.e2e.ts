import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, hasApp, openBrowser } from "./support/browser";
import { signInWithCode } from "./accounts-helpers";

/** Sign-out and the account page are one click away from every page, in the header's menu. */
describe.skipIf(!hasApp)("header menu in headless chromium", () => {
  let b: E2EBrowser;
  const email = `menu-${Date.now().toString(36)}@e2e.test`;

  beforeAll(async () => {
    b = await openBrowser();
  });
  afterAll(async () => {
    await b?.close();
  });

  it("opens the account page and signs out from the header of any page", async () => {
    const { page } = await b.page("/sign-in");
    await signInWithCode(page, email, "Mira Menu");
    await page.getByTestId("user-menu").getByText("Mira Menu").click();
    await page.getByRole("menuitem", { name: "Account and API tokens" }).click();
    await page.getByRole("heading", { level: 1 }).filter({ hasText: /account/i }).waitFor();
    await page.goto(`${new URL(page.url()).origin}/networks`);
    await page.getByTestId("user-menu").getByText("Mira Menu").click();
    await page.getByRole("menuitem", { name: "Sign out" }).click();
    // Signed out: the header offers sign-in again, and a signed-in page sends us to it.
    await page.getByTestId("session-state").getByText("Sign in").waitFor();
    const res = await page.goto(`${new URL(page.url()).origin}/account`);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    expect(res?.status()).toBe(200);
  });
});
