import { describe, expect, it } from "vitest";
import { formatRational, rational, type Rational } from "../../../../domain/algebra/rational";
import { formatNetworkCsv, parseNetworkCsv } from "../../../../domain/network/index";
import { formatSbml, readSbml } from "../../../../domain/network/sbml/index";
import { seededRandom } from "../../../support/prng";
import { roundTripCorpus } from "./demo-corpus";
import { networkSignature } from "./network-signature";

const corpus = roundTripCorpus();

/** Seeded initial values, some not exact decimals (1/3), so the exact path is exercised. */
function initialFor(species: readonly string[], seed: number): Map<string, Rational> {
  const rand = seededRandom(seed);
  return new Map(species.map((s) => [s, rational(BigInt(1 + Math.floor(rand() * 20)), BigInt([1, 2, 3, 4, 7, 10][Math.floor(rand() * 6)]))]));
}
const show = (m: ReadonlyMap<string, Rational>) => Object.fromEntries([...m].map(([k, v]) => [k, formatRational(v)]));

describe("round trips between our CSV and SBML", () => {
  it("has the demo networks and 40 random ones", () => {
    expect(corpus.length).toBeGreaterThanOrEqual(46);
  });

  it.each(corpus)("CSV → SBML → CSV keeps $name (species, reactions, constants, labels)", ({ csv }) => {
    const net = parseNetworkCsv(csv);
    const imported = readSbml(formatSbml(net));
    expect(imported.problems).toEqual([]);
    const back = parseNetworkCsv(imported.csv!);
    expect(networkSignature(back)).toEqual(networkSignature(net));
    // Rows keep their labels where they had one.
    net.rows.forEach((r, i) => {
      if (r.label !== undefined) expect(back.rows[i].label).toBe(r.label);
    });
    // Writing the imported network as CSV and reading it again changes nothing more.
    expect(networkSignature(parseNetworkCsv(formatNetworkCsv(back)))).toEqual(networkSignature(net));
  });

  it("carries held species (given and symbolic) and the version's own initial values both ways", () => {
    const csv = "reaction,rate,reverse_rate,rate_value\nA + 2X <-> 3X,k1,k2,3/2\nX <-> B,k3,k4,\n0 <- X,k5,,1/3\n# constant: A = 1/3, B\n# initial: X = 7/10\n";
    const net = parseNetworkCsv(csv);
    const sbml = formatSbml(net);
    // The held species are species with boundaryCondition and constant true, A at its value (exact, 1/3
    // is no decimal so it goes in an initial assignment), B without one (symbolic).
    expect(sbml).toContain('<species id="A" compartment="compartment" hasOnlySubstanceUnits="false" boundaryCondition="true" constant="true"/>');
    expect(sbml).toMatch(/<initialAssignment symbol="A">/);
    expect(sbml).toContain('<species id="B" compartment="compartment" hasOnlySubstanceUnits="false" boundaryCondition="true" constant="true"/>');
    expect(sbml).toContain('<species id="X" compartment="compartment" initialConcentration="0.7"');
    const back = readSbml(sbml);
    expect(back.problems).toEqual([]);
    expect(networkSignature(back.network!)).toEqual(networkSignature(net));
    // And as the CSV a version stores: the directive lines come back.
    expect(networkSignature(parseNetworkCsv(back.csv!))).toEqual(networkSignature(net));
  });

  it.each(corpus.map((c, i) => ({ ...c, seed: i + 1 })))("SBML → CSV → SBML keeps $name with initial values", ({ csv, seed }) => {
    const net = parseNetworkCsv(csv);
    const initial = initialFor(net.species, seed);
    const first = readSbml(formatSbml(net, { initial }));
    expect(first.problems).toEqual([]);
    // Through our CSV (the stored form of a version) and out again; initial values travel beside it.
    const second = readSbml(formatSbml(parseNetworkCsv(first.csv!), { initial: first.initial }));
    expect(second.problems).toEqual([]);
    expect(networkSignature(second.network!)).toEqual(networkSignature(first.network!));
    expect(show(second.initial)).toEqual(show(initial));
    expect(show(first.initial)).toEqual(show(initial));
  });
});
