import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { kineticsRing } from "@domain/steady-state/kinetics";
import { linearElimination } from "@domain/steady-state/linear-elimination";
import { formatExpression, isPositiveExpression } from "@domain/steady-state/rational-expression";
import { steadyStateSystem } from "@domain/steady-state/system";
import { TWO_SITE_SYMBOLIC } from "./helpers";

const rowsOf = (csv: string, order?: string[]) => {
  const net = parseNetworkCsv(csv);
  const kin = kineticsRing(net, order ? { speciesOrder: order } : {});
  const sys = steadyStateSystem(net, kin, [], null);
  return { kin, rows: sys.keptRows.map((i) => sys.odes[i]) };
};

describe("linear elimination (Feliu & Wiuf, SIAM J. Appl. Math. 2012)", () => {
  it("solves the enzyme complex of E + S <-> C and then finds no positive steady state for E + S <-> C -> E + P", () => {
    const { kin, rows } = rowsOf("reaction,rate,reverse_rate\nE + S <-> C,k1,k2\nC -> E + P,k3,\n", ["C", "E", "S", "P"]);
    const r = linearElimination(kin, rows);
    expect(r.eliminated[0].species).toBe("C");
    expect(kin.ring.format(r.eliminated[0].expression.num)).toBe(kin.ring.format(kin.ring.parse("k1*E*S")));
    expect(r.infeasible).toContain("cannot vanish");
  });

  it("two-site cycle: intermediates first, then substrates; all expressions positive (Thomson & Gunawardena, Nature 2009)", () => {
    const { kin, rows } = rowsOf(TWO_SITE_SYMBOLIC, ["ES0", "ES1", "FS2", "FS1", "S1", "S2", "S0", "E", "F"]);
    const r = linearElimination(kin, rows);
    expect(r.eliminated.map((e) => e.species)).toEqual(["ES0", "ES1", "FS2", "FS1", "S1", "S2"]);
    expect(r.remaining).toEqual([]);
    expect(r.remainingSpecies).toEqual(["S0", "E", "F"]);
    expect(r.eliminated.every((e) => isPositiveExpression(e.expression))).toBe(true);
    // FS1 = k3·ES0/k12 (the flux through S1F balances the flux through ES0), with ES0 = k1·S0·E/(k2 + k3).
    const fs1 = r.eliminated.find((e) => e.species === "FS1")!;
    expect(formatExpression(fs1.expression)).toBe(
      formatExpression({ num: kin.ring.parse("k1*k3*S0*E"), den: kin.ring.parse("k2*k12 + k3*k12") }),
    );
  });

  it("keeps the species it is told to keep", () => {
    const { kin, rows } = rowsOf("reaction,rate,reverse_rate\nA <-> B,k1,k2\n");
    const r = linearElimination(kin, rows, { keep: new Set(["A"]) });
    expect(r.eliminated.map((e) => e.species)).toEqual(["B"]);
  });
});
