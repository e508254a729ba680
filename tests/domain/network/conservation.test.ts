import { describe, expect, it } from "vitest";
import { analyseConservation, analyseStructure, parseNetworkCsv, stoichiometricMatrix } from "../../../domain/network";

const structureOf = (csv: string) => analyseStructure(parseNetworkCsv(csv));

describe("conservation laws", () => {
  it("completes the basis from the RREF kernel when no non-negative law exists", () => {
    // A + B -> 0 conserves A − B only (worked by hand).
    const s = structureOf("reaction\nA + B -> 0\n");
    expect(s.conservationLaws).toEqual([{ A: 1, B: -1 }]);
    expect(s.minimalSemiPositiveConservationLaws).toEqual([]);
    expect(s.conservative).toBe(false);
  });

  it("puts the non-negative laws first and completes with mixed-sign ones", () => {
    const s = structureOf("reaction\nA + B -> 0\nC -> D\n");
    expect(s.conservationLaws).toEqual([{ C: 1, D: 1 }, { A: 1, B: -1 }]);
    expect(s.minimalSemiPositiveConservationLaws).toEqual([{ C: 1, D: 1 }]);
    expect(s.conservative).toBe(false);
  });

  it("uses integer coefficients: 2A <-> B conserves A + 2B", () => {
    const s = structureOf("reaction\n2A <-> B\n");
    expect(s.conservationLaws).toEqual([{ A: 1, B: 2 }]);
    expect(s.conservative).toBe(true);
  });

  it("prefers a non-negative basis even when the RREF basis has mixed signs", () => {
    // Michaelis–Menten: the RREF kernel basis is E + C and E − S − P (mixed signs; worked by hand),
    // while the extreme rays E + C and S + C + P (Briggs & Haldane 1925 totals) span the same space.
    const s = structureOf("reaction\nE + S <-> C\nC -> E + P\n");
    expect(s.conservationLaws).toEqual([{ E: 1, C: 1 }, { S: 1, C: 1, P: 1 }]);
    const t = structureOf("reaction\nX -> Y + Z\n");
    expect(t.conservationLaws).toEqual([{ X: 1, Y: 1 }, { X: 1, Z: 1 }]);
  });

  it("reports a warning, not a crash, when the extreme-ray budget is exceeded", () => {
    const net = parseNetworkCsv("reaction\nA + B + C -> D + E + F\n");
    const c = analyseConservation(stoichiometricMatrix(net), { maxRays: 3 });
    expect(c.minimalSemiPositive).toBeNull();
    expect(c.conservative).toBeNull();
    expect(c.warnings[0]).toContain("not computed");
    expect(c.basis).toHaveLength(5);
    const s = analyseStructure(net, { maxRays: 3 });
    expect(s.minimalSemiPositiveConservationLaws).toBeNull();
    expect(s.warnings).toHaveLength(1);
  });
});
