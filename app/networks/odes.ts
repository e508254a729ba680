import type { NetworkStructure } from "@domain/network/index";
import { latexText } from "~/downloads/escape";

/**
 * Mass-action ODEs written from the structure the page already shows (one code path): the
 * stoichiometric matrix N, the complex composition Y and each reaction's rate symbol.
 * dx_s/dt = Σ_j N[s][j] · k_j · Π_t x_t^Y[t][c(j)], where c(j) is reaction j's reactant complex
 * (Horn & Jackson, Arch. Rational Mech. Anal. 47, 1972, eq. 2.5). Rate constants stay symbolic;
 * terms with the same rate symbol and reactant are merged. A constant species of the reactant
 * (`held` in the reaction list) appears as a factor marked `constant`, its concentration written
 * like any other (its value, if given, is in the structure's `constants`), and has no equation.
 * The exact builder the analyses use is domain/steady-state/kinetics.ts; this one writes the same
 * equations from the page's structure without values substituted.
 */

export interface OdeTerm {
  /** Integer coefficient, never 0. */
  coefficient: number;
  rate: string;
  /** Species with their exponents, in the network's species order, then the constant species. */
  factors: { species: string; power: number; constant?: true }[];
}

export interface SpeciesOde {
  species: string;
  terms: OdeTerm[];
}

export function massActionOdes(structure: Pick<NetworkStructure, "species" | "complexes" | "complexComposition" | "reactionList" | "stoichiometricMatrix">): SpeciesOde[] {
  const complexIndex = new Map(structure.complexes.map((c, i) => [c, i]));
  const monomials = structure.reactionList.map((r) => {
    const c = complexIndex.get(r.reactant);
    if (c === undefined) throw new Error(`reactant complex ${r.reactant} of ${r.id} is not among the complexes`);
    const factors: OdeTerm["factors"] = structure.species
      .map((species, s) => ({ species, power: structure.complexComposition[s]![c]! }))
      .filter((f) => f.power !== 0);
    const held = Object.entries(r.held ?? {});
    for (const [species, power] of held) factors.push({ species, power, constant: true });
    return { rate: r.rate, factors, key: `${r.rate}|${r.reactant}|${held.map(([s, p]) => `${p}${s}`).join("+")}` };
  });
  return structure.species.map((species, s) => {
    const merged = new Map<string, OdeTerm>();
    structure.stoichiometricMatrix[s]!.forEach((n, j) => {
      if (n === 0) return;
      const m = monomials[j]!;
      const existing = merged.get(m.key);
      if (existing) existing.coefficient += n;
      else merged.set(m.key, { coefficient: n, rate: m.rate, factors: m.factors });
    });
    return { species, terms: [...merged.values()].filter((t) => t.coefficient !== 0) };
  });
}

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
export function odesAlignedLatex(odes: SpeciesOde[]): string {
  return `\\begin{aligned}\n${odes.map((o) => odeToLatex(o).replace(" = ", " &= ")).join(" \\\\[0.6em]\n")}\n\\end{aligned}`;
}

/** A complete LaTeX document with the ODEs in an `align*` block (the download). */
export function odesLatexDocument(title: string, odes: SpeciesOde[], constants: readonly { name: string; value?: string }[] = []): string {
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
