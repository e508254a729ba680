import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "../../../../domain/network/index";
import { formatSbml, readSbml } from "../../../../domain/network/sbml/index";
import { analyseStructure } from "../../../../domain/network/index";
import { rational } from "../../../../domain/algebra/rational";
import { roundTripCorpus } from "./demo-corpus";
import { networkSignature } from "./network-signature";

/**
 * Checks against libSBML (the SBML team's reference library; Debian's libsbml5-perl 5.19.7 and
 * libsbml5-examples), outside the project: every export passes its consistency checks with zero
 * errors, and its shipped example models import or are refused with a reason, none crashes.
 */
const CHECKER = join(__dirname, "../../../support/libsbml-check.pl");
const hasLibSbml = spawnSync("perl", ["-MLibSBML", "-e", "1"]).status === 0;
const EXAMPLES = "/usr/share/doc/libsbml5-examples/examples";
const hasExamples = existsSync(EXAMPLES);

function libsbmlCheck(text: string): { version: string; warnings: number; errors: { line: number; message: string }[] } {
  const r = spawnSync("perl", [CHECKER], { input: text, encoding: "utf8" });
  if (r.status !== 0) throw new Error(`libsbml-check.pl failed: ${r.stderr}`);
  return JSON.parse(r.stdout);
}

const LIBSBML_VERSION = hasLibSbml ? spawnSync("perl", ["-MLibSBML", "-e", "print LibSBML::getLibSBMLDottedVersion()"], { encoding: "utf8" }).stdout : "not installed";

describe.skipIf(!hasLibSbml)(`exports checked by libSBML ${LIBSBML_VERSION} (Debian libsbml5-perl)`, () => {
  it("is libSBML 5.x, the version the checker reports", () => {
    expect(libsbmlCheck(formatSbml(parseNetworkCsv("reaction\nA -> B\n"))).version).toBe(LIBSBML_VERSION);
    expect(LIBSBML_VERSION).toMatch(/^5\./);
  });

  it.each(roundTripCorpus())("$name: zero consistency errors", ({ csv }) => {
    const net = parseNetworkCsv(csv);
    const initial = new Map(net.species.map((s, i) => [s, rational(BigInt(i + 1), 3n)]));
    const result = libsbmlCheck(formatSbml(net, { name: "check", initial }));
    expect(result.errors).toEqual([]);
  });

  it("accepts held species (boundaryCondition and constant true) as reactants and products, given or symbolic", () => {
    const net = parseNetworkCsv("reaction,rate,reverse_rate,rate_value\nA + 2X <-> 3X,k1,k2,3/2\nX <-> B,k3,k4,\n# constant: A = 1/3, B\n# initial: X = 7/10\n");
    const out = formatSbml(net, { name: "held" });
    expect(out).toContain('boundaryCondition="true" constant="true"');
    expect(libsbmlCheck(out).errors).toEqual([]);
    // The same species declared constant but not boundary may not take part in a reaction: libSBML says so.
    expect(libsbmlCheck(out.replace('id="A" compartment="compartment" hasOnlySubstanceUnits="false" boundaryCondition="true"', 'id="A" compartment="compartment" hasOnlySubstanceUnits="false" boundaryCondition="false"')).errors.length).toBeGreaterThan(0);
  });

  it("catches a broken file (the checker is not blind)", () => {
    const broken = formatSbml(parseNetworkCsv("reaction\nA -> B\n")).replace('compartment="compartment"', 'compartment="nowhere"');
    expect(libsbmlCheck(broken).errors.length).toBeGreaterThan(0);
  });
});

