import { describe, expect, it } from "vitest";
import { compareBases, normaliseBasis } from "../../../bench/lib/normalise";
import { compareMonomials } from "../../../bench/lib/poly";

describe("monomial orders (Cox, Little and O'Shea, Ideals, Varieties, and Algorithms, ch. 2 §2)", () => {
  it("orders x*z and y^2 differently in lex and grevlex, variables x > y > z", () => {
    expect(compareMonomials("lex", [1, 0, 1], [0, 2, 0])).toBeGreaterThan(0);
    expect(compareMonomials("grevlex", [1, 0, 1], [0, 2, 0])).toBeLessThan(0);
    expect(compareMonomials("grlex", [1, 0, 1], [0, 2, 0])).toBeGreaterThan(0);
  });
  it("compares block orders block by block (elimination order)", () => {
    const blocks = [
      { order: "lex", size: 1 },
      { order: "grevlex", size: 2 },
    ] as const;
    expect(compareMonomials(blocks, [1, 0, 0], [0, 5, 5])).toBeGreaterThan(0);
    expect(compareMonomials(blocks, [0, 1, 1], [0, 0, 2])).toBeGreaterThan(0);
  });
});

describe("normaliseBasis", () => {
  const vars = ["x", "y", "z"];
  it("makes each element monic for the given order and sorts the list", () => {
    // Singular prints the integer multiple, SymPy the monic element; both become the same text.
    expect(normaliseBasis(["4*x^2-6*x*y+3", "2*y - 1"], vars, "grevlex")).toEqual(["x^2 - 3/2*x*y + 3/4", "y - 1/2"]);
    // Under grevlex y^2 leads x*z; under lex x*z leads.
    expect(normaliseBasis(["2*x*z + 4*y^2"], vars, "grevlex")).toEqual(["y^2 + 1/2*x*z"]);
    expect(normaliseBasis(["2*x*z + 4*y^2"], vars, "lex")).toEqual(["x*z + 2*y^2"]);
  });
  it("reduces into [0, p) over Z/p (1/2 is 4 mod 7)", () => {
    expect(normaliseBasis(["2*x + 1", "-y"], vars, "lex", 7n)).toEqual(["x + 4", "y"]);
  });
  it("skips blank and comment lines", () => {
    expect(normaliseBasis(["", "# note", "z"], vars, "lex")).toEqual(["z"]);
  });
});

describe("compareBases", () => {
  it("lists what only one side has", () => {
    expect(compareBases(["x", "y"], ["y", "x"]).equal).toBe(true);
    const c = compareBases(["x"], ["x", "y"]);
    expect(c).toEqual({ equal: false, onlyInFirst: [], onlyInSecond: ["y"] });
  });
});
