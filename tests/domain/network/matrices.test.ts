import { describe, expect, it } from "vitest";
import { formatRational } from "../../../domain/algebra/rational";
import {
  complexCompositionMatrix,
  complexesOf,
  formatComplex,
  incidenceMatrix,
  parseNetworkCsv,
  stoichiometricMatrix,
} from "../../../domain/network";

const text = (m: { entries: readonly (readonly { num: bigint; den: bigint }[])[] }) => m.entries.map((r) => r.map(formatRational));

describe("network matrices", () => {
  it("Y, incidence and N = Y·I for 2A <-> B, B -> 0 (worked by hand)", () => {
    const net = parseNetworkCsv("reaction\n2A <-> B\nB -> 0\n");
    const complexes = complexesOf(net);
    expect(complexes.map((c) => formatComplex(c))).toEqual(["2A", "B", "0"]);
    expect(text(complexCompositionMatrix(net.species, complexes))).toEqual([["2", "0", "0"], ["0", "1", "0"]]);
    expect(text(incidenceMatrix(net, complexes))).toEqual([["-1", "1", "0"], ["1", "-1", "-1"], ["0", "0", "1"]]);
    expect(text(stoichiometricMatrix(net))).toEqual([["-2", "2", "0"], ["1", "-1", "-1"]]);
  });

  it("orders complexes by textual appearance, also for `<-` rows", () => {
    const net = parseNetworkCsv("reaction\nB <- A\nC -> A\n");
    expect(complexesOf(net).map((c) => formatComplex(c))).toEqual(["B", "A", "C"]);
    expect(net.species).toEqual(["B", "A", "C"]);
  });
});
