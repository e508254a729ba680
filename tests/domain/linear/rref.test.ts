import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { formatRational } from "../../../domain/algebra/rational";
import { identityMatrix, matrixFromIntegers, matrixFromRationals, multiply, isZeroVector, vectorTimesMatrix, matrixTimesVector } from "../../../domain/linear/matrix";
import { leftKernel, nullspace, rank, rref } from "../../../domain/linear/rref";
import { randomInt, seededRandom } from "../../support/prng";

function randomLowRankMatrix(rand: () => number): number[][] {
  const m = randomInt(rand, 1, 6);
  const n = randomInt(rand, 1, 7);
  const r = randomInt(rand, 1, Math.min(m, n));
  const a = Array.from({ length: m }, () => Array.from({ length: r }, () => randomInt(rand, -3, 3)));
  const b = Array.from({ length: r }, () => Array.from({ length: n }, () => randomInt(rand, -3, 3)));
  return a.map((row) => b[0].map((_, j) => row.reduce((s, x, k) => s + x * b[k][j], 0)));
}

describe("rref, rank and kernels", () => {
  it("reduces small examples worked by hand", () => {
    const a = rref(matrixFromIntegers([[2, 4], [1, 3]]));
    expect(a.pivots).toEqual([0, 1]);
    expect(a.matrix.entries.map((r) => r.map(formatRational))).toEqual([["1", "0"], ["0", "1"]]);
    const b = rref(matrixFromIntegers([[1, 2], [2, 4]]));
    expect(b.pivots).toEqual([0]);
    expect(b.matrix.entries.map((r) => r.map(formatRational))).toEqual([["1", "2"], ["0", "0"]]);
    expect(rank(matrixFromIntegers([[0, 0], [0, 0]]))).toBe(0);
  });

  it("nullspace of (1 1) is spanned by (-1, 1); left kernel of (-1; 1) by (1, 1)", () => {
    expect(nullspace(matrixFromIntegers([[1, 1]])).map((v) => v.map(formatRational))).toEqual([["-1", "1"]]);
    expect(leftKernel(matrixFromIntegers([[-1], [1]])).map((v) => v.map(formatRational))).toEqual([["1", "1"]]);
  });

  it("satisfies rank–nullity and annihilation on seeded random matrices", () => {
    const rand = seededRandom(20261201);
    for (let t = 0; t < 200; t++) {
      const data = randomLowRankMatrix(rand);
      const a = matrixFromIntegers(data);
      const r = rank(a);
      expect(r).toBeLessThanOrEqual(Math.min(a.rows, a.cols));
      const ker = nullspace(a);
      expect(ker.length).toBe(a.cols - r);
      for (const v of ker) expect(isZeroVector(matrixTimesVector(a, v))).toBe(true);
      const left = leftKernel(a);
      expect(left.length).toBe(a.rows - r);
      for (const y of left) expect(isZeroVector(vectorTimesMatrix(y, a))).toBe(true);
      // The kernel vectors are independent: stacking them gives full rank.
      if (ker.length > 0) expect(rank(matrixFromRationals(ker))).toBe(ker.length);
      expect(rank(rref(a).matrix)).toBe(r);
      expect(rank(multiply(a, identityMatrix(a.cols)))).toBe(r);
    }
  });

  it("agrees with SymPy's Matrix.rref on seeded random matrices", () => {
    // Reference: Debian python3-sympy 1.11, Matrix.rref() (the RREF is unique, so entries must match).
    const rand = seededRandom(7);
    const cases = Array.from({ length: 60 }, () => randomLowRankMatrix(rand));
    const script = [
      "import json, sys",
      "from sympy import Matrix",
      "out = []",
      "for m in json.load(sys.stdin):",
      "    R, piv = Matrix(m).rref()",
      "    out.append({'rref': [[str(R[i, j]) for j in range(R.cols)] for i in range(R.rows)], 'pivots': list(piv)})",
      "print(json.dumps(out))",
    ].join("\n");
    const reference: { rref: string[][]; pivots: number[] }[] = JSON.parse(
      execFileSync("/usr/bin/python3", ["-c", script], { input: JSON.stringify(cases), encoding: "utf8" }),
    );
    expect(reference).toHaveLength(cases.length);
    cases.forEach((data, k) => {
      const mine = rref(matrixFromIntegers(data));
      expect(mine.pivots).toEqual(reference[k].pivots);
      expect(mine.matrix.entries.map((r) => r.map(formatRational))).toEqual(reference[k].rref);
    });
  });
});
