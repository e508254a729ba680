import { readFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, hasApp, openBrowser } from "./support/browser";
import { resetSignInLimits, signInWithCode } from "./accounts-helpers";

/**
 * Runs one can keep track of, in the browser, as the demo lab's owner: a run of a network that is
 * slow by construction (ten-switches: 3^10 steady states to list) shows its first stages while it
 * computes; cancelled, it keeps them, marked partial with what was not finished. Then the run is
 * named, found again with the list's filters, archived (hidden until "Show archived"), and the
 * lab's audit log tells all of it in sentences.
 */
const LAB = "/labs/halvorsen-enzyme-lab";
const OWNER = "Ingrid Halvorsen";
const NETWORK = `Ten switches ${Date.now().toString(36)}`;

const text = (page: Page, testId: string) => page.getByTestId(testId).first().innerText();

describe.skipIf(!hasApp)("runs: partial results, names, filters, archive, audit", () => {
  let owner: E2EBrowser;
  let runUrl = "";
  let networkId = "";

  beforeAll(async () => {
    owner = await openBrowser();
    await resetSignInLimits("owner@halvorsen.test");
    const { page } = await owner.page("/sign-in");
    await signInWithCode(page, "owner@halvorsen.test");
    await page.close();
  }, 60_000);
  afterAll(async () => {
    await owner?.close();
  });

  it("keeps what a cancelled run had finished and shows it as partial", async () => {
    const { page } = await owner.page(`${LAB}/networks`);
    // Upload through the JSON API from the signed-in page (same origin, the session cookie).
    const csv = readFileSync("tests/fixtures/networks/ten-switches.csv", "utf8");
    const created = await page.evaluate(
      async ({ url, name, csv }) => {
        const res = await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ name, csv }) });
        return { status: res.status, body: await res.json() };
      },
      { url: `/api${LAB}/networks`, name: NETWORK, csv },
    );
    expect(created.status).toBe(201);
    networkId = (created.body as { network: { id: string } }).network.id;
    await page.goto(`${LAB}/networks/${networkId}/analyse`);
    await page.getByRole("button", { name: "Start analysis" }).click();
    await page.waitForURL(/\/analyses\/[0-9a-f-]{36}$/);
    runUrl = new URL(page.url()).pathname;
    // While it computes, the stages already done appear, marked partial.
    await page.getByTestId("partial-result").waitFor({ timeout: 60_000 });
    expect(await text(page, "partial-result")).toMatch(/still going/);
    await page.getByTestId("progress").getByRole("button", { name: "Cancel" }).click();
    await expect.poll(() => text(page, "status"), { timeout: 30_000, interval: 500 }).toBe("cancelled");
    await expect.poll(() => text(page, "partial-result"), { timeout: 10_000, interval: 300 }).toMatch(/Partial result\. The run was cancelled/);
    expect(await text(page, "partial-missing")).toMatch(/Not finished: .*positive steady states of the class/);
    expect(await text(page, "job-error")).toMatch(/Cancelled after .* Parts finished before that are kept/);
    // The finished part is there: the result view with its list of unfinished stages.
    await page.getByTestId("results").waitFor();
    expect(await text(page, "unfinished")).toMatch(/positive steady states of the class: not finished: the run stopped/);
  }, 150_000);

  it("names the run, finds it with the filters, archives it and hides it until asked", async () => {
    const { page } = await owner.page(runUrl);
    const details = page.getByTestId("run-details");
    if (!(await details.getAttribute("open"))) await details.locator("summary").click();
    await details.getByLabel(/^Name/).fill("Switches, cancelled early");
    await details.getByLabel(/^Note/).fill("Stopped on purpose: the listing cannot finish.");
    await details.getByRole("button", { name: "Save name and note" }).click();
    await expect.poll(() => text(page, "run-title"), { timeout: 10_000, interval: 300 }).toBe("Switches, cancelled early");

    await page.goto(`${LAB}/analyses`);
    const filters = page.getByTestId("run-filters");
    await filters.getByLabel("Network").selectOption({ label: NETWORK });
    await filters.getByLabel("Status").selectOption("cancelled");
    await filters.getByRole("button", { name: "Filter" }).click();
    const names = page.getByTestId("run-name");
    await expect.poll(async () => (await names.allInnerTexts()).join("|"), { timeout: 10_000, interval: 300 }).toBe("Switches, cancelled early");
    expect(await page.getByTestId("analysis-row").first().innerText()).toMatch(/partial result/);
    // Another status: the run is not among them.
    await filters.getByLabel("Status").selectOption("succeeded");
    await filters.getByRole("button", { name: "Filter" }).click();
    await expect.poll(async () => (await names.allInnerTexts()).includes("Switches, cancelled early"), { timeout: 10_000, interval: 300 }).toBe(false);

    await page.goto(runUrl);
    const box = page.getByTestId("run-details");
    if (!(await box.getAttribute("open"))) await box.locator("summary").click();
    await box.getByRole("button", { name: "Archive" }).click();
    await page.getByTestId("archived-note").waitFor();

    await page.goto(`${LAB}/analyses?network=${networkId}`);
    await page.getByTestId("analyses-table").waitFor();
    expect(await page.getByTestId("run-name").allInnerTexts()).not.toContain("Switches, cancelled early");
    await page.getByTestId("run-filters").getByLabel("Show archived").check();
    await page.getByTestId("run-filters").getByRole("button", { name: "Filter" }).click();
    await expect.poll(async () => (await page.getByTestId("run-name").allInnerTexts()).includes("Switches, cancelled early"), { timeout: 10_000, interval: 300 }).toBe(true);
  }, 90_000);

  it("tells the lab's audit log in sentences", async () => {
    const { page } = await owner.page(`${LAB}/audit`);
    await page.getByTestId("audit-sentence").first().waitFor();
    const lines = (await page.getByTestId("audit-sentence").allInnerTexts()).join("\n");
    expect(lines).toContain(`${OWNER} uploaded the network ${NETWORK}.`);
    expect(lines).toContain(`${OWNER} started a steady-state analysis of ${NETWORK} v1.`);
    expect(lines).toContain(`${OWNER} cancelled the analysis of ${NETWORK} v1.`);
    expect(lines).toContain(`${OWNER} renamed the analysis of ${NETWORK} v1 from no name to “Switches, cancelled early”.`);
    expect(lines).toContain(`${OWNER} archived the analysis “Switches, cancelled early” of ${NETWORK} v1.`);
    expect(lines).not.toMatch(/\{"/);
  }, 60_000);
});
