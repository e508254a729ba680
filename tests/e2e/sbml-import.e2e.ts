import { mkdirSync, readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readSbml } from "../../domain/network/sbml/index";
import { type E2EBrowser, hasApp, openBrowser } from "./support/browser";
import { signInWithCode } from "./accounts-helpers";

/**
 * SBML in the browser, as the demo lab's editor: a file with a non-mass-action law is refused with
 * the reaction's id and line and every reaction's fate, the grid untouched; the valid file fills
 * the grid and saves as a normal network with its structure; the page offers SBML, reaction-list,
 * Python and Julia downloads, and the SBML download reads back to the same reactions. Then a
 * reaction list is pasted into the editor. Screenshots in test-results/sbml/ (git-ignored).
 */
const SHOTS = "test-results/sbml";
const LAB = "/labs/halvorsen-enzyme-lab";
const HATCHERY = readFileSync("tests/fixtures/sbml/hatchery.xml", "utf8");
const REFUSED = HATCHERY.replace("<ci>kh</ci><ci>Egg</ci>", "<ci>kh</ci><apply><divide/><ci>Egg</ci><apply><plus/><ci>kh</ci><ci>Egg</ci></apply></apply>");

describe.skipIf(!hasApp)("SBML import and export in headless chromium", () => {
  let editor: E2EBrowser;
  const name = `Hatchery ${Date.now().toString(36)}`;
  let networkPath = "";
  const consoleErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    editor = await openBrowser();
    editor.context.on("console", (m) => void (m.type() === "error" && consoleErrors.push(m.text())));
    const { page } = await editor.page("/sign-in");
    await signInWithCode(page, "editor@halvorsen.test");
    await page.close();
  });
  afterAll(async () => {
    await editor?.close();
  });

  it("refuses an SBML file with a non-mass-action law, then imports the valid one and saves it", async () => {
    const { page } = await editor.page(`${LAB}/networks/new`);
    await page.getByLabel("Name").fill(name);
    await page.getByTestId("file-input").setInputFiles({ name: "tank.xml", mimeType: "application/xml", buffer: Buffer.from(REFUSED) });
    await page.getByTestId("file-problems").waitFor();
    expect(await page.getByTestId("file-problems").innerText()).toMatch(/line 22: <reaction id="hatch">: the kinetic law is not mass action/);
    const fates = await page.getByTestId("file-reactions").innerText();
    expect(fates).toMatch(/hatch[\s\S]*Egg -> Fry[\s\S]*divides by a sum/);
    expect(fates).toMatch(/grow[\s\S]*Fry \+ Feed <-> Fingerling[\s\S]*mass action, read/);
    expect(await page.getByTestId("grid-row").count()).toBe(1);
    await page.screenshot({ path: `${SHOTS}/01-refused.png`, fullPage: true });

    await page.getByTestId("file-input").setInputFiles({ name: "tank.xml", mimeType: "application/xml", buffer: Buffer.from(HATCHERY) });
    await expect.poll(() => page.getByTestId("grid-row").count()).toBe(2);
    expect(await page.getByTestId("editor-notices").innerText()).toMatch(/read as SBML/);
    // The file's initial concentrations are kept with the version, in their own field.
    expect(await page.getByTestId("initial-input").inputValue()).toBe("Egg = 2, Fry = 0, Feed = 1, Fingerling = 0");
    expect(await page.getByLabel("Reaction, row 2").inputValue()).toBe("Fry + Feed <-> Fingerling");
    expect(await page.getByLabel("Rate value, row 2").inputValue()).toBe("1/2");
    await expect.poll(() => page.getByTestId("grid-status").innerText()).toMatch(/Looks valid/);
    await page.screenshot({ path: `${SHOTS}/02-imported.png`, fullPage: true });
    await page.getByRole("button", { name: "Save network" }).click();
    await page.getByTestId("network-name").waitFor();
    networkPath = new URL(page.url()).pathname;
    expect(await page.getByTestId("network-name").innerText()).toContain(name);
    expect(await page.getByTestId("stat-species").innerText()).toBe("4");
    expect(await page.getByTestId("stat-reactions").innerText()).toBe("3");
    await page.screenshot({ path: `${SHOTS}/03-network-page.png` });
  });

  it("offers the open-format downloads, and the SBML one reads back to the same reactions", async () => {
    const { page } = await editor.page(networkPath);
    const downloads = page.getByLabel("Downloads");
    for (const label of ["SBML (Level 3)", "Reaction list (text)", "ODEs (Python)", "ODEs (Julia)"]) {
      expect(await downloads.getByText(label).count(), label).toBe(1);
    }
    const href = await downloads.getByText("SBML (Level 3)").getAttribute("href");
    const res = await page.request.get(href!);
    expect(res.status()).toBe(200);
    const back = readSbml(await res.text());
    expect(back.problems).toEqual([]);
    expect(back.csv).toContain("Fry + Feed <-> Fingerling,growing,kg,kb,1/2,1/4");
    const py = await page.request.get(`${networkPath}/download/odes.py`);
    expect(await py.text()).toMatch(/def rhs\(t, x, p=PARAMETERS\)/);
  });

  it("links the OpenAPI description from the account page, next to the tokens", async () => {
    const { page } = await editor.page("/account");
    const href = await page.getByTestId("openapi-link").getAttribute("href");
    expect(href).toBe("/api/openapi.json");
    const res = await page.request.get(href!);
    expect(res.status()).toBe(200);
    const doc = (await res.json()) as { openapi: string; paths: Record<string, unknown> };
    expect(doc.openapi).toBe("3.1.0");
    expect(Object.keys(doc.paths)).toContain("/api/labs/{labSlug}/networks");
  });

  it("reads a pasted reaction list into the grid, with problems at their lines", async () => {
    const { page } = await editor.page(`${networkPath}/edit`);
    await page.getByTestId("paste-reactions").locator("summary").click();
    await page.getByLabel("Reactions as text").fill("hatching: Egg -> Fry, kh = 3\nFry => Adult\n");
    await page.getByRole("button", { name: "Read into the grid" }).click();
    await page.getByTestId("file-problems").waitFor();
    expect(await page.getByTestId("file-problems").innerText()).toMatch(/line 2, column reaction/);
    await page.getByLabel("Reactions as text").fill("hatching: Egg -> Fry, kh = 3\nFry + Feed <-> Fingerling, kg = 1/2, kb = 1/4\nFingerling -> 0, kout = 1\n");
    await page.getByRole("button", { name: "Read into the grid" }).click();
    await expect.poll(() => page.getByTestId("grid-row").count()).toBe(3);
    expect(await page.getByLabel("Reaction, row 3").inputValue()).toBe("Fingerling -> 0");
    await expect.poll(() => page.getByTestId("grid-status").innerText()).toMatch(/Looks valid/);
    await page.screenshot({ path: `${SHOTS}/04-pasted.png`, fullPage: true });
    expect(consoleErrors).toEqual([]);
  });
});
