import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { SteadyStateInputError } from "@domain/steady-state/order";
import { structureStage } from "@domain/steady-state/stages/structure";
import { initial } from "../helpers";

const MM = parseNetworkCsv("reaction,rate,reverse_rate\nE + S <-> C,k1,k2\nC -> E + P,k3,\n");

describe("stage 1: structure", () => {
  it("gives the default order, the laws aligned with the species and the kept ODE rows", () => {
    const s = structureStage(MM, {});
    // Feliu & Wiuf 2012: C is non-interacting and goes first; E and S are kept free (one per law).
    expect(s.species).toEqual(["C", "P", "E", "S"]);
    expect(s.laws).toEqual([
      [1n, 0n, 1n, 0n],
      [0n, 1n, 1n, 1n],
    ]);
    // Four species, rank 2: two independent ODE rows.
    expect(s.odeRows).toHaveLength(2);
    expect(s.unfinished).toEqual([]);
  });

  it("an initial concentration for a species the network lacks is a typed input problem", () => {
    expect(() => structureStage(MM, { initial: initial("Z=1") })).toThrow(
      expect.objectContaining({ problem: { kind: "unknown-species", input: "initial", name: "Z", species: ["E", "S", "C", "P"] } }),
    );
    expect(() => structureStage(MM, { order: ["Q"] })).toThrow(SteadyStateInputError);
  });
});
