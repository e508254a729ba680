import { describe, expect, it } from "vitest";
import { newton } from "@domain/numeric/newton";


describe("damped Newton", () => {
  it("finds √2 to 1e-14", () => {
    const r = newton((x) => ({ f: [x[0] * x[0] - 2], jacobian: [[2 * x[0]]] }), [1]);
    expect(r.converged).toBe(true);
    expect(Math.abs(r.x[0] - Math.SQRT2)).toBeLessThan(1e-14);
  });

  it("solves a 2×2 system in log coordinates keeping x positive: x·y = 2, x + y = 3 → (1, 2) or (2, 1)", () => {
    const sys = (v: number[]) => ({ f: [v[0] * v[1] - 2, v[0] + v[1] - 3], jacobian: [[v[1], v[0]], [1, 1]] });
    const r = newton(sys, [0.5, 5], { logCoordinates: true });
    expect(r.converged).toBe(true);
    expect(r.x.every((v) => v > 0)).toBe(true);
    expect(Math.abs(r.x[0] * r.x[1] - 2)).toBeLessThan(1e-12);
  });

  it("reports failure on a system without real solutions (x² + 1 = 0)", () => {
    const r = newton((x) => ({ f: [x[0] * x[0] + 1], jacobian: [[2 * x[0]]] }), [0.3]);
    expect(r.converged).toBe(false);
  });
});
