import { describe, expect, it } from "vitest";
import { formatProblem, formatNetworkCsv, parseNetworkCsv, stoichiometricMatrix, tryParseNetworkCsv } from "@domain/network/index";
import { analyseStructure } from "@domain/network/structure";
import { toIntegerRows } from "@domain/network/matrices";
import Papa from "papaparse";

const SCHLOEGL = "# constant: A = 1, B\nreaction,rate,reverse_rate\nA + 2X <-> 3X,k1,k2\nX <-> B,k3,k4\n";

const problemsOf = (text: string) => {
  const r = tryParseNetworkCsv(text);
  if (r.ok) throw new Error("expected problems");
  return r.problems.map(formatProblem);
};

describe("constant species", () => {
  it("leave the species list and the complexes; their part of the reactant is kept as `held`", () => {
    const net = parseNetworkCsv(SCHLOEGL);
    expect(net.species).toEqual(["X"]);
    expect(net.constants).toEqual([
      { name: "A", value: { num: 1n, den: 1n }, line: 1 },
      { name: "B", line: 1 },
    ]);
    expect(net.reactions.map((r) => [r.reactant, r.product, r.held ?? null])).toEqual([
      [{ X: 2 }, { X: 3 }, { A: 1 }],
      [{ X: 3 }, { X: 2 }, null],
      [{ X: 1 }, {}, null],
      [{}, { X: 1 }, { B: 1 }],
    ]);
    // Rows stay as written, so nothing is lost.
    expect(net.rows[0].left).toEqual({ A: 1, X: 2 });
  });

  it("carry through structure: Schlögl's second model reduces to complexes 2X, 3X, X, 0 (Schlögl, Z. Physik 253, 1972)", () => {
    const net = parseNetworkCsv(SCHLOEGL);
    expect(toIntegerRows(stoichiometricMatrix(net))).toEqual([[1, -1, -1, 1]]);
    const s = analyseStructure(net);
    expect(s.complexes).toEqual(["2X", "3X", "X", "0"]);
    // n = 4 complexes, ℓ = 2 linkage classes, s = 1: deficiency 4 − 2 − 1 = 1 (by hand).
    expect(s.deficiency).toBe(1);
    expect(s.conservationLaws).toEqual([]);
    expect(s.constants).toEqual([{ name: "A", value: "1" }, { name: "B" }]);
    expect(s.reactionList[0].held).toEqual({ A: 1 });
  });

  it("the file stays a plain CSV that papaparse reads with its comments option", () => {
    const parsed = Papa.parse<string[]>(SCHLOEGL, { comments: "#", skipEmptyLines: true });
    expect(parsed.data).toEqual([["reaction", "rate", "reverse_rate"], ["A + 2X <-> 3X", "k1", "k2"], ["X <-> B", "k3", "k4"]]);
  });

  it("are written back by the CSV formatter and read again unchanged", () => {
    const net = parseNetworkCsv("reaction,rate_value\n# a note\nATP + S -> ADP + P,2\n# constant: ATP = 5/2, ADP\n");
    const text = formatNetworkCsv(net);
    expect(text.split("\n")[0]).toBe("# constant: ATP = 5/2, ADP");
    const again = parseNetworkCsv(text);
    expect(again.species).toEqual(net.species);
    expect(again.constants?.map((c) => [c.name, c.value ?? null])).toEqual(net.constants?.map((c) => [c.name, c.value ?? null]));
    expect(again.reactions).toEqual(net.reactions.map((r) => ({ ...r, row: 3 })));
  });

  it("other comment lines stay comments", () => {
    const net = parseNetworkCsv("# Restored from version 1 as version 3.\nreaction\nA -> B\n");
    expect(net.constants).toBeUndefined();
    expect(net.species).toEqual(["A", "B"]);
  });

  it("report a bad declaration with line, column and what was expected", () => {
    expect(problemsOf("# constant: A = 0\nreaction\nA + X -> 2X\n")).toEqual([
      expect.stringMatching(/^line 1, column 13 \(constant\): the concentration `0` of `A` is not a positive number; expected a positive/),
    ]);
    expect(problemsOf("# constant: A = -1/2\nreaction\nA + X -> 2X\n")[0]).toMatch(/column 13 .*`-1\/2` of `A` is not a positive number/);
    expect(problemsOf("# constant: A = two\nreaction\nA + X -> 2X\n")[0]).toMatch(/`two` of `A` is not a positive number/);
    expect(problemsOf("# constant: A, Q\nreaction\nA + X -> 2X\n")).toEqual([
      "line 1, column 16 (constant): `Q` is declared constant but is not a species of any reaction; expected one of the species A, X",
    ]);
    expect(problemsOf("reaction\n# constant: A\nA + X -> 2X\n#constant: A = 2\n")).toEqual([
      "line 4, column 12 (constant): `A` is declared constant twice (first on line 2, column 13); expected each constant species declared once",
    ]);
    expect(problemsOf("# constant: 2A\nreaction\nA + X -> 2X\n")[0]).toMatch(/^line 1, column 13 \(constant\): `2A` is not a species declaration/);
    expect(problemsOf("# constant:\nreaction\nA + X -> 2X\n")[0]).toMatch(/names no species/);
    expect(problemsOf("# constant: A,,X\nreaction\nA + X -> 2X\n")[0]).toMatch(/column 15 .*empty entry/);
  });

  it("refuse a reaction that changes only constant species, and a rate symbol named like a constant", () => {
    expect(problemsOf("# constant: A, B\nreaction\nA -> B\nX -> 0\n")).toEqual([
      expect.stringMatching(/^line 3, column 1 \(reaction\): with A, B held constant, this reaction changes no other species/),
    ]);
    expect(problemsOf("# constant: A\nreaction,rate\nA + X -> 2X,A\n")[0]).toMatch(/rate symbol `A` is also a species name/);
  });
});
