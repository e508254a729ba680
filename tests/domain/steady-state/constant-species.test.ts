import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { analyseNetwork } from "@domain/steady-state/analyse";
import { kineticsRing, massActionOdes } from "@domain/steady-state/kinetics";

// Schlögl's second model, A + 2X <-> 3X, X <-> B with A and B held by a reservoir (Schlögl,
// "Chemical reaction models for non-equilibrium phase transitions", Z. Physik 253, 1972).
// dX/dt = k1·A·X² − k2·X³ − k3·X + k4·B. With k1·A = 6, k2 = 1, k3 = 11, k4·B = 6 this is
// −(X − 1)(X − 2)(X − 3) (expanded by hand): three positive steady states, f'(X) = −3X² + 12X − 11
// is −2, 1, −2 at X = 1, 2, 3, so the outer two are stable and the middle one unstable.
const FED = (a: string, b: string) =>
  `# constant: ${a}, ${b}\nreaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + 2X <-> 3X,k1,k2,3,1\nX <-> B,k3,k4,11,2\n`;

describe("constant species in the kinetics", () => {
  it("a given concentration multiplies the rate constant", () => {
    const net = parseNetworkCsv(FED("A = 2", "B = 3"));
    const kin = kineticsRing(net);
    expect(kin.species).toEqual(["X"]);
    expect(massActionOdes(net, kin).map((p) => kin.ring.format(p))).toEqual(["-X^3 + 6*X^2 - 11*X + 6"]);
  });

  it("a symbolic concentration is a parameter of the ring, like a rate constant", () => {
    const net = parseNetworkCsv(FED("A", "B = 3"));
    const kin = kineticsRing(net);
    expect(kin.rateParameters).toEqual(["A"]);
    expect(massActionOdes(net, kin).map((p) => kin.ring.format(p))).toEqual(["-X^3 + 3*X^2*A - 11*X + 6"]);
  });

  it("the fed Schlögl switch has three positive steady states, the outer two stable", () => {
    const r = analyseNetwork(parseNetworkCsv(FED("A = 2", "B = 3")));
    expect(r.steadyStates?.map((s) => [s.concentrations.X, s.stable])).toEqual([
      [1, true],
      [2, false],
      [3, true],
    ]);
    expect(r.parameters.values).toMatchObject({ A: "2", B: "3" });
  });

  it("with a symbolic feed the steady states wait for its value, as for a rate constant", () => {
    const r = analyseNetwork(parseNetworkCsv(FED("A", "B = 3")));
    expect(r.parameters.rateConstants).toEqual(["A"]);
    expect(r.steadyStates).toBeNull();
    expect(r.steadyStatesReason).toMatch(/missing: A/);
  });
});
