/** The stored analysis result: the CLI's `analyse --json` object (domain/cli/analyse.ts `toJson`), typed for the pages. */
export interface StoredSteadyState {
  concentrations: Record<string, number>;
  stable: boolean | null;
  verdict: string;
  /** Always { re, im } objects; results stored before that shape may hold plain numbers for real ones. */
  eigenvalues: (number | { re: number; im: number })[];
  residual: number;
}

export interface AnalysisResult {
  species: string[];
  complexes: string[];
  reactions: number;
  rank: number;
  linkageClasses: number;
  deficiency: number;
  weaklyReversible: boolean;
  conservationLaws: Record<string, number>[];
  groebnerBasis: string[];
  groebnerBasisComplete: boolean;
  /** Missing in results stored before it existed. */
  groebnerBasisStatus?: "complete" | "skipped" | "unfinished";
  parametrisation: { free: string[]; expressions: Record<string, string>; positive: boolean } | null;
  acr: { species: string; value: string }[];
  steadyStates: StoredSteadyState[] | null;
  steadyStatesReason?: string | null;
  warnings: string[];
  order: { species: string[]; suggested: string[]; reason: string; userGiven: boolean };
  ordering: string;
  genericConditions: string[];
  triangularForm: { species: string | null; polynomials: string[] }[];
  rootsNeeded: { species: string; polynomial: string; degree: number }[];
  nonVanishing: string[];
  relations: { expression: string; inIdeal: boolean; vanishes: boolean; remainder: string }[];
  eliminant: { variable: string; polynomial: string } | null;
  steadyStateSet: "finite" | "continuum" | null;
  positiveSteadyStatesExist: boolean | null;
  positiveSteadyStatesReason?: string | null;
  unfinished?: { stage: string; reason: string }[];
  contradictions?: string[];
  parameters: { rateConstants: string[]; totals: string[]; values: Record<string, string> };
  /** Added by the worker beside the CLI's analyse object; absent in older results. */
  multistationarity?: MultistationarityView;
}

export interface ExactScan {
  folds: { value: number; interval: [number, number]; exact: [string, string] }[];
  /** Open parameter intervals between folds with the exact count of positive steady states. */
  windows: { from: number; to: number; count: number; sample: string }[];
  /** Curve points: an even grid plus points beside each fold. */
  curve: { value: number; steadyStates: { concentrations: Record<string, number>; stable: boolean | null }[] }[];
  eliminant: { variable: string; polynomial: string };
  assumptions: string;
  warnings: string[];
}

export interface ScanResult {
  parameter: { kind: "rate" | "initial"; name: string };
  spacing: "linear" | "log";
  species: string[];
  points: { value: number; states: { concentrations: Record<string, number>; verdict: string }[] | null; note?: string }[];
  /** Exact fold points and windows (absent in scans stored before they existed, null when not computed). */
  exact?: ExactScan | null;
  exactNote?: string | null;
}

export interface MultistationarityView {
  verdict: "monostationary" | "multistationary" | "undecided";
  method: string;
  reason: string;
  witness?: { rates: Record<string, string>; totals: Record<string, string>; initial: Record<string, string>; steadyStates: Record<string, number>[] };
  assumptions?: string[];
  sources?: string[];
}

export interface RelationJobResult {
  relation: { expression: string; inIdeal: boolean; vanishes: boolean; remainder: string } | null;
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
