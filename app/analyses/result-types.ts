/**
 * Stored job results as the pages, exports and API read them. The analysis result is the
 * domain's one JSON shape (domain/steady-state/result.ts, also the CLI's `analyse --json`); the
 * only differences here are for rows written by older engine versions, which lack keys that
 * were added later.
 */
import type { FoldScan } from "@domain/steady-state/folds";
import type { RelationResult } from "@domain/steady-state/relation";
import type { AnalysisResultJson, MultistationarityJson, SteadyStateJson } from "@domain/steady-state/result";

/** A stored steady state; rows stored before eigenvalues became { re, im } may hold plain numbers for real ones. */
export type StoredSteadyState = Omit<SteadyStateJson, "eigenvalues"> & { eigenvalues: (number | { re: number; im: number })[] };

/** Keys missing in results stored before they existed. */
type AddedLater =
  | "constants"
  | "groebnerBasisStatus"
  | "steadyStatesReason"
  | "positiveSteadyStatesReason"
  | "unfinished"
  | "contradictions"
  | "odes"
  | "steadyStateSystem"
  | "minimalSemiPositiveConservationLaws"
  | "deficiencyZeroTheorem"
  | "deficiencyOneTheorem"
  | "tex"
  | "parametrisationDegrees"
  | "parametrisationVariables";

type Parametrisation = NonNullable<AnalysisResultJson["parametrisation"]>;

export type AnalysisResult = Omit<AnalysisResultJson, AddedLater | "steadyStates" | "parametrisation"> &
  Partial<Pick<AnalysisResultJson, AddedLater>> & {
    steadyStates: StoredSteadyState[] | null;
    /** `positiveSpecies` came later: absent in older results. */
    parametrisation: (Omit<Parametrisation, "positiveSpecies"> & Partial<Pick<Parametrisation, "positiveSpecies">>) | null;
    /** Added by the worker beside the analysis object; absent in older results. */
    multistationarity?: MultistationarityJson;
  };

/** What the worker stores now: the current shape exactly (built in app/jobs/compute.ts). */
export type FreshAnalysisResult = AnalysisResultJson & { multistationarity: MultistationarityJson };

/** The domain's exact fold scan (folds, windows with exact counts), its curve points named `curve`. */
export type ExactScan = Pick<FoldScan, "folds" | "windows" | "eliminant" | "assumptions" | "warnings"> & {
  /** Curve points: an even grid plus points beside each fold. */
  curve: FoldScan["points"];
};

export interface ScanResult {
  parameter: { kind: "rate" | "initial"; name: string };
  spacing: "linear" | "log";
  species: string[];
  points: { value: number; states: { concentrations: Record<string, number>; verdict: string }[] | null; note?: string }[];
  /** Exact fold points and windows (absent in scans stored before they existed, null when not computed). */
  exact?: ExactScan | null;
  exactNote?: string | null;
}

export interface RelationJobResult {
  relation: RelationResult | null;
  warnings: string[];
}

export interface TimeCourseResult {
  species: string[];
  endTime: number;
  completed: boolean;
  note: string | null;
  method: string;
  t: number[];
  y: number[][];
}
