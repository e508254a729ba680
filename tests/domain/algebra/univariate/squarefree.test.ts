import { describe, expect, it } from "vitest";
import { eq, formatRational } from "@domain/algebra/rational";
import {
  derivative,
  fromIntegerCoefficients,
  fromRoots,
  gcd,
  mulInt,
  scaleInt,
  squareFreeFactorization,
  squareFreePart,
  toIntegerPrimitive,
  toRationalCoefficients,
  mulRat,
} from "@domain/algebra/univariate";
import { prng, q } from "./helpers";

describe("square-free part and Yun's factorisation", () => {
  it("2(x - 1)^2 (x + 2): constant 2, factors (x + 2)^1 (x - 1)^2", () => {
    const p = scaleInt(fromRoots([q(1), q(1), q(-2)]), 2n);
    const { constant, factors } = squareFreeFactorization(p);
    expect(formatRational(constant)).toBe("2");
    expect(factors).toEqual([
      { factor: [2n, 1n], multiplicity: 1 },
      { factor: [-1n, 1n], multiplicity: 2 },
    ]);
    expect(squareFreePart(p)).toEqual([-2n, 1n, 1n]);
  });

  it("x^3 (2x - 1)^2 (x^2 - 2)^4 over Q: constant -3/7 = lc / (2^2)", () => {
    let p: readonly bigint[] = fromIntegerCoefficients([0, 0, 0, 1]);
    p = mulInt(p, mulInt([-1n, 2n], [-1n, 2n]));
    for (let i = 0; i < 4; i++) p = mulInt(p, [-2n, 0n, 1n]);
    const pr = mulRat(toRationalCoefficients(p), [q(-3, 7)]);
    const { constant, factors } = squareFreeFactorization(pr);
    expect(formatRational(constant)).toBe("-3/7");
    expect(factors.map((f) => [f.factor, f.multiplicity])).toEqual([
      [[-1n, 2n], 2],
      [[0n, 1n], 3],
      [[-2n, 0n, 1n], 4],
    ]);
  });

  it("reconstructs random products; factors square-free and pairwise coprime (seeded)", () => {
    const rnd = prng(31);
    for (let t = 0; t < 30; t++) {
      let p: readonly bigint[] = [BigInt(rnd.int(1, 6) * (rnd.int(0, 1) ? 1 : -1))];
      for (let k = rnd.int(1, 4); k > 0; k--) {
        const f = fromIntegerCoefficients([rnd.int(-6, 6), rnd.int(-3, 3), rnd.int(1, 3)]);
        for (let e = rnd.int(1, 3); e > 0; e--) p = mulInt(p, f);
      }
      const { constant, factors } = squareFreeFactorization(p);
      let rebuilt = toRationalCoefficients([1n]);
      for (const { factor, multiplicity } of factors) {
        expect(gcd(factor, derivative(factor))).toEqual([1n]);
        for (let e = 0; e < multiplicity; e++) rebuilt = mulRat(rebuilt, toRationalCoefficients(factor));
      }
      rebuilt = mulRat(rebuilt, [constant]);
      expect(rebuilt.every((c, i) => eq(c, toRationalCoefficients(p)[i]))).toBe(true);
      expect(rebuilt.length).toBe(p.length);
      for (let i = 0; i < factors.length; i++) {
        for (let j = i + 1; j < factors.length; j++) expect(gcd(factors[i].factor, factors[j].factor)).toEqual([1n]);
        if (i > 0) expect(factors[i].multiplicity).toBeGreaterThan(factors[i - 1].multiplicity);
      }
      const sqf = squareFreePart(p);
      let prod: readonly bigint[] = [1n];
      for (const { factor } of factors) prod = mulInt(prod, factor);
      expect(sqf).toEqual(toIntegerPrimitive(prod));
    }
  });

  it("constants have no factors; zero is refused", () => {
    expect(squareFreeFactorization([5n]).factors).toEqual([]);
    expect(() => squareFreeFactorization([])).toThrow(expect.objectContaining({ code: "domain", reason: "zero-polynomial" }));
  });
});
