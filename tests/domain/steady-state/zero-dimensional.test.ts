import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import { isZeroDimensional, positiveSolutions } from "@domain/steady-state/zero-dimensional";

const ring = (vars: string[]) => new PolynomialRing(vars, QQ, "lex");

describe("positive solutions of zero-dimensional systems", () => {
  it("shape position: x·y = 2, x + y = 3", () => {
    const R = ring(["x", "y"]);
    const r = positiveSolutions(["x*y - 2", "x + y - 3"].map((s) => R.parse(s)));
    expect(r.status).toBe("finite");
    expect(r.points).toEqual([[2, 1], [1, 2]]);
  });

  it("not in shape position: x² = 2, y² = 3 needs a separating linear form; √2, √3 to 1e-15", () => {
    const R = ring(["x", "y"]);
    const r = positiveSolutions(["x^2 - 2", "y^2 - 3"].map((s) => R.parse(s)));
    expect(r.points).toHaveLength(1);
    expect(Math.abs(r.points[0][0] - Math.SQRT2)).toBeLessThan(1e-15 * Math.SQRT2);
    expect(Math.abs(r.points[0][1] - Math.sqrt(3))).toBeLessThan(1e-15 * Math.sqrt(3));
  });

  it("drops boundary and negative solutions, reports the empty and positive-dimensional cases", () => {
    const R = ring(["x"]);
    expect(positiveSolutions([R.parse("x*(x - 1)*(x + 2)")]).points).toEqual([[1]]);
    expect(positiveSolutions([R.parse("x^2 + 1")]).points).toEqual([]);
    expect(positiveSolutions([R.parse("x")]).status).toBe("empty");
    const R2 = ring(["x", "y"]);
    expect(positiveSolutions([R2.parse("x - y")]).status).toBe("positive-dimensional");
    expect(isZeroDimensional([R2.parse("x - y"), R2.parse("y^2 - 1")])).toBe(true);
  });

  it("multiple roots count once: (x − 1)²·(x − 3) gives 1 and 3", () => {
    const R = ring(["x"]);
    expect(positiveSolutions([R.parse("(x - 1)^2*(x - 3)")]).points).toEqual([[1], [3]]);
  });

  it("non-radical ideals: multiple points are passed to the radical first (Seidenberg's lemma)", () => {
    const R = ring(["x", "y", "z"]);
    expect(positiveSolutions(["(x-1)^2", "(y-2)^2*(y-3)", "z*x - y"].map((t) => R.parse(t))).points).toEqual([[1, 2, 2], [1, 3, 3]]);
    const r = positiveSolutions(["(x-1)^2*(x-2)", "(y-x)^3", "z^2-x"].map((t) => R.parse(t))).points;
    expect(r).toHaveLength(2);
    expect(r[0]).toEqual([1, 1, 1]);
    expect(r[1][2]).toBeCloseTo(Math.SQRT2, 15);
  });
});
