import { describe, expect, it } from "vitest";
import {
  divRem,
  fromIntegerCoefficients,
  fromRoots,
  gcd,
  mulInt,
  primitivePart,
  toRationalCoefficients,
} from "@domain/algebra/univariate";
import { prng, q } from "./helpers";

const dividesOverQ = (b: readonly bigint[], a: readonly bigint[]) =>
  divRem(toRationalCoefficients(a), toRationalCoefficients(b)).remainder.length === 0;

describe("gcd over Q (primitive PRS)", () => {
  it("finds x + 1 in gcd(x^2 - 1, 2x^2 + 4x + 2)", () => {
    expect(gcd([-1n, 0n, 1n], [2n, 4n, 2n])).toEqual([1n, 1n]);
  });

  it("is 1 for coprime inputs and handles zero", () => {
    expect(gcd([-2n, 0n, 1n], [-3n, 0n, 1n])).toEqual([1n]);
    expect(gcd([], [0n, -2n])).toEqual([0n, 1n]);
    expect(gcd([], [])).toEqual([]);
    expect(gcd([q(1, 2), q(1)], [q(-1, 4), q(0), q(1)])).toEqual([1n, 2n]); // 2x + 1
  });

  it("recovers a planted common factor, and the cofactors are coprime (seeded)", () => {
    const rnd = prng(21);
    for (let t = 0; t < 40; t++) {
      const rand = (n: number) => fromIntegerCoefficients([...Array.from({ length: n }, () => rnd.int(-9, 9)), rnd.int(1, 5)]);
      const common = primitivePart(rand(rnd.int(0, 3)));
      const a = mulInt(common, rand(rnd.int(0, 5)));
      const b = mulInt(common, rand(rnd.int(0, 5)));
      const g = gcd(a, b);
      expect(dividesOverQ(g, a) && dividesOverQ(g, b)).toBe(true);
      expect(dividesOverQ(common, g)).toBe(true);
      expect(g[g.length - 1] > 0n).toBe(true);
      const ca = divRem(toRationalCoefficients(a), toRationalCoefficients(g)).quotient;
      const cb = divRem(toRationalCoefficients(b), toRationalCoefficients(g)).quotient;
      expect(gcd(ca, cb)).toEqual([1n]);
    }
  });

  it("handles degree-20 Wilkinson-type inputs", () => {
    const roots = Array.from({ length: 20 }, (_, i) => q(i + 1));
    const w = fromRoots(roots);
    const shifted = fromRoots([...roots.slice(0, 10), ...roots.slice(10).map((r) => q(r.num * 3n, 2))]);
    // Common roots: 1..10, and among 3k/2 (k = 11..20) only 18 is an integer <= 20.
    const expectedCommon = fromRoots([...roots.slice(0, 10), q(18)]);
    expect(gcd(w, shifted)).toEqual(expectedCommon);
  });
});