/** Which shipped example models import (mass action) and which are refused, and why. */
const EXPECTED: Record<string, "import" | RegExp> = {
  "r/species_initial_values.xml": /no reactions/,
  "sample-models/arrays/arrays1.xml": /package \(marked required\)/,
  "sample-models/arrays/arrays2.xml": /package \(marked required\)/,
  "sample-models/dyn/dyn_example1.xml": /package \(marked required\)/,
  "sample-models/dyn/dyn_example2.xml": /package \(marked required\)/,
  "sample-models/fbc/fbc_example1.xml": /no kinetic law/,
  "sample-models/from-spec/level-2/algebraicrules.xml": /assignmentRule|algebraicRule/,
  "sample-models/from-spec/level-2/assignmentrules.xml": /assignmentRule/,
  "sample-models/from-spec/level-2/boundarycondition.xml": /`S1` is a boundary species \(boundaryCondition="true", constant="false"\) whose value the rateRule/,
  "sample-models/from-spec/level-2/delay.xml": /rateRule|no reactions/,
  "sample-models/from-spec/level-2/dimerization.xml": /hasOnlySubstanceUnits/,
  "sample-models/from-spec/level-2/enzymekinetics.xml": "import",
  "sample-models/from-spec/level-2/events.xml": /rateRule|events|no reactions/,
  "sample-models/from-spec/level-2/functiondef.xml": /calls the function `f`/,
  "sample-models/from-spec/level-2/multicomp.xml": /transport/,
  "sample-models/from-spec/level-2/overdetermined.xml": /algebraicRule/,
  "sample-models/from-spec/level-2/twodimensional.xml": /fast reaction/,
  "sample-models/from-spec/level-2/units.xml": /divides by a sum/,
  "sample-models/from-spec/level-3/algebraicrules.xml": /assignmentRule|algebraicRule/,
  "sample-models/from-spec/level-3/assignmentrules.xml": /assignmentRule/,
  "sample-models/from-spec/level-3/boundarycondition.xml": /`S1` is a boundary species \(boundaryCondition="true", constant="false"\) whose value the rateRule/,
  "sample-models/from-spec/level-3/conversionfactor1.xml": /conversion factor/,
  "sample-models/from-spec/level-3/conversionfactor2.xml": /conversion factor/,
  "sample-models/from-spec/level-3/delay.xml": /rateRule|no reactions/,
  "sample-models/from-spec/level-3/dimerization.xml": /hasOnlySubstanceUnits/,
  "sample-models/from-spec/level-3/enzymekineticext.xml": "import",
  "sample-models/from-spec/level-3/enzymekinetics.xml": "import",
  "sample-models/from-spec/level-3/events.xml": /rateRule|events|no reactions/,
  "sample-models/from-spec/level-3/fullydeterminedevent.xml": /algebraicRule|events/,
  "sample-models/from-spec/level-3/functiondef.xml": /calls the function `f`/,
  "sample-models/from-spec/level-3/membrane.xml": /calls the function `MM_enzyme`/,
  "sample-models/from-spec/level-3/multicomp.xml": /transport/,
  "sample-models/from-spec/level-3/overdetermined.xml": /algebraicRule/,
  "sample-models/from-spec/level-3/twoalgebraicrules.xml": /algebraicRule/,
  "sample-models/from-spec/level-3/twodimensional.xml": /fast reaction/,
  "sample-models/multi/Ecad.xml": /package \(marked required\)/,
  "sample-models/multi/YeastMAPK.xml": /package \(marked required\)/,
  "sample-models/multi/multi_example1.xml": /package \(marked required\)/,
  "sample-models/render/simple-L2-layout.xml": "import",
  "sample-models/render/simple-L2-render-global.xml": "import",
  "sample-models/render/simple-L2-render-local.xml": "import",
  "sample-models/render/simple-L2.xml": "import",
};

function xmlFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? xmlFiles(p) : f.endsWith(".xml") ? [p] : [];
  });
}

describe.skipIf(!hasExamples)("example models shipped with libSBML (libsbml5-examples)", () => {
  const files = hasExamples ? xmlFiles(EXAMPLES).map((f) => relative(EXAMPLES, f)).sort() : [];

  it("lists every shipped model in the expectations", () => {
    expect(files).toEqual(Object.keys(EXPECTED).sort());
  });

  it.each(files)("%s imports or is refused with its reason", (file) => {
    const r = readSbml(readFileSync(join(EXAMPLES, file), "utf8"));
    const expected = EXPECTED[file];
    if (expected === "import") {
      expect(r.problems).toEqual([]);
      // Mass action imported: the structure analysis runs on it like on any uploaded network.
      const s = analyseStructure(r.network!);
      expect(s.species.length).toBeGreaterThan(0);
      expect(s.deficiency).toBeGreaterThanOrEqual(0);
    } else {
      expect(r.network).toBeUndefined();
      expect(r.problems.length).toBeGreaterThan(0);
      expect(r.problems.map((p) => p.message).join("\n")).toMatch(expected);
      for (const p of r.problems) expect(p.row).toBeGreaterThan(0);
    }
  });

  it.each(Object.entries(EXPECTED).filter(([, v]) => v === "import").map(([f]) => f))("%s: imported, exported, checked by libSBML and read back the same", (file) => {
    const first = readSbml(readFileSync(join(EXAMPLES, file), "utf8"));
    const out = formatSbml(first.network!, { initial: first.initial });
    if (hasLibSbml) expect(libsbmlCheck(out).errors).toEqual([]);
    const again = readSbml(out);
    expect(networkSignature(again.network!)).toEqual(networkSignature(first.network!));
    expect([...again.initial].map(([k, v]) => `${k}=${v.num}/${v.den}`).sort()).toEqual([...first.initial].map(([k, v]) => `${k}=${v.num}/${v.den}`).sort());
  });

  it("reads the Level 2 enzyme-kinetics example as E + S <-> ES -> E + P with its constants (as the file states)", () => {
    const r = readSbml(readFileSync(join(EXAMPLES, "sample-models/from-spec/level-2/enzymekinetics.xml"), "utf8"));
    // Values as written in the shipped file (kon = 1000000, koff = 0.2, kcat = 0.1; initial amounts
    // E = 5e-21, S = 1e-20 in a compartment of size 1e-14), kept exact.
    expect(r.csv).toBe(
      "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value\nS + E <-> ES,veq,kon,koff,1000000,1/5\nES -> P + E,vcat,kcat,,1/10,\n# initial: E = 1/2000000, S = 1/1000000, ES = 0, P = 0\n",
    );
  });
});
