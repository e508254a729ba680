import { describe, expect, it } from "vitest";
import { exportAnalysis } from "~/analyses/exports";
import { presentResult, totalOf } from "~/analyses/present";
import type { AnalysisResult } from "~/analyses/result-types";
import { computeJob } from "~/jobs/compute";
import { analysisParams } from "../jobs/fixtures";

// Invertase binding and turnover with a feed of S and outflow of P, so a positive steady state exists (invented).
const CSV = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nE + S <-> C,kon,koff,2,1\nC -> E + P,kcat,,3,\n0 -> S,kin,,1,\nP -> 0,kout,,1,\n";
const params = analysisParams({ initial: { E: "1/2" } });
const result = computeJob({ kind: "analysis", csv: CSV, params }, { engineTimeoutMs: 20_000 }) as unknown as AnalysisResult;
const meta = { network: "Invertase", version: 3, engineVersion: "0.1.0+test", analysisId: "id" };

describe("exports and the page's view of a result", () => {
  it("JSON carries the pin (network version, engine version) and the whole result", () => {
    const out = exportAnalysis("result.json", result, meta);
    expect(JSON.parse(out.body)).toEqual({ ...meta, result });
  });

  it("CSV tables and a LaTeX document that compiles the same formulas", () => {
    const params = exportAnalysis("parametrisation.csv", result, meta).body.split("\n");
    expect(params[0]).toBe("species,expression,free");
    expect(params.length - 2).toBe(Object.keys(result.parametrisation!.expressions).length);
    const states = exportAnalysis("steady-states.csv", result, meta).body.split("\n");
    expect(states[0]).toBe(`state,${result.species.join(",")},verdict,eigenvalues`);
    expect(states.length - 2).toBe(result.steadyStates!.length);
    const tex = exportAnalysis("formulas.tex", result, meta).body;
    expect(tex).toMatch(/\\begin\{document\}[\s\S]*\\begin\{align\*\}[\s\S]*\\end\{document\}/);
    expect(tex).toContain("version 3, engine 0.1.0+test");
  });

  it("conservation totals are exact sums of the initial concentrations", () => {
    expect(totalOf({ E: 1, C: 1 }, { E: "1/2", C: "1/3" })).toBe("5/6");
    expect(totalOf({ A: 2, B: -1 }, { A: "1" })).toBe("2");
    const view = presentResult(result, params);
    expect(view.conservation).toEqual([{ text: "E + C", total: "1/2" }]);
    expect(view.parametrisation!.rows.every((r) => r.tex !== null && r.tex.includes("="))).toBe(true);
  });

  it("formulas.tex holds the engine's TeX; a result stored before the engine wrote TeX gets its text, escaped, and says so", () => {
    const fresh = exportAnalysis("formulas.tex", result, meta).body;
    // The engine's TeX for the parametrisation, written from the exact expressions.
    for (const [s, t] of Object.entries(result.tex!.parametrisation!)) expect(fresh).toContain(`\\mathrm{${s}} &= ${t}`);
    expect(fresh).not.toContain("\\texttt");
    const { tex: _t, parametrisationDegrees: _d, parametrisationVariables: _v, ...old } = result;
    const stored = { ...old, parametrisation: { ...old.parametrisation!, expressions: { k_x: "k_1*E^2/(2*C)" } } } as AnalysisResult;
    const body = exportAnalysis("formulas.tex", stored, meta).body;
    expect(body).toContain("older engine version");
    // Underscore and caret are escaped in the text: the document compiles and shows the text as stored.
    expect(body).toContain("\\mathrm{k\\_x} &= \\texttt{k\\_1*E\\textasciicircum{}2/(2*C)}");
  });

  it("a network name with line breaks cannot leave the TeX comment (formulas.tex, also behind share links)", () => {
    for (const evil of ["Evil\n\\input{/etc/hostname}", "Evil\r\\immediate\\write18{x}", "Evil\u2028\\def\\a{}", "Evil^^J\\input{x}"]) {
      const tex = exportAnalysis("formulas.tex", result, { ...meta, network: evil }).body;
      const lines = tex.split(/\r\n|\r|\n|\u2028|\u2029/);
      // Every line before \documentclass is a comment; nothing of the name starts a live line.
      const head = lines.slice(0, lines.indexOf("\\documentclass{article}"));
      expect(head.length).toBe(2);
      for (const line of head) expect(line.startsWith("%")).toBe(true);
      expect(tex).not.toContain("^^J");
    }
  });

  it("CSV cells a spreadsheet would execute get a leading apostrophe; plain numbers stay numbers", () => {
    const evil = { ...result, species: ["=cmd", ...result.species.slice(1)] } as AnalysisResult;
    const first = result.species[0]!;
    evil.parametrisation = { ...result.parametrisation!, free: ["@SUM(A1)"], expressions: { "+x": "-k1*x", "-1": "2" } };
    evil.steadyStates = (result.steadyStates ?? []).map((st) => ({ ...st, concentrations: { ...st.concentrations, "=cmd": st.concentrations[first]! } }));
    const params = exportAnalysis("parametrisation.csv", evil, meta).body;
    const cells = params.trim().split("\n").slice(1).flatMap((l) => l.split(","));
    for (const cell of cells) expect(cell).not.toMatch(/^["]?[=+@]/);
    expect(params).toContain("'-k1*x");
    expect(params).toContain("'@SUM(A1)");
    expect(params.split("\n")).toContain("-1,2,'@SUM(A1)");
    const states = exportAnalysis("steady-states.csv", evil, meta).body;
    expect(states.split("\n")[0]).toMatch(/^state,'=cmd,/);
  });
});
