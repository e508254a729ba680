import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { main } from "@domain/cli/main";
import type { CliIO } from "@domain/cli/io";
import { computePendingStructures, requestStructure, structureState } from "~/networks/structure-store.server";
import { createTestDatabase, hasTestDatabase, type TestDatabase } from "../support/test-db";

/**
 * One code path: the structure the network page and the API show (computed by the worker's
 * computePendingStructures, stored by content hash and read back with structureState) is
 * analyseStructure's output, and every structure key of the CLI's `analyse --json` carries the
 * same value for the same file.
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

describe.skipIf(!hasTestDatabase)("the page's structure is the CLI's structure", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase();
  });
  afterAll(async () => t?.drop());

  for (const name of ["michaelis-menten", "triangle", "cycle"]) {
    it(`agrees on ${name}.csv`, async () => {
      const text = readFileSync(`tests/fixtures/networks/${name}.csv`, "utf8");
      await requestStructure(t.db, text);
      expect(await structureState(t.db, text)).toEqual({ status: "pending" });
      expect(await computePendingStructures(t.db)).toBe(1);
      const state = await structureState(t.db, text);
      if (state.status !== "ready") throw new Error(`structure ${state.status}`);
      const page = state.structure;
      // Stored as JSON: what the page gets is the domain's value after a JSON round trip.
      expect(page).toEqual(JSON.parse(JSON.stringify(analyseStructure(parseNetworkCsv(text)))));
      const cli = await cliJson(`${name}.csv`, text);
      for (const key of STRUCTURE_KEYS) expect(JSON.parse(JSON.stringify(page[key])), key).toEqual(cli[key]);
    });
  }
});
