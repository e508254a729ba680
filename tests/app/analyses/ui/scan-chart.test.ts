import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { computeJob } from "~/jobs/compute";
import { ScanChart } from "~/analyses/ui/scan-chart";
import type { ScanResult } from "~/analyses/result-types";
import { analysisParams, fixtureCsv } from "../../jobs/fixtures";

// recharts draws the SVG in the browser only (tests/e2e/folds.e2e.ts checks the curves and markers); the server
// render carries the fold list, the windows and the exact-window sentence.
describe("ScanChart with exact folds (server render)", () => {
  it("lists the two fold points of the cubic switch, its windows and the exact bistable window", () => {
    const scan = computeJob(
      { kind: "scan", csv: fixtureCsv("cubic-autocatalysis"), parent: analysisParams({ initial: { X: "1" } }), params: { parameter: { kind: "rate", name: "k1" }, from: 5, to: 7, points: 11, spacing: "linear", timeLimitSeconds: 60 } },
      { engineTimeoutMs: 60_000 },
    ) as unknown as ScanResult;
    const html = renderToStaticMarkup(createElement(ScanChart, { scan, csvHref: "/x.csv" }));
    expect(html).toContain('data-exact="true"');
    // Fold values 6 ± 2√3/9 to 10 digits (hand computation).
    expect(html).toContain("fold at k1 = 5.615099821");
    expect(html).toContain("fold at k1 = 6.384900179");
    expect(html.match(/data-testid="fold-point"/g) ?? []).toHaveLength(2);
    expect(html).toContain("5.615099821 &lt; k1 &lt; 6.384900179: 3 positive steady states");
    expect(html).toContain("3 positive steady states for 5.615099821 &lt; k1 &lt; 6.384900179");
  }, 60_000);
});
