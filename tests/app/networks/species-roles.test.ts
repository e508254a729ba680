import { describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { speciesRoles } from "~/networks/species-roles";

const rolesOf = (csv: string) => speciesRoles(analyseStructure(parseNetworkCsv(csv)));

describe("speciesRoles", () => {
  it("counts a species on both sides of a reaction as used (autocatalysis 2X + Y -> 3X, worked by hand)", () => {
    expect(rolesOf("reaction,rate\n2X + Y -> 3X,k1\nX -> 0,k2\n")).toEqual([
      { species: "X", madeBy: ["r1"], usedBy: ["r1", "r2"] },
      { species: "Y", madeBy: [], usedBy: ["r1"] },
    ]);
  });

  it("lists a catalyst as used but not made (E + S -> E + P)", () => {
    expect(rolesOf("reaction,rate\nE + S -> E + P,k\n")).toEqual([
      { species: "E", madeBy: [], usedBy: ["r1"] },
      { species: "S", madeBy: [], usedBy: ["r1"] },
      { species: "P", madeBy: ["r1"], usedBy: [] },
    ]);
  });

  it("splits a reversible row into its two directed reactions", () => {
    expect(rolesOf("reaction\nA <-> B\n")).toEqual([
      { species: "A", madeBy: ["r2"], usedBy: ["r1"] },
      { species: "B", madeBy: ["r1"], usedBy: ["r2"] },
    ]);
  });
});
