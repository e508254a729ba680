/**
 * The one-sentence answer every analysis result opens with: how many positive steady states (and
 * how many are stable), or why none are listed; the parametrisation's free species; robust species.
 * Built from the stored result's typed fields only (never from warning texts).
 */
import type { AnalysisResult } from "./result-types";

export interface Answer {
  /** The headline: the steady-state count or the reason there is no list. */
  readonly headline: string;
  /** Further short sentences (parametrisation, robustness), in reading order. */
  readonly details: string[];
  /** "none" when no positive steady state exists, so the page can mark it. */
  readonly tone: "states" | "none" | "continuum" | "open";
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * Example: three states, two stable, gives "3 positive steady states in this class: 2 stable, 1 unstable."
 */
export function answerOf(r: AnalysisResult): Answer {
  const details: string[] = [];
  if (r.parametrisation) {
    const free = r.parametrisation.free.length > 0 ? r.parametrisation.free.join(", ") : "none";
    details.push(
      r.parametrisation.positive
        ? `Every positive steady state is given by the free species ${free}: any positive values of them give one.`
        : `The positive steady states are parametrised by the free species ${free} (valid where the listed expressions are positive).`,
    );
  }
  if (r.acr.length > 0) details.push(`Robust species (the same value at every positive steady state): ${r.acr.map((a) => `${a.species} = ${a.value}`).join("; ")}.`);

  if (r.steadyStates && r.steadyStateSet === "finite") {
    const n = r.steadyStates.length;
    if (n === 0) return { headline: `No positive steady state in this class${r.positiveSteadyStatesReason ? ` (${stripDot(r.positiveSteadyStatesReason)})` : ""}.`, details, tone: "none" };
    const stable = r.steadyStates.filter((s) => s.stable === true).length;
    const unstable = r.steadyStates.filter((s) => s.stable === false).length;
    const undecided = n - stable - unstable;
    const parts = [stable > 0 ? `${stable} stable` : "", unstable > 0 ? `${unstable} unstable` : "", undecided > 0 ? `${undecided} undecided` : ""].filter(Boolean);
    return { headline: `${plural(n, "positive steady state", "positive steady states")} in this class: ${parts.join(", ")}.`, details, tone: "states" };
  }
  if (r.positiveSteadyStatesExist === false)
    return { headline: `No positive steady state${r.positiveSteadyStatesReason ? `: ${lowerFirst(stripDot(r.positiveSteadyStatesReason))}` : ""}.`, details, tone: "none" };
  if (r.steadyStateSet === "continuum") return { headline: "The steady states of this class form a continuum: there is no finite list.", details, tone: "continuum" };
  const why = r.steadyStatesReason ? ` ${r.steadyStatesReason}` : "";
  return { headline: `Steady states not listed.${why}`, details, tone: "open" };
}

const stripDot = (s: string) => s.replace(/\.\s*$/, "");
const lowerFirst = (s: string) => (s.length > 0 ? s[0].toLowerCase() + s.slice(1) : s);
