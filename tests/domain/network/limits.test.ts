import { describe, expect, it } from "vitest";
import { NETWORK_LIMITS, networkLimitProblems, parseNetworkCsv, rateValueWithinLimits } from "@domain/network/index";

/** A chain S0 -> S1 -> … with `n` species and n-1 reactions. */
const chain = (n: number) => ["reaction,rate", ...Array.from({ length: n - 1 }, (_, i) => `S${i} -> S${i + 1},k${i}`)].join("\n") + "\n";

describe("network size limits (checked before any algebra)", () => {
  it("accepts a network at the limits and refuses one species or reaction more, with a located problem", () => {
    expect(networkLimitProblems(parseNetworkCsv(chain(NETWORK_LIMITS.maxSpecies)))).toEqual([]);
    const over = networkLimitProblems(parseNetworkCsv(chain(NETWORK_LIMITS.maxSpecies + 1)));
    expect(over).toHaveLength(1);
    expect(over[0]).toMatchObject({ row: 1, message: `the network has ${NETWORK_LIMITS.maxSpecies + 1} species` });
    const rows = ["reaction,rate,reverse_rate", ...Array.from({ length: 76 }, (_, i) => `A${i % 10} <-> B${i % 7},k${i},l${i}`)];
    const many = networkLimitProblems(parseNetworkCsv(rows.join("\n") + "\n"));
    expect(many.map((p) => p.message)).toEqual(["the network has 152 reactions (a `<->` row counts as two)"]);
  });

  it("judges rate values by their text alone", () => {
    for (const ok of ["2", "0.5", "2.5e-3", "1e100", "1E-100", "3/2", "1e+007"]) expect(rateValueWithinLimits(ok)).toBe(true);
    for (const bad of ["1e60000000", "1e99999999999", "1e101", "1e-101", "1".repeat(61)]) expect(rateValueWithinLimits(bad)).toBe(false);
  });
});
