import { describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { diffNetworks } from "~/networks/diff";

const s = (csv: string) => analyseStructure(parseNetworkCsv(csv));

describe("diffNetworks", () => {
  const v1 = s("reaction,label,rate,reverse_rate,rate_value\nE + S <-> C,binding,k1,k2,2\nC -> E + P,,k3,,1\n");

  it("finds added and removed species and reactions, and changed rates and labels", () => {
    const v2 = s("reaction,label,rate,reverse_rate,rate_value\nE + S <-> C,bind,k1,k2,5/2\nC -> E + Q,,k3,,1\n");
    const d = diffNetworks(v1, v2);
    expect(d.speciesAdded).toEqual(["Q"]);
    expect(d.speciesRemoved).toEqual(["P"]);
    expect(d.reactionsAdded.map((r) => `${r.reactant}>${r.product}`)).toEqual(["C>E + Q"]);
    expect(d.reactionsRemoved.map((r) => `${r.reactant}>${r.product}`)).toEqual(["C>E + P"]);
    expect(d.reactionsChanged.map((c) => [c.reaction, c.changes])).toEqual([
      ["E + S → C", ["rate value 2 → 5/2", "label binding → bind"]],
      ["C → E + S", ["label binding → bind"]],
    ]);
    expect(d.identical).toBe(false);
  });

  it("treats reordered rows and `<->` written as two rows as no change", () => {
    const v2 = s("reaction,label,rate,rate_value\nC -> E + P,,k3,1\nC -> E + S,binding,k2,\nE + S -> C,binding,k1,2\n");
    const d = diffNetworks(v1, v2);
    expect(d.identical).toBe(true);
  });

  it("matches repeated copies of one reaction one by one", () => {
    const a = s("reaction,rate\nA -> B,k\n");
    const b = s("reaction,rate\nA -> B,k\nA -> B,k\n");
    expect(diffNetworks(a, b).reactionsAdded).toHaveLength(1);
    expect(diffNetworks(b, a).reactionsRemoved).toHaveLength(1);
  });
});

describe("diffNetworks with constant species", () => {
  const side = (csv: string) => analyseStructure(parseNetworkCsv(csv));
  it("names species held, released and held at another concentration", () => {
    const v1 = side("# constant: A = 2\nreaction\nA + X -> 2X\nX -> B\n");
    const v2 = side("# constant: A = 5/2, B\nreaction\nA + X -> 2X\nX -> B\n");
    const d = diffNetworks(v1, v2);
    expect(d.constantsChanged).toEqual(["A: 2 → 5/2", "B held constant (symbolic)"]);
    expect(d.speciesRemoved).toEqual(["B"]);
    expect(d.identical).toBe(false);
    expect(diffNetworks(v2, v1).constantsChanged).toEqual(["A: 5/2 → 2", "B no longer held constant"]);
    const ordered = side("# constant: A = 2\nreaction,rate\nA + X -> 2X,k1\nX -> B,k2\n");
    expect(diffNetworks(ordered, side("reaction,rate\nX -> B,k2\nA + X -> 2X,k1\n# constant: A = 2\n")).identical).toBe(true);
  });

  it("treats a structure stored before constant species existed as having none", () => {
    const v1 = side("reaction\nA -> B\n");
    const { constants: _drop, ...old } = v1;
    expect(diffNetworks(old, v1).identical).toBe(true);
  });
});

describe("diffNetworks with stored initial values", () => {
  const side = (csv: string) => analyseStructure(parseNetworkCsv(csv));
  it("names initial values set, changed and removed; a version differing only there is not identical", () => {
    const v1 = side("reaction\nA -> B\n# initial: A = 10\n");
    const v2 = side("reaction\nA -> B\n# initial: A = 5, B = 0\n");
    const d = diffNetworks(v1, v2);
    expect(d.initialChanged).toEqual(["A: 10 → 5", "B = 0"]);
    expect(d.identical).toBe(false);
    expect(diffNetworks(v2, side("reaction\nA -> B\n")).initialChanged).toEqual(["A: no initial value", "B: no initial value"]);
  });
});
