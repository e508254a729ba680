import { describe, expect, it } from "vitest";
import { matMul, orthonormalColumnBasis, solveLinear, transpose } from "@domain/numeric/dense";

describe("dense float linear algebra", () => {
  it("solves with partial pivoting and reports singular systems", () => {
    expect(solveLinear([[0, 1], [1, 0]], [2, 3])).toEqual([3, 2]);
    expect(solveLinear([[1, 2], [2, 4]], [1, 2])).toBeNull();
  });
  it("an orthonormal basis of the column space drops dependent columns", () => {
    const q = orthonormalColumnBasis([[1, 2, 0], [1, 2, 0], [0, 0, 3]]);
    expect(q[0]).toHaveLength(2);
    const qtq = matMul(transpose(q), q);
    expect(qtq[0][0]).toBeCloseTo(1, 15);
    expect(qtq[0][1]).toBeCloseTo(0, 15);
    expect(qtq[1][1]).toBeCloseTo(1, 15);
  });
});
