/**
 * What a job is asked to do, as plain JSON (stored in analyses.params), and the one validator the
 * form and the JSON API share. Every problem names its field; values stay exact (decimal or
 * fraction text, read as rationals by the engine).
 */
import { parseRational } from "@domain/algebra/rational";
import type { Network } from "@domain/network/index";

export interface AnalysisParams {
  /** Species eliminated first … last (partial lists allowed); null = the engine's suggestion. */
  order: string[] | null;
  /** Species kept free (moved to the end of the order). */
  free: string[];
  /** "symbolic": every rate constant stays a symbol; "numeric": values from the file or `rateValues`. */
  rateMode: "symbolic" | "numeric";
  rateValues: Record<string, string>;
  /** Initial concentrations (unlisted species 0); null = no numeric steady states. */
  initial: Record<string, string> | null;
  timeLimitSeconds: number;
  maxBasisSize: number;
  maxTerms: number;
  notify: boolean;
}

export interface ScanParams {
  /** A rate constant, or the initial concentration of a species (which moves the totals). */
  parameter: { kind: "rate" | "initial"; name: string };
  from: number;
  to: number;
  points: number;
  spacing: "linear" | "log";
  timeLimitSeconds: number;
}

export interface RelationParams {
  expression: string;
  timeLimitSeconds: number;
}

export interface TimeCourseParams {
  endTime: number;
  /** Other initial concentrations than the analysis' (null: the same). */
  initial: Record<string, string> | null;
  timeLimitSeconds: number;
}

export type Problems = { field: string; message: string }[];
export type Parsed<T> = { ok: true; value: T } | { ok: false; problems: Problems };

/**
 * What no lab may exceed, whatever its owner sets (anyone can create a lab, so a lab's own limits
 * cannot be the only bound): the longest time limit of one job, and how many jobs may wait or run
 * at once per person and per lab. Each lab's share of the workers is further kept fair when a
 * worker picks its next job (claimNextJob in app/jobs).
 */
export const SITE_LIMITS = { maxTimeLimitSeconds: 900, maxActiveJobsPerUser: 10, maxActiveJobsPerLab: 20 } as const;

export interface Limits {
  maxTimeLimitSeconds: number;
  maxBasisSize: number;
}

export const DEFAULT_TIME_LIMIT_SECONDS = 120;
export const DEFAULT_MAX_TERMS = 20_000;
const NAME = /^[A-Za-z][A-Za-z0-9_]*$/;

/**
 * The parameters a run can set: the rate symbols, then the constant species (a held
 * concentration enters the rates like a rate constant, so it is set, overridden and scanned the same way).
 */
export function rateSymbols(network: Network): string[] {
  return [...new Set([...network.reactions.map((r) => r.rate), ...(network.constants ?? []).map((c) => c.name)])];
}

/** Rate values and constant concentrations the file itself gives, as text. */
export function fileRateValues(network: Network): Record<string, string> {
  const out: Record<string, string> = {};
  const text = (v: { num: bigint; den: bigint }) => (v.den === 1n ? `${v.num}` : `${v.num}/${v.den}`);
  for (const r of network.reactions) if (r.rateValue && !(r.rate in out)) out[r.rate] = text(r.rateValue);
  for (const c of network.constants ?? []) if (c.value) out[c.name] = text(c.value);
  return out;
}

const list = (v: unknown): string[] =>
  Array.isArray(v) ? v.map(String).map((s) => s.trim()).filter(Boolean) : typeof v === "string" ? v.split(",").map((s) => s.trim()).filter(Boolean) : [];

function record(v: unknown): Record<string, string> {
  if (v && typeof v === "object" && !Array.isArray(v)) return Object.fromEntries(Object.entries(v).map(([k, x]) => [k.trim(), String(x).trim()]).filter(([, x]) => x !== ""));
  if (typeof v === "string")
    return Object.fromEntries(
      v.split(",").map((e) => e.split("=").map((s) => s.trim())).filter((p) => p.length === 2 && p[1] !== "").map(([k, x]) => [k!, x!]),
    );
  return {};
}

function timeLimit(raw: unknown, limits: Limits, problems: Problems): number {
  const t = raw === undefined || raw === null || raw === "" ? Math.min(DEFAULT_TIME_LIMIT_SECONDS, limits.maxTimeLimitSeconds) : Number(raw);
  if (!Number.isInteger(t) || t < 1) problems.push({ field: "timeLimitSeconds", message: "expected a whole number of seconds, at least 1" });
  else if (t > limits.maxTimeLimitSeconds)
    problems.push({ field: "timeLimitSeconds", message: `at most ${limits.maxTimeLimitSeconds} s in this lab (its owner sets the maximum)` });
  return t;
}

