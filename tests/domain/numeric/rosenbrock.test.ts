import { describe, expect, it } from "vitest";
import { integrateStiff, linearProblem } from "@domain/numeric/rosenbrock";

describe("stiff Rosenbrock method of order 2(3)", () => {
  it("integrates y' = −y to t = 1 within the tolerance", () => {
    const tc = integrateStiff(linearProblem([[-1]]), [1], 0, 1, { rtol: 1e-8, atol: 1e-12 });
    expect(tc.completed).toBe(true);
    expect(Math.abs(tc.y.at(-1)![0] - Math.exp(-1))).toBeLessThan(1e-6);
  });

  it("takes few steps on a stiff linear system (eigenvalues −1 and −10⁴) where explicit methods need ~10⁴", () => {
    const tc = integrateStiff(linearProblem([[-1, 0], [0, -1e4]]), [1, 1], 0, 5, { rtol: 1e-5, atol: 1e-10 });
    expect(tc.completed).toBe(true);
    expect(tc.t.length).toBeLessThan(500);
    expect(Math.abs(tc.y.at(-1)![0] - Math.exp(-5))).toBeLessThan(1e-4);
    expect(Math.abs(tc.y.at(-1)![1])).toBeLessThan(1e-8);
  });

  it("Robertson's stiff kinetics (Robertson 1966; Hairer & Wanner, Solving ODEs II, §IV.1) conserve the total and stay positive", () => {
    const f = ([a, b, c]: number[]) => [-0.04 * a + 1e4 * b * c, 0.04 * a - 1e4 * b * c - 3e7 * b * b, 3e7 * b * b];
    const jacobian = ([, b, c]: number[]) => [
      [-0.04, 1e4 * c, 1e4 * b],
      [0.04, -1e4 * c - 6e7 * b, -1e4 * b],
      [0, 6e7 * b, 0],
    ];
    const tc = integrateStiff({ f, jacobian }, [1, 0, 0], 0, 40, { rtol: 1e-6, atol: 1e-10 });
    expect(tc.completed).toBe(true);
    const y = tc.y.at(-1)!;
    expect(Math.abs(y[0] + y[1] + y[2] - 1)).toBeLessThan(1e-8);
    // Reference value y1(40) ≈ 0.7158 (Hairer & Wanner, Solving ODEs II, §IV.10 table — recalled from memory).
    expect(y[0]).toBeCloseTo(0.7158, 3);
    expect(tc.t.length).toBeLessThan(2000);
  });
});
