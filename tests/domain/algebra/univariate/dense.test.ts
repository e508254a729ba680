import { describe, expect, it } from "vitest";
import { eq, formatRational } from "@domain/algebra/rational";
import {
  UnivariateError,
  addInt,
  addRat,
  degree,
  derivative,
  evaluate,
  formatPoly,
  fromIntegerCoefficients,
  fromRationalCoefficients,
  fromRoots,
  mulInt,
  mulRat,
  reflect,
  signAt,
  subInt,
  subRat,
  toIntegerPrimitive,
  toRationalCoefficients,
} from "@domain/algebra/univariate";
import { prng, q } from "./helpers";

describe("dense representation", () => {
  it("drops trailing zeros; the zero polynomial is [] with degree -1", () => {
    expect(fromIntegerCoefficients([1, 2, 0, 0])).toEqual([1n, 2n]);
    expect(fromIntegerCoefficients([0, 0])).toEqual([]);
    expect(degree([])).toBe(-1);
    expect(fromRationalCoefficients([q(1, 2), q(0), q(2, 4), q(0)]).map(formatRational)).toEqual(["1/2", "0", "1/2"]);
  });

  it("rejects unsafe float coefficients with a clear error", () => {
    expect(() => fromIntegerCoefficients([0.5])).toThrow(UnivariateError);
  });

  it("toIntegerPrimitive clears denominators, removes the content, makes the leading coefficient positive", () => {
    // -3/4 x^2 - 1/2 -> 3x^2 + 2
    expect(toIntegerPrimitive([q(-1, 2), q(0), q(-3, 4)])).toEqual([2n, 0n, 3n]);
    expect(toIntegerPrimitive([6n, -4n, -2n])).toEqual([-3n, 2n, 1n]);
    expect(toIntegerPrimitive([])).toEqual([]);
    expect(toIntegerPrimitive([q(-5, 7)])).toEqual([1n]);
  });

  it("fromRoots builds the primitive product of (den·x - num)", () => {
    expect(fromRoots([q(1, 2), q(3)])).toEqual([3n, -7n, 2n]);
    expect(fromRoots([])).toEqual([1n]);
  });

  it("evaluates exactly at rationals, in both flavours", () => {
    const p = fromIntegerCoefficients([-2, 0, 1]);
    expect(formatRational(evaluate(p, q(3, 2)))).toBe("1/4");
    expect(formatRational(evaluate(toRationalCoefficients(p), q(3, 2)))).toBe("1/4");
    expect(signAt(p, q(7, 5))).toBe(-1);
    expect(signAt(p, q(-10, 7))).toBe(1);
    expect(signAt(fromRoots([q(2, 3)]), q(2, 3))).toBe(0);
    expect(formatRational(evaluate([], q(5)))).toBe("0");
  });

  it("derivative follows the power rule", () => {
    expect(derivative([1n, 0n, 0n, 2n])).toEqual([0n, 0n, 6n]);
    expect(derivative([7n])).toEqual([]);
    expect(derivative([q(1), q(1, 2), q(1, 3)]).map(formatRational)).toEqual(["1/2", "2/3"]);
  });

  it("ring operations agree with evaluation at random points (seeded)", () => {
    const rnd = prng(11);
    for (let t = 0; t < 50; t++) {
      const a = fromIntegerCoefficients(Array.from({ length: rnd.int(0, 6) }, () => rnd.int(-9, 9)));
      const b = fromIntegerCoefficients(Array.from({ length: rnd.int(0, 6) }, () => rnd.int(-9, 9)));
      const x = q(rnd.int(-20, 20), rnd.int(1, 9));
      const [va, vb] = [evaluate(a, x), evaluate(b, x)];
      const ar = toRationalCoefficients(a);
      const br = toRationalCoefficients(b);
      expect(eq(evaluate(mulInt(a, b), x), evaluate(mulRat(ar, br), x))).toBe(true);
      expect(formatRational(evaluate(addInt(a, b), x))).toBe(formatRational(evaluate(addRat(ar, br), x)));
      expect(formatRational(evaluate(subInt(a, b), x))).toBe(formatRational(evaluate(subRat(ar, br), x)));
      expect(eq(evaluate(reflect(a), x), evaluate(a, q(-x.num, x.den)))).toBe(true);
      // product rule at x: (ab)' = a'b + ab'
      const lhs = evaluate(derivative(mulInt(a, b)), x);
      const rhs = evaluate(addInt(mulInt(derivative(a), b), mulInt(a, derivative(b))), x);
      expect(eq(lhs, rhs)).toBe(true);
      expect(va.den > 0n && vb.den > 0n).toBe(true);
    }
  });

  it("prints highest term first", () => {
    expect(formatPoly([-2n, 0n, 1n])).toBe("x^2 - 2");
    expect(formatPoly([q(1, 2), q(-1)])).toBe("-x + 1/2");
    expect(formatPoly([])).toBe("0");
  });
});