const nonNegative = (s: string) => {
  const q = parseRational(s);
  return q !== null && q.num >= 0n;
};
const positive = (s: string) => {
  const q = parseRational(s);
  return q !== null && q.num > 0n;
};

/** Validates a start-analysis request (form fields or JSON body) against the network. */
export function parseAnalysisParams(input: Record<string, unknown>, network: Network, limits: Limits): Parsed<AnalysisParams> {
  const problems: Problems = [];
  const species = network.species;
  const rates = rateSymbols(network);
  const order = list(input.order);
  const free = list(input.free);
  for (const [field, names] of [["order", order], ["free", free]] as const) {
    names.forEach((s, i) => {
      if (!species.includes(s)) problems.push({ field, message: `entry ${i + 1} '${s}' is not a species of this network (species: ${species.join(", ")})` });
    });
    if (new Set(names).size !== names.length) problems.push({ field, message: "a species is listed twice" });
  }
  const rateMode = input.rateMode === "symbolic" ? "symbolic" : input.rateMode === undefined || input.rateMode === "numeric" ? "numeric" : null;
  if (rateMode === null) problems.push({ field: "rateMode", message: "expected 'symbolic' or 'numeric'" });
  const rateValues = record(input.rateValues);
  for (const [k, v] of Object.entries(rateValues)) {
    if (!rates.includes(k)) problems.push({ field: `rateValues.${k}`, message: `'${k}' is not a rate constant of this network (${rates.join(", ")})` });
    else if (!positive(v)) problems.push({ field: `rateValues.${k}`, message: `expected a positive decimal or fraction, got '${v}'` });
  }
  const merged = { ...fileRateValues(network), ...rateValues };
  if (rateMode === "numeric") {
    const missing = rates.filter((r) => !(r in merged));
    if (missing.length > 0 && input.initial !== undefined && input.initial !== null && input.initial !== "")
      problems.push({ field: "rateValues", message: `numeric steady states need a value for every rate constant; missing: ${missing.join(", ")}` });
  }
  let initial: Record<string, string> | null = null;
  if (input.initial !== undefined && input.initial !== null && input.initial !== "") {
    initial = record(input.initial);
    for (const [k, v] of Object.entries(initial)) {
      if (!species.includes(k)) problems.push({ field: `initial.${k}`, message: `'${k}' is not a species of this network` });
      else if (!nonNegative(v)) problems.push({ field: `initial.${k}`, message: `expected a non-negative decimal or fraction, got '${v}'` });
    }
    if (Object.keys(initial).length === 0) problems.push({ field: "initial", message: "give at least one concentration as NAME=VALUE, or leave it empty" });
    if (rateMode === "symbolic") problems.push({ field: "initial", message: "numeric steady states need numeric rate constants; choose numeric rates or clear the initial concentrations" });
  }
  const timeLimitSeconds = timeLimit(input.timeLimitSeconds, limits, problems);
  const maxBasisSize = input.maxBasisSize === undefined || input.maxBasisSize === "" ? Math.min(2000, limits.maxBasisSize) : Number(input.maxBasisSize);
  if (!Number.isInteger(maxBasisSize) || maxBasisSize < 1 || maxBasisSize > limits.maxBasisSize)
    problems.push({ field: "maxBasisSize", message: `expected a whole number from 1 to ${limits.maxBasisSize}` });
  const notify = input.notify === true || input.notify === "on" || input.notify === "true";
  if (problems.length > 0) return { ok: false, problems };
  return {
    ok: true,
    value: {
      order: order.length > 0 ? order : null,
      free,
      rateMode: rateMode!,
      rateValues: rateMode === "numeric" ? rateValues : {},
      initial,
      timeLimitSeconds,
      maxBasisSize,
      maxTerms: DEFAULT_MAX_TERMS,
      notify,
    },
  };
}

/** The engine's order: the chosen order (or the suggestion) with the free species moved last. */
export function effectiveOrder(params: Pick<AnalysisParams, "order" | "free">, suggested: readonly string[]): string[] | undefined {
  if (!params.order && params.free.length === 0) return undefined;
  const base = params.order ? [...params.order, ...suggested.filter((s) => !params.order!.includes(s))] : [...suggested];
  return [...base.filter((s) => !params.free.includes(s)), ...params.free];
}

