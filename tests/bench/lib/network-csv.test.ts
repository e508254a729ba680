import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { networkCsv } from "../../../bench/lib/network-csv";
import { q } from "../../../bench/lib/rational";
import { phosphorylationTwoSiteSymbolicNetwork } from "../../../bench/lib/systems";

describe("networkCsv", () => {
  it("writes one directed reaction per row with coefficients, 0 for the empty complex and exact rates", () => {
    const text = networkCsv(
      [
        { reactants: { A: 2 }, products: { B: 1 }, rate: "k1" },
        { reactants: {}, products: { A: 1 }, rate: q(3n, 2n) },
      ],
      ["invented example"],
    );
    expect(text).toBe("# invented example\nreaction,rate\n2A -> B,k1\n0 -> A,3/2\n");
  });
  it("bench/systems/phospho-2site-symbolic.csv is the generator's output", () => {
    const n = phosphorylationTwoSiteSymbolicNetwork();
    expect(readFileSync("bench/systems/phospho-2site-symbolic.csv", "utf8")).toBe(networkCsv(n.reactions, n.comments));
    expect(n.reactions).toHaveLength(12);
    expect(n.rates).toHaveLength(12);
  });
});
