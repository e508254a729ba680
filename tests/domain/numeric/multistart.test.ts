import { describe, expect, it } from "vitest";
import { multistartPositiveSolutions, sameSolution, seededRandom } from "@domain/numeric/multistart";

const cubic = (x: number[]) => ({
  f: [(x[0] - 1) * (x[0] - 2) * (x[0] - 3)],
  jacobian: [[3 * x[0] * x[0] - 12 * x[0] + 11]],
});

describe("multistart search", () => {
  it("finds the three positive roots 1, 2, 3 of (x−1)(x−2)(x−3)", () => {
    const roots = multistartPositiveSolutions(cubic, { low: [0.1], high: [10], starts: 100 });
    expect(roots.map((r) => r[0])).toHaveLength(3);
    roots.forEach((r, i) => expect(r[0]).toBeCloseTo(i + 1, 10));
  });

  it("is deterministic for a seed and compares solutions relatively", () => {
    const a = seededRandom(5);
    const b = seededRandom(5);
    expect([a(), a(), a()]).toEqual([b(), b(), b()]);
    expect(sameSolution([1, 2], [1 + 1e-9, 2], 1e-6)).toBe(true);
    expect(sameSolution([1, 2], [1.1, 2], 1e-6)).toBe(false);
  });
});
