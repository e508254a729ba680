import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { fromInt, parseRational } from "../../../domain/algebra/rational";
import { matrixFromRationals, rank } from "../../../domain/linear";
import { analyseStructure, parseNetworkCsv } from "../../../domain/network";
import { seededRandom } from "../../support/prng";
import { randomNetworkCsv } from "./random-network";

const fixture = (name: string) => readFileSync(join(__dirname, "../../fixtures/networks", name), "utf8");
const analyse = (name: string) => analyseStructure(parseNetworkCsv(fixture(name)));

describe("analyseStructure on published examples", () => {
  it("Michaelis–Menten E + S <-> C -> E + P", () => {
    // Facts: rank 2, deficiency 0, not weakly reversible, laws E + C and S + C + P
    // (mechanism: Michaelis & Menten, Biochem. Z. 49 (1913); Briggs & Haldane, Biochem. J. 19 (1925);
    // deficiency/weak reversibility by the definitions of Feinberg, Chem. Eng. Sci. 42 (1987), worked by hand).
    const s = analyse("michaelis-menten.csv");
    expect(s.species).toEqual(["E", "S", "C", "P"]);
    expect(s.complexes).toEqual(["E + S", "C", "E + P"]);
    expect(s.reactions).toBe(3);
    expect(s.complexComposition).toEqual([
      [1, 0, 1],
      [1, 0, 0],
      [0, 1, 0],
      [0, 0, 1],
    ]);
    expect(s.incidenceMatrix).toEqual([
      [-1, 1, 0],
      [1, -1, -1],
      [0, 0, 1],
    ]);
    expect(s.stoichiometricMatrix).toEqual([
      [-1, 1, 1],
      [-1, 1, 0],
      [1, -1, -1],
      [0, 0, 1],
    ]);
    expect(s.rank).toBe(2);
    expect(s.linkageClasses).toBe(1);
    expect(s.linkageClassMembers).toEqual([["E + S", "C", "E + P"]]);
    expect(s.strongLinkageClasses).toEqual([["E + S", "C"], ["E + P"]]);
    expect(s.terminalStrongLinkageClasses).toEqual([["E + P"]]);
    expect(s.weaklyReversible).toBe(false);
    expect(s.reversible).toBe(false);
    expect(s.deficiency).toBe(0);
    expect(s.conservationLaws).toEqual([{ E: 1, C: 1 }, { S: 1, C: 1, P: 1 }]);
    expect(s.minimalSemiPositiveConservationLaws).toEqual([{ E: 1, C: 1 }, { S: 1, C: 1, P: 1 }]);
    expect(s.conservative).toBe(true);
    // Deficiency zero theorem (Feinberg 1987), not weakly reversible: no positive steady state.
    expect(s.deficiencyZeroTheorem.applies).toBe(true);
    expect(s.deficiencyZeroTheorem.conclusions.join(" ")).toContain("no positive steady state");
    expect(s.deficiencyZeroTheorem.assumptions.length).toBeGreaterThan(0);
    expect(s.reactionList[1]).toEqual({ id: "r2", label: "binding", reactant: "C", product: "E + S", rate: "km1", row: 3 });
  });

  it("two-site distributive phosphorylation (Wang & Sontag, J. Math. Biol. 57 (2008))", () => {
    // Wang & Sontag 2008: 9 species, 12 reactions, totals of kinase E, phosphatase F and substrate.
    // Deficiency 2 (recalled from memory; 10 complexes − 2 linkage classes − rank 6, worked by hand).
    const s = analyse("two-site-phosphorylation.csv");
    expect(s.species).toHaveLength(9);
    expect(s.reactions).toBe(12);
    expect(s.complexes).toHaveLength(10);
    expect(s.linkageClasses).toBe(2);
    expect(s.rank).toBe(6);
    expect(s.deficiency).toBe(2);
    expect(s.weaklyReversible).toBe(false);
    expect(s.conservationLaws).toEqual([
      { S0: 1, S0E: 1, S1: 1, S1E: 1, S2: 1, S2F: 1, S1F: 1 },
      { E: 1, S0E: 1, S1E: 1 },
      { F: 1, S2F: 1, S1F: 1 },
    ]);
    expect(s.minimalSemiPositiveConservationLaws).toHaveLength(3);
    expect(s.conservative).toBe(true);
    expect(s.terminalStrongLinkageClasses).toEqual([["E + S2"], ["F + S0"]]);
    expect(s.linkageClassDeficiencies).toEqual([0, 0]);
    expect(s.deficiencyZeroTheorem.applies).toBe(false);
    expect(s.deficiencyOneTheorem.applies).toBe(false);
  });

  it("Shinar–Feinberg ACR network (Science 327 (2010)): deficiency one", () => {
    // Shinar & Feinberg 2010: deficiency one, two non-terminal complexes XT and XT + Yp that
    // differ only in Yp (hypotheses of their ACR theorem; network recalled from memory).
    const s = analyse("shinar-feinberg-acr.csv");
    expect(s.species).toEqual(["XD", "X", "XT", "Xp", "Y", "XpY", "Yp", "XTYp"]);
    expect(s.complexes).toHaveLength(10);
    expect(s.linkageClasses).toBe(3);
    expect(s.rank).toBe(6);
    expect(s.deficiency).toBe(1);
    expect(s.weaklyReversible).toBe(false);
    expect(s.terminalStrongLinkageClasses).toEqual([["Xp"], ["X + Yp"], ["XT + Y"]]);
    const terminal = new Set(s.terminalStrongLinkageClasses.flat());
    expect(terminal.has("XT")).toBe(false);
    expect(terminal.has("XT + Yp")).toBe(false);
    expect(s.complexes).toEqual(expect.arrayContaining(["XT", "XT + Yp"]));
    expect(s.conservationLaws).toEqual([
      { XD: 1, X: 1, XT: 1, Xp: 1, XpY: 1, XTYp: 1 },
      { Y: 1, XpY: 1, Yp: 1, XTYp: 1 },
    ]);
    expect(s.deficiencyZeroTheorem.applies).toBe(false);
    // Linkage-class deficiencies 0, 0, 0 sum to 0 ≠ 1: the deficiency one theorem does not apply.
    expect(s.linkageClassDeficiencies).toEqual([0, 0, 0]);
    expect(s.deficiencyOneTheorem.applies).toBe(false);
  });

  it("weakly reversible triangle A <-> B <-> C <-> A: deficiency zero theorem's positive verdict", () => {
    // Deficiency zero theorem (Feinberg 1987; Horn & Jackson, Arch. Rational Mech. Anal. 47 (1972)):
    // weakly reversible with δ = 0 ⇒ one positive, complex-balanced, stable steady state per class.
    const s = analyse("triangle.csv");
    expect(s.complexes).toEqual(["A", "B", "C"]);
    expect(s.reactions).toBe(6);
    expect(s.rank).toBe(2);
    expect(s.deficiency).toBe(0);
    expect(s.weaklyReversible).toBe(true);
    expect(s.reversible).toBe(true);
    expect(s.conservationLaws).toEqual([{ A: 1, B: 1, C: 1 }]);
    expect(s.terminalStrongLinkageClasses).toEqual([["A", "B", "C"]]);
    const v = s.deficiencyZeroTheorem;
    expect(v.applies).toBe(true);
    expect(v.conclusions.join(" ")).toContain("exactly one positive steady state");
    expect(v.conclusions.join(" ")).toContain("complex balanced");
    expect(v.conclusions.join(" ")).toContain("asymptotically stable");
    expect(v.assumptions.join(" ")).toContain("Mass-action");
    expect(v.sources.join(" ")).toContain("Feinberg");
    expect(s.deficiencyOneTheorem.applies).toBe(true);
  });

  it("cycle A -> B -> C -> A is weakly reversible but not reversible", () => {
    // Definition of weak reversibility: Feinberg 1987 (each reaction lies on a directed cycle).
    const s = analyse("cycle.csv");
    expect(s.weaklyReversible).toBe(true);
    expect(s.reversible).toBe(false);
    expect(s.deficiency).toBe(0);
  });

  it("cubic autocatalysis 0 <-> X, 2X <-> 3X: deficiency one, open, neither theorem applies", () => {
    // Worked by hand: complexes 0, X, 2X, 3X (n = 4), ℓ = 2, s = 1, δ = 1; the fixture's constants give
    // three positive steady states, consistent with neither deficiency theorem applying.
    const s = analyse("cubic-autocatalysis.csv");
    expect(s.complexes).toEqual(["0", "X", "2X", "3X"]);
    expect(s.rank).toBe(1);
    expect(s.linkageClasses).toBe(2);
    expect(s.deficiency).toBe(1);
    expect(s.weaklyReversible).toBe(true);
    expect(s.conservationLaws).toEqual([]);
    expect(s.minimalSemiPositiveConservationLaws).toEqual([]);
    expect(s.conservative).toBe(false);
    expect(s.linkageClassDeficiencies).toEqual([0, 0]);
    expect(s.deficiencyZeroTheorem.applies).toBe(false);
    expect(s.deficiencyOneTheorem.applies).toBe(false);
    expect(s.reactionList.map((r) => r.rateValue)).toEqual(["6", "11", "6", "1"]);
  });

  it("Lotka–Volterra A -> 2A, A + B -> 2B, B -> 0: deficiency one, no conservation law", () => {
    // Scheme: Lotka, J. Am. Chem. Soc. 42 (1920); structural numbers worked by hand from the
    // definitions of Feinberg 1987: n = 6, ℓ = 3, s = 2, δ = 1.
    const s = analyseStructure(parseNetworkCsv("reaction\nA -> 2A\nA + B -> 2B\nB -> 0\n"));
    expect(s.complexes).toEqual(["A", "2A", "A + B", "2B", "B", "0"]);
    expect([s.rank, s.linkageClasses, s.deficiency]).toEqual([2, 3, 1]);
    expect(s.weaklyReversible).toBe(false);
    expect(s.terminalStrongLinkageClasses).toEqual([["2A"], ["2B"], ["0"]]);
    expect(s.conservationLaws).toEqual([]);
  });

  it("Edelstein's network A <-> 2A, A + B <-> C <-> B: deficiency one, weakly reversible", () => {
    // Network: Edelstein, J. Theor. Biol. 29 (1970) (recalled from memory); numbers worked by hand:
    // n = 5, ℓ = 2, s = 2, δ = 1, one law B + C.
    const s = analyseStructure(parseNetworkCsv("reaction\nA <-> 2A\nA + B <-> C\nC <-> B\n"));
    expect([s.complexes.length, s.linkageClasses, s.rank, s.deficiency]).toEqual([5, 2, 2, 1]);
    expect(s.weaklyReversible).toBe(true);
    expect(s.conservationLaws).toEqual([{ B: 1, C: 1 }]);
    expect(s.linkageClassDeficiencies).toEqual([0, 0]);
    expect(s.deficiencyOneTheorem.applies).toBe(false);
  });

  it("single-site futile cycle: deficiency one, three conservation laws", () => {
    // S + E <-> ES -> P + E, P + F <-> FP -> S + F; laws for enzyme, phosphatase and substrate totals
    // as in Wang & Sontag 2008 (one-site case); n = 6, ℓ = 2, s = 3, δ = 1 worked by hand.
    const s = analyseStructure(parseNetworkCsv("reaction\nS + E <-> ES\nES -> P + E\nP + F <-> FP\nFP -> S + F\n"));
    expect(s.species).toEqual(["S", "E", "ES", "P", "F", "FP"]);
    expect([s.complexes.length, s.linkageClasses, s.rank, s.deficiency]).toEqual([6, 2, 3, 1]);
    expect(s.conservationLaws).toEqual([{ S: 1, ES: 1, P: 1, FP: 1 }, { E: 1, ES: 1 }, { F: 1, FP: 1 }]);
    expect(s.conservative).toBe(true);
  });

  it("matches SymPy's rank and left kernel on every valid fixture and 100 seeded random networks", () => {
    // Reference: Debian python3-sympy 1.11, Matrix.rank() and Matrix.T.nullspace(); the two
    // kernels agree when stacking them does not raise the rank.
    const names = ["michaelis-menten.csv", "two-site-phosphorylation.csv", "shinar-feinberg-acr.csv", "triangle.csv", "cycle.csv", "cubic-autocatalysis.csv", "format-features.csv"];
    const rand = seededRandom(77);
    const results = [
      ...names.map(analyse),
      ...Array.from({ length: 100 }, () => analyseStructure(parseNetworkCsv(randomNetworkCsv(rand)))),
    ];
    const script = [
      "import json, sys",
      "from sympy import Matrix",
      "out = []",
      "for m in json.load(sys.stdin):",
      "    M = Matrix(m)",
      "    out.append({'rank': M.rank(), 'kernel': [[str(x) for x in v] for v in M.T.nullspace()]})",
      "print(json.dumps(out))",
    ].join("\n");
    const reference: { rank: number; kernel: string[][] }[] = JSON.parse(
      execFileSync("/usr/bin/python3", ["-c", script], { input: JSON.stringify(results.map((s) => s.stoichiometricMatrix)), encoding: "utf8" }),
    );
    results.forEach((s, k) => {
      const ref = reference[k];
      expect(s.rank, `network ${k}`).toBe(ref.rank);
      expect(s.conservationLaws.length, `network ${k}`).toBe(ref.kernel.length);
      if (ref.kernel.length === 0) return;
      const ours = s.conservationLaws.map((law) => s.species.map((sp) => fromInt(law[sp] ?? 0)));
      const theirs = ref.kernel.map((v) => v.map((x) => parseRational(x)!));
      expect(rank(matrixFromRationals([...ours, ...theirs]))).toBe(ref.kernel.length);
    });
  });

  it("is plain JSON data", () => {
    const s = analyse("format-features.csv");
    expect(JSON.parse(JSON.stringify(s))).toEqual(s);
  });
});
