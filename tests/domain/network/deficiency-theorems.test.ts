import { describe, expect, it } from "vitest";
import { deficiencyOneVerdict, deficiencyZeroVerdict } from "../../../domain/network";

describe("deficiency theorem verdicts", () => {
  it("deficiency zero, weakly reversible: one stable complex-balanced steady state per class (Feinberg 1987; Horn & Jackson 1972)", () => {
    const v = deficiencyZeroVerdict(0, true);
    expect(v.applies).toBe(true);
    expect(v.conclusions).toHaveLength(4);
    expect(v.assumptions.join(" ")).toMatch(/Mass-action/);
    expect(v.assumptions.join(" ")).toMatch(/rate constant is positive/);
    expect(v.assumptions.join(" ")).toMatch(/strictly positive/);
  });

  it("deficiency zero, not weakly reversible: no positive steady state, no periodic orbit (Feinberg 1987)", () => {
    const v = deficiencyZeroVerdict(0, false);
    expect(v.applies).toBe(true);
    expect(v.conclusions.join(" ")).toContain("no positive steady state");
    expect(v.conclusions.join(" ")).toContain("no periodic trajectory");
  });

  it("says nothing when the deficiency is positive", () => {
    const v = deficiencyZeroVerdict(2, true);
    expect(v.applies).toBe(false);
    expect(v.conclusions).toEqual([]);
    expect(v.reason).toContain("2");
  });

  it("deficiency one theorem hypotheses (Feinberg, Arch. Rational Mech. Anal. 132 (1995); recalled from memory)", () => {
    const ok = deficiencyOneVerdict({ deficiency: 1, linkageClassDeficiencies: [1, 0], terminalPerLinkageClass: [1, 1], weaklyReversible: true });
    expect(ok.applies).toBe(true);
    expect(ok.conclusions).toHaveLength(2);
    expect(deficiencyOneVerdict({ deficiency: 2, linkageClassDeficiencies: [2], terminalPerLinkageClass: [1], weaklyReversible: true }).applies).toBe(false);
    expect(deficiencyOneVerdict({ deficiency: 1, linkageClassDeficiencies: [0, 0], terminalPerLinkageClass: [1, 1], weaklyReversible: false }).applies).toBe(false);
    expect(deficiencyOneVerdict({ deficiency: 1, linkageClassDeficiencies: [1], terminalPerLinkageClass: [2], weaklyReversible: false }).applies).toBe(false);
  });
});
