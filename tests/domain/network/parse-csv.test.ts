import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { formatRational } from "../../../domain/algebra/rational";
import { formatComplex, NetworkFileError, parseNetworkCsv, tryParseNetworkCsv } from "../../../domain/network";
import { seededRandom } from "../../support/prng";

const fixture = (name: string) => readFileSync(join(__dirname, "../../fixtures/networks", name), "utf8");

describe("parseNetworkCsv", () => {
  it("reads the Michaelis–Menten fixture: two directed reactions from the reversible row", () => {
    const net = parseNetworkCsv(fixture("michaelis-menten.csv"));
    expect(net.species).toEqual(["E", "S", "C", "P"]);
    expect(
      net.reactions.map((r) => `${r.id} ${formatComplex(r.reactant)} -> ${formatComplex(r.product)} [${r.rate}] line ${r.row} ${r.direction}`),
    ).toEqual([
      "r1 E + S -> C [k1] line 3 forward",
      "r2 C -> E + S [km1] line 3 reverse",
      "r3 C -> E + P [k2] line 4 forward",
    ]);
    expect(net.reactions[0].label).toBe("binding");
    expect(net.rows).toHaveLength(2);
  });

  it("handles semicolons, BOM, CRLF, blank and comment lines, quoted fields with delimiters and newlines", () => {
    const net = parseNetworkCsv(fixture("format-features.csv"));
    expect(net.species).toEqual(["E", "S", "C", "A", "B"]);
    expect(net.reactions.map((r) => r.row)).toEqual([4, 4, 7, 9]);
    expect(net.reactions[0].label).toBe("binds; fast");
    expect(net.reactions[2].label).toBe("two\r\nlines");
    expect(net.reactions.map((r) => r.rate)).toEqual(["kon", "k2", "k3", "k4"]);
    expect(net.reactions.map((r) => (r.rateValue ? formatRational(r.rateValue) : null))).toEqual(["1/2", null, "1/4", "3/100"]);
    expect(net.reactions[2].reactant).toEqual({ A: 2 });
    expect(net.reactions[3].product).toEqual({});
  });

  it("gives default rate names k<i> per directed reaction, skipping names already taken", () => {
    const net = parseNetworkCsv("reaction,rate\nA <-> B,\nB -> C,k2\nC <- D,\n");
    // r1 A→B k1, r2 B→A: k2 is taken by row 3 → k2_2, r3 B→C k2 (explicit), r4 D→C k4.
    expect(net.reactions.map((r) => r.rate)).toEqual(["k1", "k2_2", "k2", "k4"]);
    expect(net.reactions[3].reactant).toEqual({ D: 1 });
    expect(parseNetworkCsv("reaction\nk1 -> B\n").reactions[0].rate).toBe("k1_2");
  });

  it("shares one rate symbol between reactions, spreading its value", () => {
    const net = parseNetworkCsv("reaction,rate,rate_value\nA -> B,k,2/4\nB -> C,k,\nC -> A,k,0.5\n");
    expect(net.reactions.map((r) => formatRational(r.rateValue!))).toEqual(["1/2", "1/2", "1/2"]);
  });

  it("accepts header names in any case and columns in any order; fewer cells than columns is fine", () => {
    const net = parseNetworkCsv("Rate_Value,REACTION,label\n3,A -> B\n");
    expect(formatRational(net.reactions[0].rateValue!)).toBe("3");
    expect(net.reactions[0].label).toBeUndefined();
  });

  it("stores nothing from an invalid file", () => {
    const result = tryParseNetworkCsv("reaction\nA -> B\nA -> A\n");
    expect(result.ok).toBe(false);
    expect("network" in result).toBe(false);
    expect(() => parseNetworkCsv("reaction\nA -> B\nA -> A\n")).toThrow(NetworkFileError);
  });

  it("never crashes on seeded random corruptions of valid files", () => {
    const rand = seededRandom(99);
    const sources = ["michaelis-menten.csv", "two-site-phosphorylation.csv", "format-features.csv", "cubic-autocatalysis.csv"].map(fixture);
    const alphabet = [",", ";", '"', "\n", "\r\n", "#", "-", ">", "<", "+", "0", "2", "A", " ", "/", ".", "e", "_", "\uFEFF"];
    for (let t = 0; t < 600; t++) {
      let text = sources[t % sources.length];
      const edits = 1 + Math.floor(rand() * 4);
      for (let e = 0; e < edits; e++) {
        const at = Math.floor(rand() * (text.length + 1));
        const kind = rand();
        if (kind < 0.4) text = text.slice(0, at) + alphabet[Math.floor(rand() * alphabet.length)] + text.slice(at);
        else if (kind < 0.8) text = text.slice(0, at) + text.slice(at + 1 + Math.floor(rand() * 3));
        else text = text.slice(0, at);
      }
      try {
        const net = parseNetworkCsv(text);
        expect(net.reactions.length).toBeGreaterThan(0);
      } catch (err) {
        expect(err).toBeInstanceOf(NetworkFileError);
        const problems = (err as NetworkFileError).problems;
        expect(problems.length).toBeGreaterThan(0);
        for (const p of problems) {
          expect(Number.isInteger(p.row) && p.row >= 1).toBe(true);
          expect(p.message.length).toBeGreaterThan(0);
        }
      }
    }
  });
});

describe("parseNetworkCsv hints", () => {
  it("points out tab-separated headers", () => {
    const result = tryParseNetworkCsv("reaction\trate\nA -> B\tk\n");
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems.some((p) => p.row === 1 && p.expected?.includes("tabs"))).toBe(true);
  });
});
