import { mkdirSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, hasApp } from "./support/browser";
import { openSignedInBrowser } from "./accounts-helpers";

/**
 * Constant species in the browser, as the demo lab's editor: start from the fed-switch demo, see its
 * held species in the editor's field, get a located complaint for a bad value, save, read the held
 * species and the ODE on the network page, change a held concentration and read it in the diff.
 */
const SHOTS = "test-results/constant-species";
const LAB = "/labs/halvorsen-enzyme-lab";

describe.skipIf(!hasApp)("constant species in headless chromium", () => {
  let editor: E2EBrowser;
  const name = `Fed reactor ${Date.now().toString(36)}`;
  let networkPath = "";

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    editor = await openSignedInBrowser("editor@halvorsen.test");
  });
  afterAll(async () => {
    await editor?.close();
  });

  it("edits the held species in the grid editor, with located problems, and saves them", async () => {
    const { page } = await editor.page(`${LAB}/networks/new`);
    await page.getByLabel("Name").fill(name);
    await page.getByRole("button", { name: "Fed autocatalytic switch" }).click();
    const field = page.getByTestId("constants-input");
    await expect.poll(() => field.inputValue()).toBe("A = 2, B = 3");
    await expect.poll(() => page.getByTestId("grid-status").innerText()).toMatch(/Looks valid: 2 rows/);

    await field.fill("A = 0, B = 3, Q");
    await expect.poll(() => page.getByTestId("constants-problems").innerText()).toContain("the concentration `0` of `A` is not a positive number");
    expect(await page.getByTestId("constants-problems").innerText()).toContain("`Q` is declared constant but is not a species of any reaction");
    await page.screenshot({ path: `${SHOTS}/01-constants-problems.png`, fullPage: true });

    await field.fill("A = 2, B = 3");
    await expect.poll(() => page.getByTestId("grid-status").innerText()).toMatch(/Looks valid/);
    await page.getByLabel(/^Change note/).fill("Fed reactor, feed and waste held.");
    await page.getByRole("button", { name: "Save network" }).click();
    await page.getByTestId("stat-species").waitFor();
    networkPath = new URL(page.url()).pathname;
    expect(networkPath).toMatch(/\/networks\/[0-9a-f-]{36}$/);
    expect(await page.getByTestId("stat-species").innerText()).toBe("1");
    expect(await page.getByTestId("constant-species").innerText()).toMatch(/A\s*= 2, B\s*= 3/);
    expect(await page.getByTestId("ode-text").allTextContents()).toContain("dX/dt = k1·X^2·A - k2·X^3 - k3·X + k4·B");
    await page.screenshot({ path: `${SHOTS}/02-network-page.png`, fullPage: true });
  });

  it("keeps the held species in the next version's editor and names the change in the diff", async () => {
    const { page } = await editor.page(`${networkPath}/edit`);
    const field = page.getByTestId("constants-input");
    await expect.poll(() => field.inputValue()).toBe("A = 2, B = 3");
    await field.fill("A = 5/2, B = 3");
    await expect.poll(() => page.getByTestId("grid-status").innerText()).toMatch(/Looks valid/);
    await page.getByLabel(/^Change note/).fill("Stronger feed.");
    await page.getByRole("button", { name: "Save as new version" }).click();
    await page.getByTestId("constants-changed").waitFor();
    expect(page.url()).toMatch(/\/versions\?from=1&to=2$/);
    expect(await page.getByTestId("constants-changed").innerText()).toContain("A: 2 → 5/2");
    await page.screenshot({ path: `${SHOTS}/03-version-diff.png`, fullPage: true });
  });
});
