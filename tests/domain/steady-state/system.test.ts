import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { kineticsRing } from "@domain/steady-state/kinetics";
import { independentRows, steadyStateSystem, totalsFromInitial } from "@domain/steady-state/system";
import { initial } from "./helpers";

describe("steady-state system with conservation equations", () => {
  const mm = parseNetworkCsv("reaction,rate,reverse_rate\nE + S <-> C,k1,k2\nC -> E + P,k3,\n");
  const laws = [[1n, 0n, 1n, 0n], [0n, 1n, 1n, 1n]]; // E + C, S + C + P (species E, S, C, P)

  it("keeps rank-many independent ODE rows and adds one equation per conservation law (square system)", () => {
    const kin = kineticsRing(mm, { totalCount: 2 });
    const sys = steadyStateSystem(mm, kin, laws, null);
    expect(sys.keptRows).toEqual([0, 1]);
    expect(sys.equations).toHaveLength(4);
    expect(sys.conservationEquations.map((p) => kin.ring.format(p))).toEqual(["E + C - T1", "S + C + P - T2"].map((t) => kin.ring.format(kin.ring.parse(t))));
  });

  it("numeric totals come from the initial concentrations", () => {
    const totals = totalsFromInitial(laws, mm.species, initial("E=1/10,S=2"));
    expect(totals).toEqual([{ num: 1n, den: 10n }, { num: 2n, den: 1n }]);
  });

  it("independentRows picks a maximal independent set greedily", () => {
    expect(independentRows([[-1, 1], [1, -1]])).toEqual([0]);
    expect(independentRows([[1, 0], [2, 0], [0, 1]])).toEqual([0, 2]);
  });
});
