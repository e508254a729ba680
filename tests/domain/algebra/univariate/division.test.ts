import { describe, expect, it } from "vitest";
import { fromInt, mul } from "@domain/algebra/rational";
import {
  UnivariateError,
  addRat,
  divExactInt,
  divRem,
  fromIntegerCoefficients,
  mulInt,
  mulRat,
  pseudoRemainder,
  toRationalCoefficients,
} from "@domain/algebra/univariate";
import { prng, q } from "./helpers";

const randomRat = (rnd: ReturnType<typeof prng>, maxDeg: number) =>
  Array.from({ length: rnd.int(0, maxDeg + 1) }, () => q(rnd.int(-30, 30), rnd.int(1, 12)));

describe("exact division", () => {
  it("divides x^3 - 1 by x - 1 with zero remainder", () => {
    const { quotient, remainder } = divRem(toRationalCoefficients([-1n, 0n, 0n, 1n]), toRationalCoefficients([-1n, 1n]));
    expect(quotient).toEqual(toRationalCoefficients([1n, 1n, 1n]));
    expect(remainder).toEqual([]);
  });

  it("satisfies a = q·b + r with deg r < deg b on seeded random cases", () => {
    const rnd = prng(5);
    for (let t = 0; t < 60; t++) {
      const a = addRat(randomRat(rnd, 8), []);
      const b = addRat(randomRat(rnd, 4), []);
      if (b.length === 0) continue;
      const { quotient, remainder } = divRem(a, b);
      expect(addRat(mulRat(quotient, b), remainder)).toEqual(a);
      expect(remainder.length).toBeLessThan(b.length);
    }
  });

  it("pseudoRemainder equals lc(b)^(deg a - deg b + 1) times the remainder over Q", () => {
    const rnd = prng(6);
    for (let t = 0; t < 60; t++) {
      const a = fromIntegerCoefficients(Array.from({ length: rnd.int(1, 9) }, () => rnd.int(-50, 50)));
      const b = fromIntegerCoefficients(Array.from({ length: rnd.int(1, 5) }, () => rnd.int(-50, 50)));
      if (b.length === 0) continue;
      const k = Math.max(a.length - b.length + 1, 0);
      const expected = divRem(toRationalCoefficients(a), toRationalCoefficients(b)).remainder.map((c) =>
        mul(c, fromInt(b[b.length - 1] ** BigInt(k))),
      );
      expect(toRationalCoefficients(pseudoRemainder(a, b))).toEqual(expected);
    }
  });

  it("prem(x^2 + 1, 2x + 1) is 5", () => {
    expect(pseudoRemainder([1n, 0n, 1n], [1n, 2n])).toEqual([5n]);
  });

  it("divExactInt recovers factors and refuses inexact divisions", () => {
    const rnd = prng(7);
    for (let t = 0; t < 30; t++) {
      const a = fromIntegerCoefficients(Array.from({ length: rnd.int(1, 6) }, () => rnd.int(-20, 20)));
      const b = fromIntegerCoefficients([rnd.int(-5, 5) || 1, 1, rnd.int(0, 1)]);
      if (a.length === 0) continue;
      expect(divExactInt(mulInt(a, b), b)).toEqual(a);
    }
    expect(() => divExactInt([1n, 0n, 1n], [1n, 1n])).toThrow(expect.objectContaining({ code: "domain", reason: "not-exact" }));
    expect(() => divExactInt([1n, 1n], [])).toThrow(UnivariateError);
    expect(() => divRem([q(1)], [])).toThrow(expect.objectContaining({ code: "domain", reason: "division-by-zero" }));
  });
});
