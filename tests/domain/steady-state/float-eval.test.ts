import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import { evaluateFloat, floatSystem } from "@domain/steady-state/float-eval";

describe("float evaluation of exact polynomials", () => {
  it("values and Jacobian: [x² − y] at (2, 1) is [3] with Jacobian [[4, −1]]", () => {
    const R = new PolynomialRing(["x", "y"], QQ, "lex");
    const s = floatSystem([R.parse("x^2 - y")], [0, 1]);
    expect(s.values([2, 1])).toEqual([3]);
    expect(s.jacobian([2, 1])).toEqual([[4, -1]]);
    expect(evaluateFloat(R.parse("x/3"), [1, 0])).toBeCloseTo(1 / 3, 15);
  });
});
