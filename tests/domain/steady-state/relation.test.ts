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
});
