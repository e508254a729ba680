import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { defaultOrder, inputProblemText, nonInteractingSpecies, resolveOrder, SteadyStateInputError } from "@domain/steady-state/order";
import { TWO_SITE_SYMBOLIC } from "./helpers";

describe("elimination order", () => {
  it("puts the non-interacting species (Feliu & Wiuf 2012) first, with the reason", () => {
    const net = parseNetworkCsv(TWO_SITE_SYMBOLIC);
    expect(nonInteractingSpecies(net)).toEqual(["ES0", "ES1", "FS2", "FS1"]);
    const d = defaultOrder(net);
    expect(d.order.slice(0, 4)).toEqual(["ES0", "ES1", "FS2", "FS1"]);
    expect(d.reason).toContain("linear");
  });
  it("keeps one species per conservation law free, last: S0, E, F for the two-site cycle", () => {
    const net = parseNetworkCsv(TWO_SITE_SYMBOLIC);
    const laws: Record<string, number>[] = [{ E: 1, ES0: 1, ES1: 1 }, { F: 1, FS1: 1, FS2: 1 }, { S0: 1, S1: 1, S2: 1, ES0: 1, ES1: 1, FS1: 1, FS2: 1 }];
    expect(defaultOrder(net, laws).order).toEqual(["ES0", "ES1", "FS2", "FS1", "S1", "S2", "S0", "E", "F"]);
    const mm = parseNetworkCsv("reaction\nE + S <-> C\nC -> E + P\n");
    expect(defaultOrder(mm, [{ E: 1, C: 1 }, { S: 1, C: 1, P: 1 }]).order).toEqual(["C", "P", "E", "S"]);
  });
  it("completes a partial user order and rejects unknown or repeated names", () => {
    expect(resolveOrder(["S"], ["C", "E", "S", "P"])).toEqual(["S", "C", "E", "P"]);
    expect(() => resolveOrder(["Q"], ["A"])).toThrow(SteadyStateInputError);
    expect(() => resolveOrder(["A", "A"], ["A"])).toThrow(/twice/);
  });
  it("gives bad input as a typed reason whose default words name no command-line option", () => {
    let caught: unknown;
    try {
      resolveOrder(["Q"], ["A", "B"]);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(SteadyStateInputError);
    const e = caught as SteadyStateInputError;
    expect(e.problem).toEqual({ kind: "unknown-species", input: "order", name: "Q", species: ["A", "B"] });
    expect(e.message).toBe("elimination order: 'Q' is not a species of the network (species: A, B)");
    expect(inputProblemText(e.problem, (n) => `--${n}`)).toBe("--order: 'Q' is not a species of the network (species: A, B)");
  });
});
