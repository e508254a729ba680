/**
 * Turns a stored result into what the pages show: rows for the tables, LaTeX for the formulas,
 * conservation laws as sums with their totals. Server side (mathjs parses the formulas once).
 */
import { parseRational } from "@domain/algebra/rational";
import type { AnalysisParams } from "./params";
import type { AnalysisResult } from "./result-types";
import { degreeIn, namesIn, toTex } from "./latex";

export interface ParametrisationRow {
  species: string;
  expression: string;
  tex: string;
  dependsOn: string[];
  degree: number;
  /**
   * Numerator and denominator each of one sign, as the engine decided it on the exact expression;
   * null for results stored before the engine reported it per species (not guessed from the text).
   */
  positive: boolean | null;
}

export interface ResultView {
  triangular: { species: string | null; tex: string[]; text: string[] }[];
  parametrisation: { free: string[]; positive: boolean; rows: ParametrisationRow[] } | null;
  conservation: { text: string; total: string | null }[];
  acr: { species: string; value: string; tex: string }[];
  steadyStates: { index: number; concentrations: Record<string, number>; verdict: string; eigenvalues: string[] }[] | null;
  species: string[];
}

const lawText = (law: Record<string, number>) =>
  Object.entries(law)
    .map(([s, c], i) => `${c < 0 ? (i === 0 ? "-" : " - ") : i === 0 ? "" : " + "}${Math.abs(c) === 1 ? "" : `${Math.abs(c)} `}${s}`)
    .join("");

/** Σ c_s · x_s(0), exactly, as text (e.g. "11/10"). */
export function totalOf(law: Record<string, number>, initial: Record<string, string>): string {
  let num = 0n;
  let den = 1n;
  for (const [s, c] of Object.entries(law)) {
    const q = parseRational(initial[s] ?? "0");
    if (!q) continue;
    num = num * q.den + BigInt(c) * q.num * den;
    den = den * q.den;
  }
  const g = gcd(num < 0n ? -num : num, den);
  return den / g === 1n ? `${num / g}` : `${num / g}/${den / g}`;
}
const gcd = (a: bigint, b: bigint): bigint => (b === 0n ? (a === 0n ? 1n : a) : gcd(b, a % b));

export const formatEigenvalue = (e: number | { re: number; im: number }) =>
  typeof e === "number" ? e.toPrecision(6) : `${e.re.toPrecision(6)} ${e.im < 0 ? "−" : "+"} ${Math.abs(e.im).toPrecision(6)}i`;

export function presentResult(r: AnalysisResult, params: Pick<AnalysisParams, "initial">): ResultView {
  const free = r.parametrisation?.free ?? [];
  return {
    species: r.species,
    triangular: r.triangularForm.map((b) => ({ species: b.species, tex: b.polynomials.map((p) => `${toTex(p)} = 0`), text: b.polynomials })),
    parametrisation: r.parametrisation
      ? {
          free,
          positive: r.parametrisation.positive,
          rows: Object.entries(r.parametrisation.expressions).map(([species, expression]) => ({
            species,
            expression,
            tex: `${toTex(species)} = ${toTex(expression)}`,
            dependsOn: namesIn(expression),
            degree: degreeIn(expression, free),
            positive: r.parametrisation?.positiveSpecies ? r.parametrisation.positiveSpecies.includes(species) : null,
          })),
        }
      : null,
    conservation: r.conservationLaws.map((law) => ({ text: lawText(law), total: params.initial ? totalOf(law, params.initial) : null })),
    acr: r.acr.map((a) => ({ ...a, tex: `${toTex(a.species)} = ${toTex(a.value)}` })),
    steadyStates:
      r.steadyStates?.map((s, i) => ({ index: i + 1, concentrations: s.concentrations, verdict: s.verdict, eigenvalues: s.eigenvalues.map(formatEigenvalue) })) ?? null,
  };
}
