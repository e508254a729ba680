import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { kineticsRing } from "@domain/steady-state/kinetics";
import { testRelation } from "@domain/steady-state/relation";
import { steadyStateSystem } from "@domain/steady-state/system";

describe("relation test (ideal and radical membership after saturation)", () => {
  const net = parseNetworkCsv("reaction,rate\nA + B -> 2B,k1\nB -> A,k2\n");
  const kin = kineticsRing(net);
  const sys = steadyStateSystem(net, kin, [], null);
  const rows = sys.keptRows.map((i) => sys.odes[i]);

  it("k1·A − k2 vanishes at every positive steady state (Shinar & Feinberg 2010)", () => {
    expect(testRelation("k1*A - k2", kin, rows, {})).toMatchObject({ inIdeal: true, vanishes: true, remainder: "0" });
  });
  it("(k1·A − k2)² is in the ideal too; A − B is not, with its remainder", () => {
    expect(testRelation("(k1*A - k2)^2", kin, rows, {}).inIdeal).toBe(true);
    const r = testRelation("A - B", kin, rows, {});
    expect(r.inIdeal).toBe(false);
    expect(r.vanishes).toBe(false);
    expect(r.remainder).not.toBe("0");
  });
  it("radical but not ideal membership is told apart: dX/dt = (X − 1)² and the relation X − 1", () => {
    const net2 = parseNetworkCsv("reaction,rate,rate_value\n0 -> X,k1,1\nX -> 0,k2,2\n2X -> 3X,k3,1\n");
    const kin2 = kineticsRing(net2);
    const sys2 = steadyStateSystem(net2, kin2, [], null);
    const rows2 = sys2.keptRows.map((i) => sys2.odes[i]);
    expect(kin2.ring.format(rows2[0])).toBe("X^2 - 2*X + 1");
    const r = testRelation("X - 1", kin2, rows2, {});
    expect(r).toMatchObject({ inIdeal: false, vanishes: true, remainder: "X - 1" });
  });

  it("accepts rate constants with values in a numeric run: k1 - 60 is substituted, not an unknown variable", () => {
    const net3 = parseNetworkCsv("reaction,rate,rate_value\nA + B -> 2B,k1,2\nB -> A,k2,3\n");
    const kin3 = kineticsRing(net3);
    const sys3 = steadyStateSystem(net3, kin3, [], null);
    const rows3 = sys3.keptRows.map((i) => sys3.odes[i]);
    // Steady states: k1·A = k2, so A = 3/2 (hand computation); k1*A − k2 becomes 2*A − 3.
    expect(testRelation("k1*A - k2", kin3, rows3, {})).toMatchObject({ expression: "2*A - 3", inIdeal: true });
    expect(testRelation("k1 - 60", kin3, rows3, {})).toMatchObject({ expression: "-58", inIdeal: false, vanishes: false });
    expect(() => testRelation("k9 - 1", kin3, rows3, {})).toThrow(/unknown variable 'k9'/);
  });

  it("accepts totals: symbolic totals join the ideal by their conservation equations, numeric ones are substituted", () => {
    // A <-> B (k1, k2), law A + B = T1: at steady state A = k2·T1/(k1 + k2) (hand computation).
    const net4 = parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n");
    const kin4 = kineticsRing(net4);
    const sys4 = steadyStateSystem(net4, kin4, [], null);
    const rows4 = sys4.keptRows.map((i) => sys4.odes[i]);
    const laws = [[1n, 1n]];
    const symbolic = testRelation("(k1 + k2)*A - k2*T1", kin4, rows4, {}, { names: ["T1"], laws, values: null });
    expect(symbolic.inIdeal).toBe(true);
    const net5 = parseNetworkCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,1,3\n");
    const kin5 = kineticsRing(net5);
    const sys5 = steadyStateSystem(net5, kin5, [], null);
    const rows5 = sys5.keptRows.map((i) => sys5.odes[i]);
    // With k1 = 1, k2 = 3 and T1 = 4 the steady state is A = 3, B = 1; 4·A − 3·T1 vanishes only in that class.
    const numeric = testRelation("4*A - 3*T1", kin5, rows5, {}, { names: ["T1"], laws, values: [{ num: 4n, den: 1n }] });
    expect(numeric).toMatchObject({ expression: "4*A - 12", inIdeal: true });
    expect(testRelation("A - 3*B", kin5, rows5, {}).inIdeal).toBe(true);
  });
});

describe("testRelationOnNetwork", () => {
  it("names the totals T1, … like the analysis, substitutes them from initial concentrations, and asks about one class only when a total is named", async () => {
    const { testRelationOnNetwork } = await import("@domain/steady-state/relation");
    const net = parseNetworkCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,1,3\n");
    // k1 = 1, k2 = 3, A(0) = 4: T1 = 4, steady state A = 3, B = 1 (hand computation).
    const m = new Map([["A", { num: 4n, den: 1n }]]);
    // Without a total in the expression the question is about every positive steady state (A = 3B), not one class.
    expect(testRelationOnNetwork(net, "A - 3", { initial: m }).inIdeal).toBe(false);
    expect(testRelationOnNetwork(net, "A - 3*B", { initial: m }).inIdeal).toBe(true);
    expect(testRelationOnNetwork(net, "A - 3*T1/4", { initial: m }).inIdeal).toBe(true);
    expect(testRelationOnNetwork(net, "k2*B - 3*k1*T1/4", { initial: m }).inIdeal).toBe(true);
    const sym = parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n");
    expect(testRelationOnNetwork(sym, "(k1 + k2)*B - k1*T1").inIdeal).toBe(true);
  });
});
