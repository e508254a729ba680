import { describe, expect, it } from "vitest";
import { divInto, divides, divMask, isCoprime, lcm, monomialEquals, monomialKey, mulInto, packMonomial, unpackMonomial } from "@domain/algebra/monomial";

// Packed layout [totalDegree, e_1, ..., e_n] (see the header of domain/algebra/monomial.ts).
describe("packed monomials", () => {
  const x2y = packMonomial([2, 1]);
  const xy3 = packMonomial([1, 3]);

  it("packs with the total degree first and unpacks back", () => {
    expect(Array.from(x2y)).toEqual([3, 2, 1]);
    expect(unpackMonomial(x2y, 0, 2)).toEqual([2, 1]);
    expect(() => packMonomial([1, -1])).toThrow(RangeError);
    expect(() => packMonomial([0.5])).toThrow(/bad exponent/);
  });

  it("takes the lcm exponent by exponent: lcm(x^2*y, x*y^3) = x^2*y^3 (the file's own example)", () => {
    expect(Array.from(lcm(x2y, 0, xy3, 0, 2))).toEqual([5, 2, 3]);
  });

  it("multiplies and divides in place, degrees included", () => {
    const out = new Int32Array(3);
    mulInto(out, 0, x2y, 0, xy3, 0, 2);
    expect(Array.from(out)).toEqual([7, 3, 4]);
    const back = new Int32Array(3);
    divInto(back, 0, out, 0, xy3, 0, 2);
    expect(monomialEquals(back, 0, x2y, 0, 2)).toBe(true);
  });

  it("tests divisibility and coprimality at offsets inside a flat array", () => {
    // Two monomials in one array, stride 3: x*y then x^2*y^2.
    const flat = new Int32Array([2, 1, 1, 4, 2, 2]);
    expect(divides(flat, 0, flat, 3, 2)).toBe(true);
    expect(divides(flat, 3, flat, 0, 2)).toBe(false);
    expect(isCoprime(packMonomial([2, 0]), 0, packMonomial([0, 5]), 0, 2)).toBe(true);
    expect(isCoprime(x2y, 0, xy3, 0, 2)).toBe(false);
  });

  it("never lets the divisibility mask refuse a true divisor", () => {
    for (let a = 0; a < 4; a++)
      for (let b = 0; b < 4; b++)
        for (let c = 0; c < 4; c++) {
          const m = packMonomial([a, b, c]);
          const big = packMonomial([a + 1, b, c + 2]);
          expect(divides(m, 0, big, 0, 3)).toBe(true);
          // A divisor's mask bits are a subset of the multiple's.
          expect(divMask(m, 0, 3) & ~divMask(big, 0, 3)).toBe(0);
        }
  });

  it("keys equal monomials equally and different ones differently", () => {
    expect(monomialKey(packMonomial([2, 1]), 0, 2)).toBe(monomialKey(x2y, 0, 2));
    expect(monomialKey(packMonomial([1, 2]), 0, 2)).not.toBe(monomialKey(x2y, 0, 2));
  });
});
