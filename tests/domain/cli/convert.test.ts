import { readFileSync } from "node:fs";
import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { cli } from "./run-cli";

const HATCHERY = readFileSync("tests/fixtures/sbml/hatchery.xml", "utf8");
const HATCHERY_CSV = "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value\nEgg -> Fry,hatching,kh,,3,\nFry + Feed <-> Fingerling,growing,kg,kb,1/2,1/4\n";

const INITIAL = "Egg = 2, Fry = 0, Feed = 1, Fingerling = 0";

describe("cli convert", () => {
  it("SBML → CSV keeps the initial values as the `# initial:` line", async () => {
    const r = await cli(["convert", "tank.xml", "--to", "csv"], { "tank.xml": HATCHERY });
    expect(r.code).toBe(0);
    expect(r.out).toBe(`# initial: ${INITIAL}\n${HATCHERY_CSV}`);
    expect(r.err).toBe("");
    // And back to SBML: the same initial concentrations.
    const sbml = await cli(["convert", "n.csv", "--to", "sbml"], { "n.csv": r.out });
    expect(sbml.out).toContain('<species id="Egg" compartment="compartment" initialConcentration="2"');
    expect(sbml.out).toContain('<species id="Fry" compartment="compartment" initialConcentration="0"');
  });

  it("SBML → text and CSV → SBML → CSV", async () => {
    const text = await cli(["convert", "tank.sbml", "--to", "text"], { "tank.sbml": HATCHERY });
    expect(text.out).toBe(`# initial: ${INITIAL}\nhatching: Egg -> Fry, kh = 3\ngrowing: Fry + Feed <-> Fingerling, kg = 1/2, kb = 1/4\n`);
    const sbml = await cli(["convert", "n.csv", "--to", "sbml"], { "n.csv": HATCHERY_CSV });
    expect(sbml.code).toBe(0);
    expect(sbml.out).toMatch(/<sbml xmlns="http:\/\/www.sbml.org\/sbml\/level3\/version2\/core" level="3" version="2">/);
    const back = await cli(["convert", "x", "--from", "sbml", "--to", "csv"], { x: sbml.out });
    expect(back.out).toBe(HATCHERY_CSV);
  });

  it("reads a reaction list by its extension, and the content decides without one", async () => {
    const a = await cli(["convert", "n.txt", "--to", "csv"], { "n.txt": "A <-> B, k1 = 2, k2\n" });
    expect(a.out).toBe("reaction,rate,reverse_rate,rate_value\nA <-> B,k1,k2,2\n");
    const b = await cli(["convert", "plain", "--to", "csv"], { plain: "A -> B\n" });
    expect(b.out).toBe("reaction,rate\nA -> B,k1\n");
  });

  it("reports refused reactions with their id and line and exits 2", async () => {
    const bad = HATCHERY.replace('<ci>kh</ci><ci>Egg</ci>', '<ci>kh</ci><apply><divide/><ci>Egg</ci><apply><plus/><ci>kh</ci><ci>Egg</ci></apply></apply>');
    const r = await cli(["convert", "bad.xml", "--to", "csv"], { "bad.xml": bad });
    expect(r.code).toBe(2);
    expect(r.out).toBe("");
    expect(r.err).toMatch(/bad\.xml \(SBML\): The network file has 1 problem:\n {2}line 22: <reaction id="hatch">: the kinetic law is not mass action: it divides by a sum/);
  });

  it("checks its options", async () => {
    expect((await cli(["convert", "n.csv"], { "n.csv": HATCHERY_CSV })).err).toMatch(/usage: convert FILE --to/);
    expect((await cli(["convert", "n.csv", "--to", "pdf"], { "n.csv": HATCHERY_CSV })).err).toMatch(/--to expects one of csv, sbml, text/);
    expect((await cli(["convert", "n.csv", "--to", "csv", "--from", "x"], { "n.csv": HATCHERY_CSV })).err).toMatch(/--from expects/);
  });

  it("analyse reads .xml directly and takes the file's initial concentrations", async () => {
    const r = await cli(["analyse", "tank.xml", "--json"], { "tank.xml": HATCHERY });
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.species).toEqual(["Egg", "Fry", "Feed", "Fingerling"]);
    expect(j.deficiency).toBe(0);
    expect(r.err).toMatch(/initial concentrations from the file: Egg=2,Fry=0,Feed=1,Fingerling=0/);
  });

  it("analyse takes a CSV's stored `# initial:` values the same way, and --initial overrides them", async () => {
    // A <-> B with k1 = 1, k2 = 3: at steady state A = 3B, and A + B is the total of the start (by hand).
    const csv = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,1,3\n# initial: A = 2, B = 0\n";
    const stored = await cli(["analyse", "ab.csv", "--json"], { "ab.csv": csv });
    expect(stored.code).toBe(0);
    expect(stored.err).toMatch(/initial concentrations from the file: A=2,B=0/);
    expect(JSON.parse(stored.out).steadyStates.map((x: { concentrations: unknown }) => x.concentrations)).toEqual([{ A: 1.5, B: 0.5 }]);
    const given = await cli(["analyse", "ab.csv", "--initial", "A=4", "--json"], { "ab.csv": csv });
    expect(given.err).not.toMatch(/from the file/);
    expect(JSON.parse(given.out).steadyStates.map((x: { concentrations: unknown }) => x.concentrations)).toEqual([{ A: 3, B: 1 }]);
  });

  it("runs as a real process: npm run -s cli -- convert FILE --to sbml", () => {
    const out = execFileSync("npm", ["run", "-s", "cli", "--", "convert", "tests/fixtures/sbml/hatchery.xml", "--to", "sbml"], { encoding: "utf8" });
    expect(out).toMatch(/<reaction id="hatching" name="hatching" reversible="false">/);
  });
});
