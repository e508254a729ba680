import { describe, expect, it } from "vitest";
import type { Reaction } from "../../../bench/lib/mass-action";
import { checkParametrisation } from "../../../bench/lib/parametrisation-check";
import { phosphorylationTwoSiteSymbolicNetwork } from "../../../bench/lib/systems";

// A <-> B with k1, k2: at steady state k1*A = k2*B, so B = k1*A/k2 (worked by hand).
const reversible: Reaction[] = [
  { reactants: { A: 1 }, products: { B: 1 }, rate: "k1" },
  { reactants: { B: 1 }, products: { A: 1 }, rate: "k2" },
];

describe("checkParametrisation", () => {
  it("accepts a correct parametrisation and rejects wrong or incomplete ones", () => {
    expect(checkParametrisation({ free: ["A"], expressions: { B: "k1*A/k2" } }, reversible, ["A", "B"], ["k1", "k2"])).toEqual({ ok: true, points: 3 });
    expect(checkParametrisation({ free: ["A"], expressions: { B: "k2*A/k1" } }, reversible, ["A", "B"], ["k1", "k2"]).ok).toBe(false);
    expect(checkParametrisation({ free: ["A"], expressions: {} }, reversible, ["A", "B"], ["k1", "k2"])).toMatchObject({ ok: false, reason: /neither free nor expressed: B/ });
    expect(checkParametrisation(null, reversible, ["A", "B"], ["k1", "k2"])).toMatchObject({ ok: false });
    expect(checkParametrisation({ free: ["A"], expressions: { B: "-k1*A/k2" } }, reversible, ["A", "B"], ["k1", "k2"])).toMatchObject({ ok: false, reason: /not positive/ });
  });

  it("accepts the two-site cycle's parametrisation derived by hand from the enzyme steps", () => {
    // Each complex from its own ODE (quasi-steady state of S + K <-> KS -> P + K, Briggs and
    // Haldane, Biochem. J. 19, 1925): ES0 = k1*S0*E/(k2 + k3), and so on around the cycle; then
    // the net fluxes k3*ES0 = k12*FS1 and k6*ES1 = k9*FS2 fix S1 and S2 (derived here by hand).
    const n = phosphorylationTwoSiteSymbolicNetwork();
    const expressions = {
      ES0: "S0*E*k1/(k2 + k3)",
      FS1: "S0*E*k1*k3/((k2 + k3)*k12)",
      S1: "(k11 + k12)*S0*E*k1*k3/((k2 + k3)*F*k10*k12)",
      ES1: "(k11 + k12)*S0*E^2*k1*k3*k4/((k5 + k6)*F*k10*k12*(k2 + k3))",
      FS2: "(k11 + k12)*S0*E^2*k1*k3*k4*k6/((k5 + k6)*F*k9*k10*k12*(k2 + k3))",
      S2: "(k11 + k12)*S0*E^2*k1*k3*k4*k6*(k8 + k9)/((k5 + k6)*F^2*k7*k9*k10*k12*(k2 + k3))",
    };
    expect(checkParametrisation({ free: ["S0", "E", "F"], expressions }, n.reactions, n.species, n.rates)).toEqual({ ok: true, points: 3 });
    const wrong = { ...expressions, S2: "(k11 + k12)*S0*E^2*k1*k3*k4*k6*(k8 + k9)/((k5 + k6)*F^2*k7*k9*k10*k12*(k2 + k3)*2)" };
    expect(checkParametrisation({ free: ["S0", "E", "F"], expressions: wrong }, n.reactions, n.species, n.rates).ok).toBe(false);
  });
});
