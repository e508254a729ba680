import { readFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, hasApp } from "./support/browser";
import { openSignedInBrowser } from "./accounts-helpers";

/**
 * Runs one can keep track of, in the browser, as the demo lab's owner: a run of a network that is
 * slow by construction (ten-switches: 3^10 steady states to list) shows its first stages while it
 * computes; cancelled, it keeps them, marked partial with what was not finished. Then the run is
 * named, found again with the list's filters, archived (hidden until "Show archived"); a network
 * with three steady states has its table sorted and three runs compared; and the lab's audit log
 * tells all of it in sentences.
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
    owner = await openSignedInBrowser("owner@halvorsen.test");
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

  it("sorts the steady-state table and compares three runs side by side", async () => {
    const { page } = await owner.page(`${LAB}/networks`);
    // -(X - 1)(X - 2)(X - 3): positive steady states 1, 2, 3 (see the fixture's header).
    const csv = readFileSync("tests/fixtures/networks/cubic-autocatalysis.csv", "utf8");
    const created = await page.evaluate(
      async ({ url, name, csv }) => (await (await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ name, csv }) })).json()) as { network: { id: string } },
      { url: `/api${LAB}/networks`, name: `Cubic ${NETWORK}`, csv },
    );
    const cubicId = created.network.id;
    const runs: string[] = [];
    for (const symbolic of [false, true, false]) {
      await page.goto(`${LAB}/networks/${cubicId}/analyse`);
      if (symbolic) await page.getByLabel("all symbolic").check();
      await page.getByRole("button", { name: "Start analysis" }).click();
      await page.waitForURL(/\/analyses\/[0-9a-f-]{36}$/);
      runs.push(new URL(page.url()).pathname);
      await expect.poll(() => text(page, "status"), { timeout: 90_000, interval: 500 }).toBe("succeeded");
    }
    await page.goto(runs[0]!);
    await page.getByTestId("steady-states").waitFor();
    const xs = async () => (await page.getByTestId("steady-state-row").locator('[data-testid="conc-X"]').allInnerTexts()).map(Number);
    expect(await xs()).toEqual([1, 2, 3]);
    const header = page.getByTestId("sort-conc-X");
    await header.click();
    const dir = await page.locator("th", { has: header }).getAttribute("aria-sort");
    expect(await xs()).toEqual(dir === "descending" ? [3, 2, 1] : [1, 2, 3]);
    await header.click();
    expect(await xs()).toEqual(dir === "descending" ? [1, 2, 3] : [3, 2, 1]);

    await page.goto(`${LAB}/analyses?network=${cubicId}`);
    for (const r of runs) await page.locator(`input[name=id][value="${r.split("/").pop()}"]`).check();
    await page.getByTestId("compare-selected").click();
    const columns = page.getByTestId("compare-column");
    await expect.poll(() => columns.count(), { timeout: 10_000, interval: 300 }).toBe(3);
    expect(await page.locator("h1").innerText()).toMatch(/^Compare 3 analyses of Cubic /);
    expect(await columns.nth(1).innerText()).toMatch(/symbolic rates/);
    expect(await columns.nth(2).innerText()).toMatch(/numeric rates/);
  }, 300_000);

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
