import { describe, expect, it } from "vitest";
import { AlgebraError, PolynomialRing, QQ, countSolutions, eliminate, isZeroDimensional, primeField, saturate, standardMonomials } from "@domain/algebra/index";
import type { Field } from "@domain/algebra/index";
import { cyclic, katsura } from "../../fixtures/algebra/systems";

const Q3 = new PolynomialRing(["t", "x", "y", "z"], QQ, "grevlex");
const fmt = (ps: { ring: PolynomialRing<unknown> }[] & unknown[]) => ps.map((p) => (p as never as { ring: PolynomialRing<unknown> }).ring.format(p as never));

describe("elimination", () => {
  // Implicitisation of the twisted cubic (t, t^2, t^3): Cox, Little, O'Shea, "Ideals, Varieties,
  // and Algorithms", 4th ed., ch. 3 §3 (the ideal <y - x^2, z - x^3> of ch. 1 §4), here as
  // grevlex reduced basis {x^2 - y, x*y - z, y^2 - x*z} (derived, and checked below by substitution).
  it("twisted cubic", () => {
    const G = eliminate(["x - t", "y - t^2", "z - t^3"].map((s) => Q3.parse(s)), ["t"]);
    expect(new Set(fmt(G as never))).toEqual(new Set(["x^2 - y", "x*y - z", "y^2 - x*z"]));
    expect(G.every((g) => g.ring === Q3)).toBe(true);
  });
  it("works with the block order of a ring (species first, parameters last)", () => {
    const R = new PolynomialRing(["a", "b", "k"], QQ, "lex(2), grevlex(1)");
    const G = eliminate([R.parse("a - k*b"), R.parse("a + b - 1")], ["a"]);
    expect(fmt(G as never)).toEqual(["b*k + b - 1"]);
  });
});

describe("saturation", () => {
  it("<x*y> : y^∞ = <x> and <x^2*y, x*y^2> : (x*y)^∞ = <1>", () => {
    const R = new PolynomialRing(["x", "y"], QQ, "grevlex");
    expect(fmt(saturate([R.parse("x*y")], R.parse("y")) as never)).toEqual(["x"]);
    expect(fmt(saturate([R.parse("x^2*y"), R.parse("x*y^2")], R.parse("x*y")) as never)).toEqual(["1"]);
    // Removing the component x = 0 from {x*(x - 1), x*y}: what is left is the point (1, 0).
    expect(fmt(saturate([R.parse("x^2 - x"), R.parse("x*y")], R.parse("x")) as never)).toEqual(["y", "x - 1"]);
  });
});

describe("zero-dimensional ideals and solution counts", () => {
  it("simple cases", () => {
    const R = new PolynomialRing(["x", "y"], QQ, "grevlex");
    const P = (s: string[]) => s.map((x) => R.parse(x));
    expect(isZeroDimensional(P(["x^2 - 1", "y^2 - 1"]))).toBe(true);
    expect(isZeroDimensional(P(["x*y"]))).toBe(false);
    expect(countSolutions(P(["x^2 - 1", "y - x"]))).toBe(2);
    expect(countSolutions(P(["x^2", "y"]))).toBe(2); // a double point
    expect(standardMonomials(P(["x^2", "y^2"]))).toEqual([[0, 0], [0, 1], [1, 0], [1, 1]]);
    expect(() => countSolutions(P(["x*y"]))).toThrow(AlgebraError);
    expect(countSolutions(P(["x", "x - 1"]))).toBe(0);
  });
  // Solution counts (with multiplicity) recalled from memory: katsura-n has 2^n (Bézout bound
  // attained), cyclic-5 has 70; cyclic-4 is positive-dimensional.
  it("katsura-3/4 have 8 and 16 solutions, cyclic-5 has 70, cyclic-4 is not zero-dimensional", () => {
    for (const [sys, count] of [[katsura(3), 8], [katsura(4), 16], [cyclic(5), 70]] as const) {
      for (const field of [QQ, primeField(32003)] as Field<unknown>[]) {
        const R = new PolynomialRing(sys.vars, field, "grevlex");
        expect(countSolutions(sys.polys.map((s) => R.parse(s)))).toBe(count);
      }
    }
    const c4 = cyclic(4);
    const R = new PolynomialRing(c4.vars, QQ, "grevlex");
    expect(isZeroDimensional(c4.polys.map((s) => R.parse(s)))).toBe(false);
  });
});
