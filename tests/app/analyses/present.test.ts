import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { analyseNetwork } from "@domain/steady-state/index";
import { analysisResultJson } from "@domain/steady-state/result";
import { presentResult } from "~/analyses/present";
import type { AnalysisResult } from "~/analyses/result-types";

/**
 * Positivity of each parametrisation row comes from the engine's decision on the exact rational
 * expression (one sign in numerator and denominator), never from the printed text.
 */
describe("presentResult: positivity per species", () => {
  it("marks each species as the engine decided it; older stored results say 'not recorded'", () => {
    // A <-> B with k1, k2: B = k1*A/k2 in the free species A, positive (Horn and Jackson 1972: a
    // deficiency-zero, weakly reversible network has one positive steady state per class).
    const r = analysisResultJson(analyseNetwork(parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n"), { skipFullBasis: true }));
    expect(r.parametrisation?.positiveSpecies).toEqual(Object.keys(r.parametrisation!.expressions));
    const fresh = presentResult(r as unknown as AnalysisResult, { initial: null });
    expect(fresh.parametrisation!.rows.every((row) => row.positive === true)).toBe(true);
    // A stored row whose text has a minus sign but which the engine found positive stays positive.
    const stored = { ...r, parametrisation: { ...r.parametrisation!, expressions: { B: "(-k1*A)/(-k2)" }, positiveSpecies: ["B"] } };
    expect(presentResult(stored as unknown as AnalysisResult, { initial: null }).parametrisation!.rows[0]!.positive).toBe(true);
    const old = { ...r, parametrisation: { free: r.parametrisation!.free, expressions: r.parametrisation!.expressions, positive: true } };
    expect(presentResult(old as unknown as AnalysisResult, { initial: null }).parametrisation!.rows[0]!.positive).toBeNull();
  });
});

describe("presentResult: formulas from the engine's TeX, older results as text", () => {
  it("takes the TeX and degrees the engine stored; an older result shows text and no degree, and says so", () => {
    // Binding and conversion (invented): a parametrisation in the free species, no class given.
    const r = analysisResultJson(analyseNetwork(parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\nB + C <-> D,k3,k4\n"), { skipFullBasis: true }));
    const fresh = presentResult(r as unknown as AnalysisResult, { initial: null });
    expect(fresh.typeset).toBe(true);
    for (const row of fresh.parametrisation!.rows) {
      expect(row.tex).toBe(`\\mathrm{${row.species}} = ${r.tex.parametrisation![row.species]}`);
      expect(row.degree).toBe(r.parametrisationDegrees![row.species]);
      // The engine's list of variables is the set of names the expression's text shows (read here
      // only to check it; the page takes the engine's list).
      expect(new Set(row.dependsOn)).toEqual(new Set(row.expression.match(/[A-Za-z_][A-Za-z0-9_]*/g) ?? []));
    }
    // D = B*C*k3/k4 up to the choice of free species: some row has degree 2 in the free species.
    expect(Math.max(...fresh.parametrisation!.rows.map((row) => row.degree!))).toBe(2);
    const { tex: _t, parametrisationDegrees: _d, parametrisationVariables: _v, ...old } = r;
    const view = presentResult(old as unknown as AnalysisResult, { initial: null });
    expect(view.typeset).toBe(false);
    expect(view.parametrisation!.rows.every((row) => row.tex === null && row.degree === null)).toBe(true);
    expect(view.triangular.every((b) => b.tex === null)).toBe(true);
    expect(view.parametrisation!.rows.every((row) => row.dependsOn === null)).toBe(true);
  });
});
