import { describe, expect, it } from "vitest";
import { fromInt, rational } from "../../../domain/algebra/rational";
import {
  identityMatrix,
  matrixFromIntegers,
  matrixTimesVector,
  multiply,
  transpose,
  vectorTimesMatrix,
  matrixToStrings,
  zeroMatrix,
} from "../../../domain/linear/matrix";

const ints = (v: number[]) => v.map(fromInt);

describe("matrix basics", () => {
  it("multiplies (1 2; 3 4)(5 6; 7 8) = (19 22; 43 50)", () => {
    // Worked by hand.
    const p = multiply(matrixFromIntegers([[1, 2], [3, 4]]), matrixFromIntegers([[5, 6], [7, 8]]));
    expect(matrixToStrings(p)).toEqual([["19", "22"], ["43", "50"]]);
  });

  it("transposes and keeps empty shapes", () => {
    const a = matrixFromIntegers([[1, 2, 3]]);
    expect(matrixToStrings(transpose(a))).toEqual([["1"], ["2"], ["3"]]);
    const e = zeroMatrix(0, 3);
    expect(transpose(e).rows).toBe(3);
    expect(transpose(e).cols).toBe(0);
    expect(multiply(zeroMatrix(2, 0), zeroMatrix(0, 3)).entries.flat().every((x) => x.num === 0n)).toBe(true);
  });

  it("identity is neutral; vector products agree with the matrix product", () => {
    const a = matrixFromIntegers([[1, -1, 0], [2, 0, 5]]);
    expect(matrixToStrings(multiply(identityMatrix(2), a))).toEqual(matrixToStrings(a));
    expect(vectorTimesMatrix(ints([1, 1]), a).map((x) => x.num)).toEqual([3n, -1n, 5n]);
    expect(matrixTimesVector(a, ints([1, 1, 1])).map((x) => x.num)).toEqual([0n, 7n]);
  });

  it("works with fractions exactly", () => {
    const half = rational(1n, 2n);
    const p = multiply(
      { rows: 1, cols: 2, entries: [[half, half]] },
      { rows: 2, cols: 1, entries: [[rational(1n, 3n)], [rational(2n, 3n)]] },
    );
    expect(matrixToStrings(p)).toEqual([["1/2"]]);
  });

  it("rejects mismatched shapes", () => {
    expect(() => multiply(matrixFromIntegers([[1, 2]]), matrixFromIntegers([[1, 2]]))).toThrow(RangeError);
    expect(() => matrixFromIntegers([[1, 2], [3]])).toThrow(RangeError);
  });
});
