import { execFileSync } from "node:child_process";
import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { cli } from "./run-cli";
import { parseInitial } from "@domain/cli/analyse";


const fixture = (name: string) => readFileSync(`tests/fixtures/networks/${name}`, "utf8");
const CUBIC = fixture("cubic-autocatalysis.csv");
const MM = fixture("michaelis-menten.csv");

describe("cli analyse --json", () => {
  it("prints the contract's keys with the structure from analyseStructure", async () => {
    const r = await cli(["analyse", "n.csv", "--json"], { "n.csv": MM });
    expect(r.code).toBe(0);
    expect(r.err).toBe("");
    const j = JSON.parse(r.out);
    for (const key of ["species", "complexes", "reactions", "rank", "linkageClasses", "deficiency", "weaklyReversible", "conservationLaws", "groebnerBasis", "parametrisation", "acr", "steadyStates", "warnings"])
      expect(j, key).toHaveProperty(key);
    expect(j.species).toEqual(["E", "S", "C", "P"]);
    expect(j.complexes).toEqual(["E + S", "C", "E + P"]);
    expect(j.reactions).toBe(3);
    expect(j.rank).toBe(2);
    expect(j.deficiency).toBe(0);
    expect(j.weaklyReversible).toBe(false);
    expect(j.conservationLaws).toEqual([{ E: 1, C: 1 }, { S: 1, C: 1, P: 1 }]);
    expect(j.parametrisation).toBeNull();
    expect(j.steadyStates).toBeNull();
    expect(j.warnings.some((w: string) => w.includes("saturated by the product of the species"))).toBe(true);
  });

  it("with --initial lists every positive steady state with its stability (cubic autocatalysis fixture: 1, 2, 3)", async () => {
    const r = await cli(["analyse", "c.csv", "--json", "--initial", "X=1"], { "c.csv": CUBIC });
    const j = JSON.parse(r.out);
    expect(j.steadyStates.map((s: { concentrations: { X: number } }) => s.concentrations.X)).toEqual([1, 2, 3]);
    expect(j.steadyStates.map((s: { stable: boolean | null }) => s.stable)).toEqual([true, false, true]);
    expect(j.groebnerBasis).toEqual(["X^3 - 6*X^2 + 11*X - 6"]);
  });

  it("honours --order and reports the parametrisation and ACR", async () => {
    const csv = "reaction,rate\nA + B -> 2B,k1\nB -> A,k2\n";
    const r = await cli(["analyse", "n.csv", "--json", "--order", "A,B"], { "n.csv": csv });
    const j = JSON.parse(r.out);
    expect(j.parametrisation).toEqual({ free: ["B"], expressions: { A: "k2/k1" }, positive: true, positiveSpecies: ["A"] });
    expect(j.acr).toEqual([{ species: "A", value: "k2/k1" }]);
    expect(j.order.species).toEqual(["A", "B"]);
    // The parametrisation answers, so the full basis is computed only on request.
    expect(j.groebnerBasisStatus).toBe("skipped");
    const full = JSON.parse((await cli(["analyse", "n.csv", "--json", "--order", "A,B", "--full-basis"], { "n.csv": csv })).out);
    expect(full.groebnerBasisStatus).toBe("complete");
    expect(full.groebnerBasis).toContain("A + B - T1");
  });

  it("runs as a real process through npm run -s cli (exit code 0, JSON on stdout)", () => {
    const out = execFileSync("npm", ["run", "-s", "cli", "--", "analyse", "tests/fixtures/networks/triangle.csv", "--json"], { encoding: "utf8" });
    const j = JSON.parse(out);
    expect(j.deficiency).toBe(0);
    expect(j.weaklyReversible).toBe(true);
  });
});

describe("cli analyse, readable report", () => {
  it("has the main sections", async () => {
    const r = await cli(["analyse", "c.csv", "--initial", "X=1"], { "c.csv": CUBIC });
    expect(r.code).toBe(0);
    for (const title of ["Mass-action ODEs", "Elimination order", "Parametrisation", "Lex Gröbner basis", "Positive steady states in the class (3)"]) expect(r.out).toContain(title);
    expect(r.out).toContain("#2 unstable: X=2.00000000000");
  });
});

describe("cli analyse errors: stderr and exit code 2", () => {
  it("a malformed CSV gives its located problems", async () => {
    const dir = "tests/fixtures/networks/malformed";
    const files = readdirSync(dir).filter((f) => f.endsWith(".csv"));
    expect(files.length).toBeGreaterThanOrEqual(10);
    for (const f of files) {
      const r = await cli(["analyse", f, "--json"], { [f]: readFileSync(`${dir}/${f}`, "utf8") });
      expect(r.code, f).toBe(2);
      expect(r.out, f).toBe("");
      expect(r.err, f).toMatch(/^error: /);
      expect(r.err, f).toMatch(/line \d+/);
    }
  });

  it("an unknown species in --order or --initial, a bad --initial value and a bad relation are reported", async () => {
    // The domain gives the reason as data; the CLI names its own option in the message.
    expect((await cli(["analyse", "m.csv", "--order", "E,Q"], { "m.csv": MM })).err).toContain("--order: 'Q' is not a species");
    expect((await cli(["analyse", "m.csv", "--order", "E,E"], { "m.csv": MM })).err).toContain("--order: 'E' is listed twice");
    expect((await cli(["analyse", "m.csv", "--initial", "Z=1"], { "m.csv": MM })).err).toContain("--initial: 'Z' is not a species");
    const bad = await cli(["analyse", "m.csv", "--initial", "E=1,S=-2,P"], { "m.csv": MM });
    expect(bad.code).toBe(2);
    expect(bad.err).toContain("entry 2 'S=-2'");
    expect(bad.err).toContain("entry 3 'P'");
    const rel = await cli(["analyse", "m.csv", "--relation", "E*(S"], { "m.csv": MM });
    expect(rel.code).toBe(2);
    expect(rel.err).toContain("column");
    expect((await cli(["analyse"], {})).code).toBe(2);
    expect((await cli(["analyse", "missing.csv"], {})).err).toContain("cannot read missing.csv");
  });

  it("parseInitial reads exact values", () => {
    expect(parseInitial("S=1, E=1/10,P=0.25").get("E")).toEqual({ num: 1n, den: 10n });
  });
});

describe("cli analyse with constant species", () => {
  it("the fed Schlögl file drives analyse: X alone is a variable, three positive steady states (Schlögl, Z. Physik 253, 1972)", async () => {
    const r = await cli(["analyse", "fed.csv", "--json"], { "fed.csv": fixture("fed-schloegl.csv") });
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.species).toEqual(["X"]);
    expect(j.constants).toEqual([{ name: "A", value: "2" }, { name: "B", value: "3" }]);
    expect(j.complexes).toEqual(["2X", "3X", "X", "0"]);
    expect(j.odes).toEqual([{ species: "X", rhs: "-X^3 + 6*X^2 - 11*X + 6" }]);
    // Roots of −(X − 1)(X − 2)(X − 3), expanded by hand in the fixture's header.
    expect(j.steadyStates.map((s: { concentrations: { X: number }; stable: boolean }) => [s.concentrations.X, s.stable])).toEqual([
      [1, true],
      [2, false],
      [3, true],
    ]);
  });

  it("a bad declaration fails with its line and column", async () => {
    const r = await cli(["analyse", "bad.csv"], { "bad.csv": "# constant: A = -2\nreaction\nA + X -> 2X\nX -> 0\n" });
    expect(r.code).not.toBe(0);
    expect(r.err).toContain("line 1, column 13 (constant): the concentration `-2` of `A` is not a positive number");
  });
});
