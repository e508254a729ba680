import { describe, expect, it } from "vitest";
import {
  descartesCountUnitInterval,
  fromIntegerCoefficients,
  fromRoots,
  isolateRealRoots,
  rootBoundExponent,
  signVariations,
} from "@domain/algebra/univariate";
import { taylorShiftByOne } from "@domain/algebra/univariate/descartes";
import { absFloat, prng, q } from "./helpers";

describe("Descartes' rule of signs and root bounds", () => {
  it("counts sign variations, skipping zeros", () => {
    expect(signVariations([1n, -3n, 0n, 2n])).toBe(2);
    expect(signVariations([0n, 0n])).toBe(0);
    expect(signVariations([1n, -1n, 1n, -1n], 2)).toBe(2);
  });

  it("Taylor shift by one is p(x + 1)", () => {
    expect(taylorShiftByOne([0n, 0n, 1n])).toEqual([1n, 2n, 1n]);
    expect(taylorShiftByOne([5n, -3n, 0n, 2n])).toEqual([4n, 3n, 6n, 2n]); // 2(x+1)^3 - 3(x+1) + 5
  });

  it("counts the roots in (0, 1) exactly when they are few and well separated", () => {
    expect(descartesCountUnitInterval(fromRoots([q(1, 2), q(1, 3)]))).toBe(2);
    expect(descartesCountUnitInterval(fromRoots([q(1, 2), q(3), q(-1)]))).toBe(1);
    expect(descartesCountUnitInterval(fromRoots([q(2), q(-1, 2)]))).toBe(0);
    // roots at the endpoints are not counted
    expect(descartesCountUnitInterval(fromRoots([q(0), q(1)]))).toBe(0);
  });

  it("2^rootBoundExponent exceeds the modulus of every real root (seeded, known roots)", () => {
    const rnd = prng(41);
    for (let t = 0; t < 40; t++) {
      const roots = Array.from({ length: rnd.int(1, 8) }, () => q(rnd.int(-2000, 2000), rnd.int(1, 50)));
      const s = rootBoundExponent(fromRoots(roots));
      for (const r of roots) expect(absFloat(r) < 2 ** s).toBe(true);
    }
    // complex roots too: x^2 + 9 has |z| = 3
    expect(2 ** rootBoundExponent([9n, 0n, 1n])).toBeGreaterThan(3);
    expect(rootBoundExponent(fromIntegerCoefficients([-2, 0, 1]))).toBe(2);
  });

  it("the bound holds on isolated roots of random integer polynomials (seeded)", () => {
    const rnd = prng(42);
    for (let t = 0; t < 40; t++) {
      const p = fromIntegerCoefficients([...Array.from({ length: rnd.int(1, 9) }, () => rnd.int(-1000, 1000)), rnd.int(1, 3)]);
      const bound = 2 ** rootBoundExponent(p);
      for (const iv of isolateRealRoots(p)) {
        expect(Number(iv.lo.num) / Number(iv.lo.den)).toBeGreaterThanOrEqual(-bound);
        expect(Number(iv.hi.num) / Number(iv.hi.den)).toBeLessThanOrEqual(bound);
      }
    }
  });
});
