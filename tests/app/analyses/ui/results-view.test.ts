import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { presentResult } from "~/analyses/present";
import type { AnalysisResult } from "~/analyses/result-types";
import { ResultsView } from "~/analyses/ui/results-view";
import { computeJob } from "~/jobs/compute";
import { analysisParams, fixtureCsv } from "../../jobs/fixtures";

// The cubic switch with X(0) = 1: a triangular form X^3 - 6X^2 + 11X - 6 (fixture values; roots 1, 2, 3).
const params = analysisParams({ initial: { X: "1" } });
const result = computeJob({ kind: "analysis", csv: fixtureCsv("cubic-autocatalysis"), params }, { engineTimeoutMs: 20_000 }) as unknown as AnalysisResult;
const render = (r: AnalysisResult) => renderToStaticMarkup(createElement(ResultsView, { view: presentResult(r, params), result: r }));

describe("ResultsView: the engine's TeX, or an older result's text (server render)", () => {
  it("typesets the stored TeX and says nothing about older results", () => {
    expect(result.tex!.triangularForm.flat().length).toBeGreaterThan(0);
    const html = render(result);
    expect(html).toContain('class="katex');
    expect(html).not.toContain("untypeset-note");
    expect(html).not.toContain('data-testid="formula-text"');
  });

  it("a result stored before the engine wrote TeX shows its formulas as text, labelled, and parses nothing", () => {
    const { tex: _t, parametrisationDegrees: _d, parametrisationVariables: _v, ...old } = result;
    const html = render(old as AnalysisResult);
    expect(html).toContain('data-testid="untypeset-note"');
    expect(html).toContain("older engine version");
    for (const p of result.triangularForm.flatMap((b) => b.polynomials)) expect(html).toContain(`${p} = 0`);
    expect(html).toContain('data-testid="formula-text"');
  });
});
