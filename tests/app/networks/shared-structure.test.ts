import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { main } from "@domain/cli/main";
import type { CliIO } from "@domain/cli/io";
import { structureOf } from "~/networks/structure.server";

/**
 * One code path: the structure the network page and the API show (structureOf, cached by content
 * hash) is analyseStructure's output, and every structure key of the CLI's `analyse --json`
 * carries the same value for the same file.
 */
const STRUCTURE_KEYS = [
  "species",
  "complexes",
  "reactions",
  "rank",
  "linkageClasses",
  "deficiency",
  "weaklyReversible",
  "conservationLaws",
  "minimalSemiPositiveConservationLaws",
  "deficiencyZeroTheorem",
  "deficiencyOneTheorem",
] as const;

async function cliJson(file: string, text: string): Promise<Record<string, unknown>> {
  let out = "";
  const io: CliIO = { readFile: () => text, stdout: (t) => void (out += t), stderr: () => undefined };
  const code = await main(["analyse", file, "--json"], io);
  expect(code).toBe(0);
  return JSON.parse(out) as Record<string, unknown>;
}

describe("the page's structure is the CLI's structure", () => {
  for (const name of ["michaelis-menten", "triangle", "cycle"]) {
    it(`agrees on ${name}.csv`, async () => {
      const text = readFileSync(`tests/fixtures/networks/${name}.csv`, "utf8");
      const page = structureOf(text);
      expect(page).toEqual(analyseStructure(parseNetworkCsv(text)));
      const cli = await cliJson(`${name}.csv`, text);
      for (const key of STRUCTURE_KEYS) expect(JSON.parse(JSON.stringify(page[key])), key).toEqual(cli[key]);
    });
  }
});