/** Validates a scan request against the network and its parent analysis' settings. */
export function parseScanParams(input: Record<string, unknown>, network: Network, parent: AnalysisParams, limits: Limits): Parsed<ScanParams> {
  const problems: Problems = [];
  const kind = input.parameterKind === "initial" ? "initial" : "rate";
  const name = String(input.parameter ?? "").trim();
  if (kind === "rate" && !rateSymbols(network).includes(name)) problems.push({ field: "parameter", message: `'${name}' is not a rate constant of this network (${rateSymbols(network).join(", ")})` });
  if (kind === "initial" && !network.species.includes(name)) problems.push({ field: "parameter", message: `'${name}' is not a species of this network` });
  if (parent.rateMode !== "numeric" || !parent.initial) problems.push({ field: "parameter", message: "scans start from a numeric analysis (rate values and initial concentrations)" });
  const from = Number(input.from);
  const to = Number(input.to);
  const points = input.points === undefined || input.points === "" ? 25 : Number(input.points);
  const spacing = input.spacing === "log" ? "log" : "linear";
  if (!Number.isFinite(from) || from < 0 || (kind === "rate" && from <= 0)) problems.push({ field: "from", message: kind === "rate" ? "expected a positive number" : "expected a non-negative number" });
  if (!Number.isFinite(to) || !(to > from)) problems.push({ field: "to", message: "expected a number larger than 'from'" });
  if (spacing === "log" && !(from > 0)) problems.push({ field: "spacing", message: "a log scan needs 'from' > 0" });
  if (!Number.isInteger(points) || points < 2 || points > 200) problems.push({ field: "points", message: "expected a whole number from 2 to 200" });
  const timeLimitSeconds = timeLimit(input.timeLimitSeconds, limits, problems);
  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, value: { parameter: { kind, name }, from, to, points, spacing, timeLimitSeconds } };
}

export function parseRelationParams(input: Record<string, unknown>, limits: Limits): Parsed<RelationParams> {
  const problems: Problems = [];
  const expression = String(input.expression ?? "").trim();
  if (expression === "") problems.push({ field: "expression", message: "type a polynomial in species and rate constants, e.g. k1*A - k2*B" });
  if (expression.length > 2000) problems.push({ field: "expression", message: "at most 2000 characters" });
  const timeLimitSeconds = timeLimit(input.timeLimitSeconds, limits, problems);
  return problems.length > 0 ? { ok: false, problems } : { ok: true, value: { expression, timeLimitSeconds } };
}

export function parseTimeCourseParams(input: Record<string, unknown>, network: Network, limits: Limits): Parsed<TimeCourseParams> {
  const problems: Problems = [];
  const endTime = input.endTime === undefined || input.endTime === "" ? 50 : Number(input.endTime);
  if (!Number.isFinite(endTime) || endTime <= 0 || endTime > 1e9) problems.push({ field: "endTime", message: "expected a positive end time" });
  let initial: Record<string, string> | null = null;
  if (input.initial !== undefined && input.initial !== null && input.initial !== "") {
    initial = record(input.initial);
    for (const [k, v] of Object.entries(initial)) {
      if (!network.species.includes(k)) problems.push({ field: `initial.${k}`, message: `'${k}' is not a species of this network` });
      else if (!nonNegative(v)) problems.push({ field: `initial.${k}`, message: `expected a non-negative decimal or fraction, got '${v}'` });
    }
  }
  const timeLimitSeconds = timeLimit(input.timeLimitSeconds ?? 30, limits, problems);
  return problems.length > 0 ? { ok: false, problems } : { ok: true, value: { endTime, initial, timeLimitSeconds } };
}

/** Scan grid: `points` values from `from` to `to`, evenly spaced or evenly spaced in log. */
export function scanGrid(p: Pick<ScanParams, "from" | "to" | "points" | "spacing">): number[] {
  const out: number[] = [];
  for (let i = 0; i < p.points; i++) {
    const t = i / (p.points - 1);
    out.push(p.spacing === "log" ? Math.exp(Math.log(p.from) + t * (Math.log(p.to) - Math.log(p.from))) : p.from + t * (p.to - p.from));
  }
  return out;
}

/** A float as exact decimal text for the engine (12 significant digits; common practice for scans). */
export const decimalText = (x: number): string => {
  const s = x.toPrecision(12);
  return s.includes("e") ? Number(s).toFixed(20).replace(/0+$/, "").replace(/\.$/, "") : s;
};
