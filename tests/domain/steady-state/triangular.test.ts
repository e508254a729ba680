import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { kineticsRing } from "@domain/steady-state/kinetics";
import { genericConditions, leadingCoefficientInSpecies, leadingSpecies, triangularForm } from "@domain/steady-state/triangular";

describe("triangular form and generic conditions", () => {
  const net = parseNetworkCsv("reaction,rate,reverse_rate\nX <-> Y,k1,k2\n");
  const kin = kineticsRing(net, { totalCount: 1 }); // Q[X, Y, k1, k2, T1], lex(2), grevlex(3)
  const p = (s: string) => kin.ring.parse(s);

  it("reads the leading species and its coefficient in the parameters (Cox, Little & O'Shea, ch. 6 §3)", () => {
    expect(leadingSpecies(p("k1*Y - k2*T1 + Y*k2"), kin)).toBe("Y");
    expect(leadingSpecies(p("k1 - k2"), kin)).toBeNull();
    expect(kin.ring.format(leadingCoefficientInSpecies(p("k1*Y + k2*Y - k2*T1"), kin))).toBe(kin.ring.format(p("k1 + k2")));
  });

  it("groups by leading species from the last species up and lists non-constant leading coefficients", () => {
    const basis = [p("k1*Y + k2*Y - k1*T1"), p("X + Y - T1")];
    const blocks = triangularForm(basis, kin);
    expect(blocks.map((b) => b.species)).toEqual(["Y", "X"]);
    expect(genericConditions(basis, kin)).toEqual([kin.ring.format(p("k1 + k2"))]);
  });
});
