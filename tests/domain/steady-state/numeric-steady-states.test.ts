import { describe, expect, it } from "vitest";
import { analyseCsv, initial } from "./helpers";

describe("numeric steady states of a class", () => {
  it("reversible dimerisation 2A <-> B (k1 = 1, k2 = 2) with A(0) = 3: A² = 2B and A + 2B = 3 give A = (−1 + √13)/2 (by hand)", () => {
    const r = analyseCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\n2A <-> B,k1,k2,1,2\n", { initial: initial("A=3") });
    expect(r.steadyStates).toHaveLength(1);
    const a = (-1 + Math.sqrt(13)) / 2;
    expect(Math.abs(r.steadyStates![0].concentrations.A - a)).toBeLessThan(1e-14 * a);
    expect(r.steadyStates![0].residual).toBeLessThan(1e-13);
    expect(r.eliminant).not.toBeNull();
  });

  it("a class with zero totals for a law has no positive steady state", () => {
    const r = analyseCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,1,1\n", { initial: new Map() });
    expect(r.steadyStates).toEqual([]);
  });

  it("a continuum of steady states in one class is reported, not listed: A + B -> 2A and A + B -> 2B at equal rates", () => {
    const r = analyseCsv("reaction,rate,rate_value\nA + B -> 2A,k1,1\nA + B -> 2B,k2,1\n", { initial: initial("A=1,B=1") });
    // Not an empty list (a client would read "none"): no list, with the reason.
    expect(r.steadyStates).toBeNull();
    expect(r.steadyStatesReason).toContain("continuum");
    expect(r.warnings.some((w) => w.includes("continuum"))).toBe(true);
    expect(r.steadyStateSet).toBe("continuum");
    // Every point with A + B = 2 is a steady state, so positive ones exist (A = B = 1 among them).
    expect(r.positiveSteadyStatesExist).toBe(true);
    expect(r.positiveSteadyStatesReason).toMatch(/positive orthant/);
    expect(r.contradictions).toEqual([]);
  });

  it("A + B <-> 2A (k1 = k2 = 1) in the class A + B = 2 has the one state A = B = 1", () => {
    const r = analyseCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + B <-> 2A,k1,k2,1,1\n", { initial: initial("A=1,B=1") });
    expect(r.steadyStates!.map((s) => [s.concentrations.A, s.concentrations.B])).toEqual([[1, 1]]);
  });
});
