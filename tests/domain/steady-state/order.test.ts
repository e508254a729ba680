import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { defaultOrder, nonInteractingSpecies, resolveOrder, SteadyStateInputError } from "@domain/steady-state/order";
import { TWO_SITE_SYMBOLIC } from "./helpers";

describe("elimination order", () => {
  it("puts the non-interacting species (Feliu & Wiuf 2012) first, with the reason", () => {
    const net = parseNetworkCsv(TWO_SITE_SYMBOLIC);
    expect(nonInteractingSpecies(net)).toEqual(["ES0", "ES1", "FS2", "FS1"]);
    const d = defaultOrder(net);
    expect(d.order.slice(0, 4)).toEqual(["ES0", "ES1", "FS2", "FS1"]);
    expect(d.reason).toContain("linear");
  });
  it("completes a partial user order and rejects unknown or repeated names", () => {
    expect(resolveOrder(["S"], ["C", "E", "S", "P"])).toEqual(["S", "C", "E", "P"]);
    expect(() => resolveOrder(["Q"], ["A"])).toThrow(SteadyStateInputError);
    expect(() => resolveOrder(["A", "A"], ["A"])).toThrow(/twice/);
  });
});
