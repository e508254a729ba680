import { describe, expect, it } from "vitest";
import { rational } from "../../../domain/algebra/rational";
import { primitiveIntegerVector, primitiveOfIntegers } from "../../../domain/linear/primitive";

describe("primitiveIntegerVector", () => {
  it("clears denominators, divides by the gcd and makes the first entry positive", () => {
    // Worked by hand: (1/2, -1/3, 0) * 6 = (3, -2, 0).
    expect(primitiveIntegerVector([rational(1n, 2n), rational(-1n, 3n), rational(0n)])).toEqual([3n, -2n, 0n]);
    expect(primitiveIntegerVector([rational(-2n), rational(0n), rational(-4n)])).toEqual([1n, 0n, 2n]);
    expect(primitiveIntegerVector([rational(0n), rational(-3n, 4n), rational(3n, 2n)])).toEqual([0n, 1n, -2n]);
  });

  it("leaves the zero vector alone", () => {
    expect(primitiveOfIntegers([0n, 0n])).toEqual([0n, 0n]);
  });

  it("gives gcd 1 for many vectors", () => {
    for (let a = -6; a <= 6; a++) {
      for (let b = -6; b <= 6; b++) {
        const v = primitiveOfIntegers([BigInt(a) * 4n, BigInt(b) * 6n]);
        if (a === 0 && b === 0) continue;
        const g = v.reduce((x, y) => {
          let p = x < 0n ? -x : x;
          let q = y < 0n ? -y : y;
          while (q) [p, q] = [q, p % q];
          return p;
        }, 0n);
        expect(g).toBe(1n);
        expect(v.find((x) => x !== 0n)! > 0n).toBe(true);
      }
    }
  });
});
