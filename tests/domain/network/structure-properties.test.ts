import { describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv } from "../../../domain/network";
import { seededRandom } from "../../support/prng";
import { matrixFromIntegers, rank } from "../../../domain/linear";
import { randomNetworkCsv } from "./random-network";

const gcd = (a: number, b: number): number => (b === 0 ? Math.abs(a) : gcd(b, a % b));

describe("analyseStructure on seeded random networks", () => {
  it("satisfies the structural invariants", () => {
    const rand = seededRandom(2026);
    for (let t = 0; t < 300; t++) {
      const net = parseNetworkCsv(randomNetworkCsv(rand));
      const s = analyseStructure(net);
      const m = s.species.length;
      const r = s.reactions;
      const n = s.stoichiometricMatrix;
      const lawVector = (law: Record<string, number>) => s.species.map((sp) => law[sp] ?? 0);
      const annihilates = (y: number[]) => n[0].every((_, j) => y.reduce((acc, yi, i) => acc + yi * n[i][j], 0) === 0);

      expect(s.rank).toBeLessThanOrEqual(Math.min(m, r));
      expect(s.deficiency).toBeGreaterThanOrEqual(0);
      expect(s.deficiency).toBe(s.complexes.length - s.linkageClasses - s.rank);
      // Feinberg 1987: 0 ≤ δᵢ and Σδᵢ ≤ δ (recalled from memory).
      expect(s.linkageClassDeficiencies.every((d) => d >= 0)).toBe(true);
      expect(s.linkageClassDeficiencies.reduce((a, b) => a + b, 0)).toBeLessThanOrEqual(s.deficiency);
      // N = Y · I.
      for (let i = 0; i < m; i++)
        for (let j = 0; j < r; j++)
          expect(s.complexComposition[i].reduce((acc, y, c) => acc + y * s.incidenceMatrix[c][j], 0)).toBe(n[i][j]);

      expect(s.conservationLaws).toHaveLength(m - s.rank);
      for (const law of s.conservationLaws) {
        const y = lawVector(law);
        expect(annihilates(y)).toBe(true);
        expect(y.reduce(gcd, 0)).toBe(1);
        expect(y.find((x) => x !== 0)!).toBeGreaterThan(0);
      }
      const rays = s.minimalSemiPositiveConservationLaws!;
      for (const law of rays) {
        const y = lawVector(law);
        expect(y.every((x) => x >= 0)).toBe(true);
        expect(annihilates(y)).toBe(true);
      }
      // Minimality: no ray's support contains another's.
      for (const a of rays)
        for (const b of rays)
          if (a !== b) expect(Object.keys(b).every((k) => k in a)).toBe(false);
      // Conservative ⇔ the rays cover every species; then their sum is a positive law.
      const covered = s.species.every((sp) => rays.some((law) => sp in law));
      expect(s.conservative).toBe(covered);
      if (covered) expect(annihilates(s.species.map((sp) => rays.reduce((acc, law) => acc + (law[sp] ?? 0), 0)))).toBe(true);
      // The basis starts with as many non-negative laws as the rays' span allows.
      const raySpan = rays.length === 0 ? 0 : rank(matrixFromIntegers(rays.map(lawVector)));
      expect(s.conservationLaws.slice(0, raySpan).every((law) => Object.values(law).every((x) => x > 0))).toBe(true);
      expect(s.conservationLaws.slice(raySpan).every((law) => Object.values(law).some((x) => x < 0))).toBe(true);

      // Graph facts: weakly reversible ⇔ every linkage class is one strong class ⇔ all SCCs terminal.
      expect(s.weaklyReversible).toBe(s.strongLinkageClasses.length === s.linkageClasses);
      expect(s.weaklyReversible).toBe(s.terminalStrongLinkageClasses.length === s.strongLinkageClasses.length);
      expect(s.terminalStrongLinkageClasses.length).toBeGreaterThanOrEqual(s.linkageClasses);
      if (s.reversible) expect(s.weaklyReversible).toBe(true);
      expect(s.linkageClassMembers.flat().sort()).toEqual([...s.complexes].sort());
      expect(s.strongLinkageClasses.flat().sort()).toEqual([...s.complexes].sort());
      expect(s.deficiencyZeroTheorem.applies).toBe(s.deficiency === 0);
    }
  });
});
