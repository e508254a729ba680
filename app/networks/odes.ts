import type { SpeciesOde } from "@domain/steady-state/ode-terms";
import { latexText } from "~/downloads/escape";

/**
 * The mass-action ODEs written out for people: plain text, TeX and a LaTeX document. The
 * equations themselves come from the domain's one builder (domain/steady-state/ode-terms.ts,
 * read from the exact polynomials of kinetics.ts with every constant symbolic); this file only
 * formats them. A constant species appears as a factor marked `constant` and has no equation.
 */
/** `dE/dt = -k1·E·S + k2·C` (plain text, for tables, tooltips and tests). */
export function odeToText(ode: SpeciesOde): string {
  const rhs = ode.terms
    .map((t, i) => {
      const magnitude = Math.abs(t.coefficient);
      const parts = [...(magnitude === 1 ? [] : [String(magnitude)]), t.rate, ...t.factors.map((f) => (f.power === 1 ? f.species : `${f.species}^${f.power}`))];
      const sign = t.coefficient < 0 ? (i === 0 ? "-" : " - ") : i === 0 ? "" : " + ";
      return sign + parts.join("·");
    })
    .join("");
  return `d${ode.species}/dt = ${rhs === "" ? "0" : rhs}`;
}

const escapeTex = (s: string) => s.replace(/_/g, "\\_");

/** A species as upright text: `\mathrm{S0K}`. */
export function speciesTex(name: string): string {
  return `\\mathrm{${escapeTex(name)}}`;
}

/** A concentration in brackets, so `[T][L]` and `[TL]` cannot be confused. */
export function concentrationTex(name: string): string {
  return `[${speciesTex(name)}]`;
}

/** A rate symbol: `k1` → `k_{1}`, `k_on` → `k_{\mathrm{on}}`, `kcat` → `\mathit{kcat}`. */
export function rateTex(name: string): string {
  const digits = /^([A-Za-z])(\d+)$/.exec(name);
  if (digits) return `${digits[1]}_{${digits[2]}}`;
  const underscore = /^([A-Za-z])_([A-Za-z0-9_]+)$/.exec(name);
  if (underscore) return `${underscore[1]}_{\\mathrm{${escapeTex(underscore[2]!)}}}`;
  return name.length === 1 ? name : `\\mathit{${escapeTex(name)}}`;
}

/** One equation in LaTeX: `\frac{d[\mathrm{E}]}{dt} = -k_{1}\,[\mathrm{E}]\,[\mathrm{S}] + …`. */
export function odeToLatex(ode: SpeciesOde): string {
  const rhs = ode.terms
    .map((t, i) => {
      const magnitude = Math.abs(t.coefficient);
      const factors = t.factors.map((f) => (f.power === 1 ? concentrationTex(f.species) : `${concentrationTex(f.species)}^{${f.power}}`));
      const body = [...(magnitude === 1 ? [] : [String(magnitude)]), rateTex(t.rate), ...factors].join("\\,");
      const sign = t.coefficient < 0 ? (i === 0 ? "-" : " - ") : i === 0 ? "" : " + ";
      return sign + body;
    })
    .join("");
  return `\\frac{d${concentrationTex(ode.species)}}{dt} = ${rhs === "" ? "0" : rhs}`;
}

/** All equations in one `aligned` block, equals signs under each other (for display). */
export function odesAlignedLatex(odes: readonly SpeciesOde[]): string {
  return `\\begin{aligned}\n${odes.map((o) => odeToLatex(o).replace(" = ", " &= ")).join(" \\\\[0.6em]\n")}\n\\end{aligned}`;
}

/** A complete LaTeX document with the ODEs in an `align*` block (the download). */
export function odesLatexDocument(title: string, odes: readonly SpeciesOde[], constants: readonly { name: string; value?: string }[] = []): string {
  const lines = odes.map((o) => "  " + odeToLatex(o).replace(" = ", " &= "));
  // Held species have no equation; the document says at what concentration they are held.
  const held =
    constants.length === 0
      ? []
      : [
          `Held constant: ${constants.map((c) => `$${concentrationTex(c.name)}${c.value ? ` = ${c.value.replace(/^(\d+)\/(\d+)$/, "\\tfrac{$1}{$2}")}` : ""}$`).join(", ")}${constants.some((c) => !c.value) ? " (without a value: a parameter)" : ""}.`,
          "",
        ];
  return [
    "% Mass-action ODEs exported from Stillpoint; rate constants symbolic, species as concentrations.",
    "\\documentclass{article}",
    "\\usepackage{amsmath}",
    "\\begin{document}",
    `\\section*{${latexText(title)}}`,
    ...held,
    "\\begin{align*}",
    lines.join(" \\\\\n"),
    "\\end{align*}",
    "\\end{document}",
    "",
  ].join("\n");
}

/** Plain text made safe inside a LaTeX paragraph (one definition, in ~/downloads/escape). */
export { latexText };
