import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { kineticsRing, massActionOdes } from "@domain/steady-state/kinetics";

describe("mass-action ODEs (Horn & Jackson 1972, eq. 2.5)", () => {
  const mm = parseNetworkCsv("reaction,rate,reverse_rate\nE + S <-> C,k1,k2\nC -> E + P,k3,\n");

  it("builds symbolic right-hand sides in the block order lex(species), grevlex(parameters)", () => {
    const kin = kineticsRing(mm);
    expect(kin.ring.orderName).toBe("lex(4), grevlex(3)");
    expect(kin.ring.vars).toEqual(["E", "S", "C", "P", "k1", "k2", "k3"]);
    const odes = massActionOdes(mm, kin).map((p) => kin.ring.format(p));
    const of = (s: string) => odes[kin.species.indexOf(s)];
    expect(kin.ring.parse(of("S"))).toEqual(kin.ring.parse("-k1*E*S + k2*C"));
    expect(kin.ring.parse(of("C"))).toEqual(kin.ring.parse("k1*E*S - k2*C - k3*C"));
    expect(kin.ring.parse(of("P"))).toEqual(kin.ring.parse("k3*C"));
  });

  it("substitutes exact values and keeps the rest symbolic", () => {
    const net = parseNetworkCsv("reaction,rate,reverse_rate,rate_value\n2A <-> B,k1,k2,1/3\n");
    const kin = kineticsRing(net);
    expect(kin.rateParameters).toEqual(["k2"]);
    const [a, b] = massActionOdes(net, kin);
    expect(kin.ring.format(a)).toBe(kin.ring.format(kin.ring.parse("-2/3*A^2 + 2*B*k2")));
    expect(kin.ring.format(b)).toBe(kin.ring.format(kin.ring.parse("1/3*A^2 - B*k2")));
  });

  it("adds total symbols that do not clash with species or rate names", () => {
    const net = parseNetworkCsv("reaction,rate\nT1 -> B,k\n");
    const kin = kineticsRing(net, { totalCount: 2 });
    expect(kin.totals).toEqual(["_T1", "T2"]);
  });
});
