import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { formatRational } from "../../../domain/algebra/rational";
import { formatComplex, formatNetworkCsv, parseNetworkCsv, type Network } from "../../../domain/network";
import { seededRandom } from "../../support/prng";
import { randomNetworkCsv } from "./random-network";

const fixture = (name: string) => readFileSync(join(__dirname, "../../fixtures/networks", name), "utf8");

/** Everything but source line numbers. */
const essence = (n: Network) => ({
  species: n.species,
  reactions: n.reactions.map((r) => [
    r.id,
    r.label ?? null,
    formatComplex(r.reactant),
    formatComplex(r.product),
    r.rate,
    r.rateValue ? formatRational(r.rateValue) : null,
    r.direction,
  ]),
});

describe("formatNetworkCsv", () => {
  it("writes defaults explicitly and only the columns in use", () => {
    expect(formatNetworkCsv(parseNetworkCsv("reaction\nA <-> B\n"))).toBe("reaction,rate,reverse_rate\nA <-> B,k1,k2\n");
    expect(formatNetworkCsv(parseNetworkCsv("reaction,rate_value\n2 A -> 0,0.5\n"))).toBe("reaction,rate,rate_value\n2A -> 0,k1,1/2\n");
  });

  it("quotes labels that contain the delimiter, quotes or newlines", () => {
    const text = formatNetworkCsv(parseNetworkCsv('reaction,label\nA -> B,"a, ""b""\nc"\n'));
    expect(parseNetworkCsv(text).reactions[0].label).toBe('a, "b"\nc');
  });

  it.each(["michaelis-menten.csv", "two-site-phosphorylation.csv", "cubic-autocatalysis.csv", "shinar-feinberg-acr.csv", "triangle.csv", "cycle.csv", "format-features.csv"])(
    "round-trips %s",
    (name) => {
      const net = parseNetworkCsv(fixture(name));
      const again = parseNetworkCsv(formatNetworkCsv(net));
      expect(essence(again)).toEqual(essence(net));
      expect(formatNetworkCsv(again)).toBe(formatNetworkCsv(net));
    },
  );

  it("round-trips seeded random networks", () => {
    const rand = seededRandom(31337);
    for (let t = 0; t < 200; t++) {
      const net = parseNetworkCsv(randomNetworkCsv(rand));
      expect(essence(parseNetworkCsv(formatNetworkCsv(net)))).toEqual(essence(net));
    }
  });
});
