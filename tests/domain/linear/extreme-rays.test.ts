import { describe, expect, it } from "vitest";
import { fromInt } from "../../../domain/algebra/rational";
import { LinearBudgetError } from "../../../domain/linear/errors";
import { nonNegativeLeftKernelRays } from "../../../domain/linear/extreme-rays";
import { matrixFromIntegers, matrixFromRationals, isZeroVector, vectorTimesMatrix, type Matrix } from "../../../domain/linear/matrix";
import { leftKernel, rank } from "../../../domain/linear/rref";
import { randomInt, seededRandom } from "../../support/prng";

const annihilates = (y: readonly bigint[], n: Matrix) => isZeroVector(vectorTimesMatrix(y.map(fromInt), n));
const support = (v: readonly bigint[]) => v.map((x, i) => (x !== 0n ? i : -1)).filter((i) => i >= 0);

/** Minimality test for a non-negative left-kernel vector, by a rank computation. */
function isMinimalSupport(y: readonly bigint[], n: Matrix): boolean {
  // y is extreme ⇔ the left kernel restricted to supp(y) is one-dimensional (common practice;
  // Schuster & Höfer, J. Chem. Soc. Faraday Trans. 87 (1991)).
  const rows = support(y).map((i) => n.entries[i]);
  return rows.length - rank(matrixFromRationals(rows, n.cols)) === 1;
}

/** Brute force: every minimal-support non-negative kernel vector, by trying all supports. */
function bruteForceRaySupports(n: Matrix): string[] {
  const m = n.rows;
  const found: number[][] = [];
  for (let mask = 1; mask < 1 << m; mask++) {
    const idx = [...Array(m).keys()].filter((i) => mask & (1 << i));
    if (found.some((f) => f.every((i) => idx.includes(i)))) continue;
    const rows = idx.map((i) => n.entries[i]);
    if (idx.length - rank(matrixFromRationals(rows, n.cols)) !== 1) continue;
    // The unique kernel direction on this support (by RREF): strictly positive up to sign?
    const [k] = leftKernel(matrixFromRationals(rows, n.cols));
    if (k.every((x) => x.num > 0n) || k.every((x) => x.num < 0n)) found.push(idx);
  }
  return found.map((f) => f.join(",")).sort();
}

describe("nonNegativeLeftKernelRays", () => {
  it("finds E + C and S + C + P for Michaelis–Menten", () => {
    // Species E, S, C, P; reactions E+S→C, C→E+S, C→E+P. Conservation laws E + C and S + C + P
    // (Briggs & Haldane, Biochem. J. 19 (1925): enzyme and substrate totals).
    const n = matrixFromIntegers([
      [-1, 1, 1],
      [-1, 1, 0],
      [1, -1, -1],
      [0, 0, 1],
    ]);
    expect(nonNegativeLeftKernelRays(n)).toEqual([
      [1n, 0n, 1n, 0n],
      [0n, 1n, 1n, 1n],
    ]);
  });

  it("returns the unit vector for a species no reaction touches, and nothing for an open system", () => {
    expect(nonNegativeLeftKernelRays(matrixFromIntegers([[1], [0]]))).toEqual([[0n, 1n]]);
    expect(nonNegativeLeftKernelRays(matrixFromIntegers([[1, -1]]))).toEqual([]);
  });

  it("finds rays with non-unit coefficients: 2A -> B gives A + 2B", () => {
    expect(nonNegativeLeftKernelRays(matrixFromIntegers([[-2], [1]]))).toEqual([[1n, 2n]]);
  });

  it("has non-negative, kernel, minimal rays matching brute force on seeded random matrices", () => {
    const rand = seededRandom(4242);
    for (let t = 0; t < 150; t++) {
      const m = randomInt(rand, 1, 7);
      const r = randomInt(rand, 1, 5);
      const data = Array.from({ length: m }, () => Array.from({ length: r }, () => (rand() < 0.5 ? 0 : randomInt(rand, -2, 2))));
      const n = matrixFromIntegers(data);
      const rays = nonNegativeLeftKernelRays(n);
      for (const y of rays) {
        expect(y.every((x) => x >= 0n)).toBe(true);
        expect(y.some((x) => x > 0n)).toBe(true);
        expect(annihilates(y, n)).toBe(true);
        expect(isMinimalSupport(y, n)).toBe(true);
      }
      // Distinct supports (extreme rays of a pointed cone are determined by their support).
      expect(new Set(rays.map((y) => support(y).join(","))).size).toBe(rays.length);
      expect(rays.map((y) => support(y).join(",")).sort()).toEqual(bruteForceRaySupports(n));
    }
  });

  it("stops with a LinearBudgetError when the budget is too small", () => {
    // Zero matrix on 6 species: the orthant has 6 rays; a budget of 3 is exceeded as soon as
    // combinations are formed, so use a column that splits them: (1, 1, 1, -1, -1, -1).
    const n = matrixFromIntegers([[1], [1], [1], [-1], [-1], [-1]]);
    expect(nonNegativeLeftKernelRays(n)).toHaveLength(9);
    expect(() => nonNegativeLeftKernelRays(n, { maxRays: 5 })).toThrow(LinearBudgetError);
  });
});
