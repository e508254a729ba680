/**
 * Downloads of a finished analysis: the whole result as JSON, tables as CSV (papaparse, formula-safe cells), formulas
 * as a LaTeX document. Pure functions of the stored result, so a share link exports the same.
 */
import { nameTex } from "@domain/algebra/format-tex";
import type { AnalysisResult, ScanResult } from "./result-types";
import { csvTable, latexText, texCommentText } from "~/downloads/escape";

export type ExportFile = "result.json" | "parametrisation.csv" | "steady-states.csv" | "formulas.tex";
export const EXPORT_FILES: readonly ExportFile[] = ["result.json", "parametrisation.csv", "steady-states.csv", "formulas.tex"];

export interface ExportMeta {
  network: string;
  version: number;
  engineVersion: string;
  analysisId: string;
}

export function exportAnalysis(file: ExportFile, r: AnalysisResult, meta: ExportMeta): { body: string; contentType: string } {
  switch (file) {
    case "result.json":
      return { body: JSON.stringify({ ...meta, result: r }, null, 2) + "\n", contentType: "application/json; charset=utf-8" };
    case "parametrisation.csv": {
      const rows = Object.entries(r.parametrisation?.expressions ?? {}).map(([species, expression]) => ({ species, expression, free: (r.parametrisation?.free ?? []).join(" ") }));
      return { body: csvTable(["species", "expression", "free"], rows), contentType: "text/csv; charset=utf-8" };
    }
    case "steady-states.csv": {
      const rows = (r.steadyStates ?? []).map((s, i) => ({
        state: i + 1,
        ...Object.fromEntries(r.species.map((sp) => [sp, s.concentrations[sp]])),
        verdict: s.verdict,
        eigenvalues: s.eigenvalues.map((e) => (typeof e === "number" ? `${e}` : `${e.re}${e.im < 0 ? "-" : "+"}${Math.abs(e.im)}i`)).join(" "),
      }));
      return { body: csvTable(["state", ...r.species, "verdict", "eigenvalues"], rows), contentType: "text/csv; charset=utf-8" };
    }
    case "formulas.tex":
      return { body: latexDocument(r, meta), contentType: "application/x-tex; charset=utf-8" };
  }
}

function latexDocument(r: AnalysisResult, meta: ExportMeta): string {
  // The engine's TeX (written from the exact values); a result stored before it wrote TeX gets its
  // formulas as typewriter text, and the document says so.
  const tex = r.tex ?? null;
  const asText = (text: string) => `\\texttt{${latexText(text)}}`;
  const lines = [
    `% Steady-state analysis exported from Stillpoint: ${texCommentText(meta.network)}, version ${meta.version}, engine ${texCommentText(meta.engineVersion)}.`,
    "% Mass-action kinetics, positive concentrations, generic values of the symbolic parameters.",
    "\\documentclass{article}",
    "\\usepackage{amsmath}",
    "\\begin{document}",
    ...(tex ? [] : ["This result was stored by an older engine version, which kept its formulas as text only: they are shown as text.", ""]),
    "\\section*{Triangular system (lex Gr\\\"obner basis)}",
  ];
  if (r.triangularForm.length === 0) lines.push("Not computed within the budget.");
  else {
    lines.push("\\begin{align*}");
    lines.push(r.triangularForm.flatMap((b, i) => b.polynomials.map((p, j) => `${tex?.triangularForm[i]?.[j] ?? asText(p)} &= 0`)).join(" \\\\\n"));
    lines.push("\\end{align*}");
  }
  if (r.parametrisation) {
    lines.push("\\section*{Parametrisation}", `Free: $${r.parametrisation.free.map(nameTex).join(", ")}$.`, "\\begin{align*}");
    lines.push(Object.entries(r.parametrisation.expressions).map(([s, e]) => `${nameTex(s)} &= ${tex?.parametrisation?.[s] ?? asText(e)}`).join(" \\\\\n"));
    lines.push("\\end{align*}");
  }
  if (r.acr.length > 0)
    lines.push(
      "\\section*{Absolute concentration robustness}",
      "\\begin{align*}",
      r.acr.map((a) => `${nameTex(a.species)} &= ${tex?.acr[a.species] ?? asText(a.value)}`).join(" \\\\\n"),
      "\\end{align*}",
    );
  lines.push("\\end{document}", "");
  return lines.join("\n");
}

/** Plot data of a scan: one row per (parameter value, steady state). */
export function scanCsv(s: ScanResult): string {
  const rows = s.points.flatMap((p): Record<string, string | number>[] =>
    p.states === null
      ? [{ [s.parameter.name]: p.value, state: "", count: "", verdict: p.note ?? "not computed" }]
      : p.states.length === 0
        ? [{ [s.parameter.name]: p.value, state: "", count: 0, verdict: "" }]
        : p.states.map((st, i) => ({ [s.parameter.name]: p.value, state: i + 1, count: p.states!.length, verdict: st.verdict, ...st.concentrations })),
  );
  return csvTable([s.parameter.name, "state", "count", "verdict", ...s.species], rows);
}
