import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import { mapToRing, monomialOf, saturate } from "@domain/steady-state/ideal";

describe("ideal helpers", () => {
  const R = new PolynomialRing(["x", "y", "k"], QQ, "lex(2), grevlex(1)");
  it("saturating ⟨x·y − x·k⟩ by x·y removes the boundary component x = 0 (CLO ch. 4 §4)", () => {
    expect(saturate([R.parse("x*y - x*k")], monomialOf(R, [0, 1])).map((p) => R.format(p))).toEqual(["y - k"]);
  });
  it("maps polynomials between rings by variable name", () => {
    const S = new PolynomialRing(["k", "y", "x"], QQ, "lex");
    expect(S.format(mapToRing(R.parse("x*y + k"), S))).toBe("k + y*x");
  });
});
