import { mkdirSync } from "node:fs";
import { gzipSync } from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type E2EBrowser, hasApp } from "./support/browser";
import { openSignedInBrowser } from "./accounts-helpers";

/**
 * Files the editor cannot use, uploaded in the browser: a binary file gives one located line (not
 * a complaint per stray byte), a Latin-1 file names its first non-UTF-8 byte, a file with unknown
 * columns names them and loads nothing (so no rate name is lost unseen). The grid stays as it was.
 */
const SHOTS = "test-results/bad-files";
const LAB = "/labs/halvorsen-enzyme-lab";

describe.skipIf(!hasApp)("bad network files in the editor, headless chromium", () => {
  let editor: E2EBrowser;
  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    editor = await openSignedInBrowser("editor@halvorsen.test");
  }, 60_000);
  afterAll(async () => {
    await editor?.close();
  });

  it("answers binary, non-UTF-8 and unknown-column files with located lines and leaves the grid alone", async () => {
    const { page } = await editor.page(`${LAB}/networks/new`);
    const problems = page.getByTestId("file-problems").locator("li");
    const grid = page.getByTestId("grid-row");
    const reactionCells = () => grid.locator("input").first().inputValue();
    await grid.first().waitFor();
    expect(await reactionCells()).toBe("");

    // A gzip file named .csv: byte 1 is 0x1F.
    const gz = gzipSync(Buffer.from("reaction,rate\n" + 'A -> B,"k1\n'.repeat(400)));
    await page.getByTestId("file-input").setInputFiles({ name: "network.csv", mimeType: "text/csv", buffer: gz });
    await expect.poll(() => problems.count()).toBe(1);
    expect(await problems.first().innerText()).toMatch(/^line 1: this is not a text file: binary content at byte 1 \(0x1F, line 1\); expected a text file in UTF-8/);
    expect(await page.getByTestId("file-problems").innerText()).not.toMatch(/double quote/);
    expect(await reactionCells()).toBe("");
    await page.screenshot({ path: `${SHOTS}/01-binary.png`, fullPage: true });

    // Latin-1: "Caf\xE9" on line 2.
    const latin1 = Buffer.concat([Buffer.from("reaction,label\nA -> B,Caf"), Buffer.from([0xe9]), Buffer.from("\n")]);
    await page.getByTestId("file-input").setInputFiles({ name: "latin1.csv", mimeType: "text/csv", buffer: latin1 });
    await expect.poll(() => problems.first().innerText()).toMatch(/not UTF-8 text: byte 26 \(0xE9, line 2, character 11\)/);
    expect(await problems.count()).toBe(1);
    expect(await reactionCells()).toBe("");

    // Unknown columns: both named, nothing loaded.
    await page.getByTestId("file-input").setInputFiles({ name: "columns.csv", mimeType: "text/csv", buffer: Buffer.from("reaction,rate_constant,value\nA -> B,kf,2\nB -> A,kr,1\n") });
    await expect.poll(() => problems.count()).toBe(2);
    const texts = await problems.allInnerTexts();
    expect(texts[0]).toMatch(/^line 1, column 2 \(rate_constant\): unknown column `rate_constant`/);
    expect(texts[1]).toMatch(/^line 1, column 3 \(value\): unknown column `value`/);
    expect(await page.getByTestId("editor-notices").innerText()).toMatch(/Nothing was loaded from columns\.csv/);
    expect(await reactionCells()).toBe("");
    await page.screenshot({ path: `${SHOTS}/02-unknown-columns.png`, fullPage: true });
  }, 120_000);
});
