/**
 * The verdict card at the top of the network page: what the network can do, each line with what
 * it rests on (the structure, or the newest finished analysis of this version) and the card with
 * what every line assumes. Built from typed values only: the structure's capabilities
 * (domain/network/capabilities.ts) and the stored analysis result's fields.
 */
import { structuralCapabilities, type NetworkStructure } from "@domain/network/index";
import { answerOf } from "~/analyses/answer";
import type { AnalysisResult } from "~/analyses/result-types";

export interface LatestAnalysis {
  href: string;
  result: AnalysisResult;
  rateMode: "numeric" | "symbolic";
  finishedAt: string;
}

export type VerdictTone = "settled" | "none" | "open";

export interface VerdictLine {
  key: "steady-states" | "multistationarity" | "robust";
  label: string;
  statement: string;
  /** What the statement rests on, in one short phrase. */
  basis: string;
  /** The evidence section of the page (or the analysis) that shows why. */
  evidence: { href: string; label: string };
  tone: VerdictTone;
}

export interface VerdictCard {
  lines: VerdictLine[];
  assumptions: string[];
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export function verdictCard(s: NetworkStructure, latest: LatestAnalysis | null, links: { newAnalysis: string | null }): VerdictCard {
  const cap = structuralCapabilities(s);
  const theorem = cap.steadyStatesPerClass.by === "deficiency-zero" ? "the deficiency zero theorem" : "the deficiency one theorem";
  const theorems = { href: "#theorems", label: "Theorems checked" };
  const run = latest ? { href: latest.href, label: "Open the analysis" } : links.newAnalysis ? { href: links.newAnalysis, label: "Start an analysis" } : theorems;
  const constants = latest?.rateMode === "symbolic" ? "for generic rate constants" : "for the rate constants of the analysis";
  const none = cap.steadyStatesPerClass.count === "none";

  const steady: VerdictLine = (() => {
    const base = { key: "steady-states" as const, label: "Positive steady states per class" };
    switch (cap.steadyStatesPerClass.count) {
      case "exactly-one":
        return { ...base, statement: cap.stable ? "Exactly one in every class, and it is stable." : "Exactly one in every class.", basis: `The structure decides it, by ${theorem}, for any positive rate constants.`, evidence: theorems, tone: "settled" };
      case "at-most-one":
        return { ...base, statement: "At most one in every class (some classes may have none).", basis: `The structure decides it, by ${theorem}, for any positive rate constants.`, evidence: theorems, tone: "settled" };
      case "none":
        return { ...base, statement: "None: every positive state keeps changing.", basis: `The structure decides it, by ${theorem}, for any positive rate constants.`, evidence: theorems, tone: "none" };
      case "open": {
        if (latest) {
          const answer = answerOf(latest.result);
          return { ...base, statement: answer.headline, basis: `From the newest analysis of this version, ${constants}.`, evidence: run, tone: answer.tone === "none" ? "none" : answer.tone === "states" ? "settled" : "open" };
        }
        return { ...base, statement: "Not decided by the structure.", basis: "An analysis counts them for given rate constants and totals.", evidence: run, tone: "open" };
      }
    }
  })();

  const multi: VerdictLine = (() => {
    const base = { key: "multistationarity" as const, label: "Several steady states in one class?" };
    if (cap.multistationarityRuledOut)
      return { ...base, statement: none ? "No: there is not even one." : "No, whatever the rate constants.", basis: `By ${theorem}.`, evidence: theorems, tone: "settled" };
    const m = latest?.result.multistationarity;
    // The run's own constants are a witness when its class holds two or more positive steady states,
    // even where the search for "some constants" gave up.
    const found = latest?.result.steadyStateSet === "finite" ? (latest.result.steadyStates?.length ?? 0) : 0;
    if (found >= 2)
      return {
        ...base,
        statement: "Yes: some positive rate constants give two or more in one class.",
        basis: `The newest analysis found ${found} in one class with ${latest!.rateMode === "symbolic" ? "its" : "the given"} rate constants and totals.`,
        evidence: run,
        tone: "settled",
      };
    if (m?.verdict === "multistationary")
      return { ...base, statement: "Yes: some positive rate constants give two or more in one class.", basis: `${m.reason} (analysis: ${m.method}).`, evidence: run, tone: "settled" };
    if (m?.verdict === "monostationary")
      return { ...base, statement: "No, whatever the rate constants.", basis: `${m.reason} (analysis: ${m.method}).`, evidence: run, tone: "settled" };
    return {
      ...base,
      statement: "Not ruled out by the structure.",
      basis: m ? `The analysis could not decide it: ${m.reason}.` : "An analysis looks for rate constants with several steady states, or proves there are none.",
      evidence: run,
      tone: "open",
    };
  })();

  const robust: VerdictLine = (() => {
    const base = { key: "robust" as const, label: "Robust species" };
    if (none) return { ...base, statement: "None to speak of: there is no positive steady state.", basis: `By ${theorem}.`, evidence: theorems, tone: "none" };
    if (latest && latest.result.acr.length > 0)
      return {
        ...base,
        statement: latest.result.acr.map((a) => `${a.species} = ${a.value}`).join("; "),
        basis: `The same value at every positive steady state, whatever the totals (newest analysis, ${latest.rateMode === "symbolic" ? "generic" : "given"} rate constants).`,
        evidence: run,
        tone: "settled",
      };
    if (cap.robust.length > 0)
      return {
        ...base,
        statement: `${cap.robust.map((r) => r.species).join(", ")}, if a positive steady state exists.`,
        basis: cap.robust.map((r) => `${r.complexes[0]} and ${r.complexes[1]} differ in ${r.species} alone`).join("; ") + " (Shinar–Feinberg criterion, deficiency one).",
        evidence: { href: "#connections", label: "How complexes connect" },
        tone: "settled",
      };
    if (latest) return { ...base, statement: "None found.", basis: "The newest analysis tested each species.", evidence: run, tone: "open" };
    return { ...base, statement: "None found from the structure.", basis: "An analysis tests each species for a value shared by every positive steady state.", evidence: run, tone: "open" };
  })();

  const assumptions = [
    "Mass-action kinetics",
    "Positive concentrations only",
    "One compatibility class at a time (fixed totals)",
    latest && !cap.multistationarityRuledOut && cap.steadyStatesPerClass.count === "open"
      ? `Counts: ${latest.rateMode === "symbolic" ? "generic rate constants" : "the rate constants given to the analysis"}`
      : "Any positive rate constants",
    ...(s.constants.length > 0 ? [`Held constant: ${s.constants.map((c) => c.name).join(", ")} (${plural(s.constants.length, "species", "species")})`] : []),
  ];
  return { lines: [steady, multi, robust], assumptions };
}
