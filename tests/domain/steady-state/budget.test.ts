import { describe, expect, it } from "vitest";
import { AlgebraError } from "@domain/algebra/index";
import { Budget, isOutOfBudget } from "@domain/steady-state/budget";

describe("shared budget", () => {
  it("hands each phase a share of the remaining time and the size limits", () => {
    const b = new Budget({ timeoutMs: 10_000, maxBasisSize: 50 });
    const o = b.groebner(0.25);
    expect(o.deadline! - Date.now()).toBeLessThanOrEqual(2_500);
    expect(o.deadline! - Date.now()).toBeGreaterThan(2_000);
    expect(o.maxBasisSize).toBe(50);
  });
  it("check throws timeout after the deadline and cancelled on abort; only the former is a budget error", () => {
    const late = new Budget({ deadline: Date.now() - 1 });
    expect(() => late.check("x")).toThrow(AlgebraError);
    try {
      late.check("x");
    } catch (e) {
      expect(isOutOfBudget(e)).toBe(true);
    }
    const c = new AbortController();
    c.abort();
    try {
      new Budget({ signal: c.signal }).check("x");
    } catch (e) {
      expect((e as AlgebraError).code).toBe("cancelled");
      expect(isOutOfBudget(e)).toBe(false);
    }
  });
});
