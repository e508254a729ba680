import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { kineticsRing, massActionOdes } from "@domain/steady-state/kinetics";
import { massActionTerms } from "@domain/steady-state/ode-terms";

const net = (csv: string) => parseNetworkCsv(csv);

describe("massActionTerms", () => {
  it("reads the enzyme mechanism's terms in reaction order (Horn & Jackson 1972, eq. 2.5; worked by hand)", () => {
    const [dE, dS] = massActionTerms(net("reaction,rate,reverse_rate\nE + S <-> C,k1,k2\nC -> E + P,k3,\n"));
    expect(dS).toEqual({
      species: "S",
      terms: [
        { coefficient: -1, rate: "k1", factors: [{ species: "E", power: 1 }, { species: "S", power: 1 }] },
        { coefficient: 1, rate: "k2", factors: [{ species: "C", power: 1 }] },
      ],
    });
    expect(dE!.terms.map((t) => [t.coefficient, t.rate])).toEqual([[-1, "k1"], [1, "k2"], [1, "k3"]]);
  });

  it("merges equal terms and drops those that cancel", () => {
    const [dX] = massActionTerms(net("reaction,rate\n0 -> X,f\nX -> 0,d\nX -> 0,d\n"));
    expect(dX!.terms.map((t) => [t.coefficient, t.rate])).toEqual([[1, "f"], [-2, "d"]]);
    const [dE] = massActionTerms(net("reaction,rate\nE + S -> E + P,k\n"));
    expect(dE!.terms).toEqual([]);
  });

  it("keeps rate values and held concentrations symbolic, a held species marked constant", () => {
    const [dX] = massActionTerms(net("# constant: A = 2\nreaction,rate,rate_value\nA + 2X -> 3X,k1,5\n"));
    expect(dX!.terms).toEqual([{ coefficient: 1, rate: "k1", factors: [{ species: "X", power: 2 }, { species: "A", power: 1, constant: true }] }]);
  });

  it("is the exact builder's polynomial, term for term", () => {
    const n = net("reaction,rate,reverse_rate\n2A <-> B,k1,k2\nA + B -> 2B,k3,\n");
    const kin = kineticsRing(n, { substituteRates: false });
    const exact = massActionOdes(n, kin).map((p) => kin.ring.format(p));
    const fromTerms = massActionTerms(n).map((o) =>
      o.terms.map((t) => ({ c: t.coefficient, m: [t.rate, ...t.factors.map((f) => (f.power === 1 ? f.species : `${f.species}^${f.power}`))].sort().join("*") })),
    );
    // Same number of terms and the same coefficients as the ring's own printing.
    exact.forEach((text, i) => expect(text.split(/ [+-] /).length).toBe(fromTerms[i]!.length));
    expect(fromTerms[0]!.map((t) => t.c)).toEqual([-2, 2, -1]);
  });
});
