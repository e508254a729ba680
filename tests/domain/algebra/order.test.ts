import { describe, expect, it } from "vitest";
import { AlgebraError, PolynomialRing, QQ, packMonomial, parseOrderSpec } from "@domain/algebra/index";

const cmpIn = (order: string, a: number[], b: number[]) => {
  const R = new PolynomialRing(["x", "y", "z"].slice(0, a.length), QQ, order);
  return Math.sign(R.cmp(packMonomial(a), 0, packMonomial(b), 0));
};

describe("monomial orders", () => {
  // Cox, Little, O'Shea, "Ideals, Varieties, and Algorithms", 4th ed., ch. 2 §2, Examples after
  // Definitions 3, 5, 6 (recalled from memory): x^1y^2z^3 vs x^3y^2z^0 etc.
  it("lex: (1,2,0) > (0,3,4) and (3,2,4) > (3,2,1)", () => {
    expect(cmpIn("lex", [1, 2, 0], [0, 3, 4])).toBe(1);
    expect(cmpIn("lex", [3, 2, 4], [3, 2, 1])).toBe(1);
  });
  it("grlex: (1,2,3) > (3,2,0) and (1,2,4) > (1,1,5)", () => {
    expect(cmpIn("grlex", [1, 2, 3], [3, 2, 0])).toBe(1);
    expect(cmpIn("grlex", [1, 2, 4], [1, 1, 5])).toBe(1);
  });
  it("grevlex: (4,7,1) > (4,2,3) and (1,5,2) > (4,1,3)", () => {
    expect(cmpIn("grevlex", [4, 7, 1], [4, 2, 3])).toBe(1);
    expect(cmpIn("grevlex", [1, 5, 2], [4, 1, 3])).toBe(1);
  });
  it("grevlex differs from grlex on x*z^2 vs y^3 (common practice example)", () => {
    expect(cmpIn("grlex", [1, 0, 2], [0, 3, 0])).toBe(1);
    expect(cmpIn("grevlex", [1, 0, 2], [0, 3, 0])).toBe(-1);
  });
  it("block order lex(1), grevlex(2) eliminates the first variable", () => {
    expect(cmpIn("lex(1), grevlex(2)", [1, 0, 0], [0, 5, 5])).toBe(1);
    expect(cmpIn("lex(1), grevlex(2)", [1, 2, 0], [1, 0, 2])).toBe(1);
  });
  it("weighted order compares weighted degree first", () => {
    expect(cmpIn("weighted(1,3,1)", [0, 1, 0], [2, 0, 0])).toBe(1);
    expect(cmpIn("weighted(1,3,1)", [2, 0, 0], [0, 0, 2])).toBe(1); // tie broken by reverse lex
  });
  it("equal monomials compare as 0 in every order", () => {
    for (const o of ["lex", "grlex", "grevlex", "lex(1), grlex(2)", "weighted(2,1,1)"]) expect(cmpIn(o, [1, 2, 3], [1, 2, 3])).toBe(0);
  });

  it("parses specs and reports located errors", () => {
    expect(parseOrderSpec("lex(9), grevlex(15)")).toEqual([{ kind: "lex", size: 9 }, { kind: "grevlex", size: 15 }]);
    expect(parseOrderSpec("GREVLEX")).toEqual([{ kind: "grevlex" }]);
    expect(parseOrderSpec("lex(2), grevlex")).toEqual([{ kind: "lex", size: 2 }, { kind: "grevlex" }]);
    expect(() => parseOrderSpec("lexx")).toThrow(/unknown order 'lexx'.*column 1/);
    expect(() => parseOrderSpec("lex(2), foo(3)")).toThrow(/column 9/);
    expect(() => parseOrderSpec("lex(0)")).toThrow(AlgebraError);
    expect(() => new PolynomialRing(["x", "y"], QQ, "lex(1), grevlex(2)")).toThrow(/cover 3 variables but the ring has 2/);
    expect(() => parseOrderSpec("grevlex, lex(2)")).toThrow(/needs a size/);
  });
});
