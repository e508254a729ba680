import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { analysedNetwork } from "~/analyses/analysed-network";
import { AnalysedNetworkView } from "~/analyses/ui/analysed-network-view";

const CSV = "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value\nE + S <-> C,binding,kon,koff,1/2,1/10\nC -> E + P,,kcat,,3,\n";

describe("analysedNetwork: the reactions and rate values an analysis used", () => {
  it("lists every directed reaction with the file's value, or the run's override", () => {
    expect(analysedNetwork(CSV, { rateMode: "numeric", rateValues: { kcat: "7/2" } }).reactions).toEqual([
      { id: "r1", label: "binding", reaction: "E + S → C", rate: "kon", fileValue: "1/2", usedValue: "1/2" },
      { id: "r2", label: "binding", reaction: "C → E + S", rate: "koff", fileValue: "1/10", usedValue: "1/10" },
      { id: "r3", label: null, reaction: "C → E + P", rate: "kcat", fileValue: "3", usedValue: "7/2" },
    ]);
  });

  it("says symbolic for every rate of a symbolic run, and names held constant species", () => {
    const r = analysedNetwork("reaction,rate,rate_value\nA + X -> 2X,k1,2\nX -> 0,k2,1\n# constant: A = 3\n", { rateMode: "symbolic", rateValues: {} });
    expect(r.reactions.map((x) => [x.reaction, x.fileValue, x.usedValue])).toEqual([
      ["X → 2X (held: A)", "2", null],
      ["X → 0", "1", null],
    ]);
    expect(r.constants).toEqual([{ name: "A", fileValue: "3", usedValue: null }]);
  });

  it("renders the table with the override beside the file's value", () => {
    const html = renderToStaticMarkup(createElement(AnalysedNetworkView, { network: analysedNetwork(CSV, { rateMode: "numeric", rateValues: { kcat: "7/2" } }) }));
    expect(html.match(/data-testid="analysed-reaction"/g)).toHaveLength(3);
    expect(html).toContain("E + S → C");
    expect(html).toMatch(/data-testid="rate-value-r3">7\/2 <span[^>]*>\(file: 3\)<\/span>/);
  });
});
