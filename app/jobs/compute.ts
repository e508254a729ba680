/**
 * The algebra and numerics of one job, run only inside the job's child process (never in the web
 * server). Pure apart from the progress callback: input CSV and params in, plain JSON out. The
 * analysis result is the domain's one JSON shape (domain/steady-state/result.ts), which the CLI prints too.
 */
import { parseRational, type Rational } from "@domain/algebra/rational";
import { parseNetworkCsv, type Network } from "@domain/network/index";
import { analyseNetwork, type AnalysisProgress, type SteadyStateAnalysis } from "@domain/steady-state/index";
import { NOT_REACHED } from "@domain/steady-state/analyse";
import { foldScan } from "@domain/steady-state/folds";
import { multistationarity } from "@domain/steady-state/multistationarity";
import { testRelationOnNetwork } from "@domain/steady-state/relation";
import { analysisResultJson, multistationarityJson, type MultistationarityJson } from "@domain/steady-state/result";
import { jobErrorText } from "~/analyses/input-problems";
import { suggestedOrder } from "~/analyses/suggested-order";
import type { AnalysisParams, RelationParams, ScanParams, TimeCourseParams } from "~/analyses/params";
import type { ExactScan, FreshAnalysisResult } from "~/analyses/result-types";
import { decimalText, effectiveOrder, scanGrid } from "~/analyses/params";
import type { DistributionHook } from "@domain/algebra/f4/distribution";
import { simulateTimeCourse } from "./time-course";

export type JobPayload =
  | { kind: "analysis"; csv: string; params: AnalysisParams }
  | { kind: "scan"; csv: string; params: ScanParams; parent: AnalysisParams }
  | { kind: "relation"; csv: string; params: RelationParams; parent: AnalysisParams }
  | { kind: "timecourse"; csv: string; params: TimeCourseParams; parent: AnalysisParams; parentResult: Record<string, unknown> | null };

export interface ComputeOptions {
  /** The engine's own deadline (ms from now); phases past it end as warnings. */
  engineTimeoutMs: number;
  onProgress?: (p: AnalysisProgress) => void;
  /**
   * An analysis' result so far, after each stage that finished (same shape as the final result,
   * with the stages not reached in `unfinished`); the worker keeps the last one for a run stopped from outside.
   */
  onPartial?: (partial: Record<string, unknown>) => void;
  /** An analysis' large bases over Q may be computed by many workers (child.ts, coordinator.server.ts). */
  distribution?: DistributionHook;
}

const MULTISTATIONARITY_NOT_REACHED = { verdict: "undecided", method: "none", reason: NOT_REACHED };

/**
 * The network with the analysis' rate mode applied: symbolic drops every value, numeric adds
 * overrides. Constant species' concentrations are treated like rate values (see rateSymbols).
 */
export function networkFor(csv: string, params: Pick<AnalysisParams, "rateMode" | "rateValues">, override?: { rate: string; value: Rational }): Network {
  const network = parseNetworkCsv(csv);
  const value = (rate: string, fromFile: Rational | undefined): Rational | undefined => {
    if (override && override.rate === rate) return override.value;
    if (params.rateMode === "symbolic") return undefined;
    const given = params.rateValues[rate];
    return given !== undefined ? (parseRational(given) ?? fromFile) : fromFile;
  };
  const withRate = <T extends { rateValue?: Rational }>(r: T, v: Rational | undefined): T => {
    const { rateValue: _old, ...rest } = r;
    return (v === undefined ? rest : { ...rest, rateValue: v }) as T;
  };
  const constants = network.constants?.map((c) => {
    const v = value(c.name, c.value);
    const { value: _old, ...rest } = c;
    return v === undefined ? rest : { ...rest, value: v };
  });
  return {
    ...network,
    reactions: network.reactions.map((r) => withRate(r, value(r.rate, r.rateValue))),
    ...(constants ? { constants } : {}),
  };
}

export function initialMap(initial: Record<string, string> | null): Map<string, Rational> | undefined {
  if (!initial) return undefined;
  return new Map(Object.entries(initial).map(([k, v]) => [k, parseRational(v)!]));
}

function analysisOptions(network: Network, params: AnalysisParams, options: ComputeOptions) {
  return {
    order: effectiveOrder(params, suggestedOrder(network).order),
    timeoutMs: options.engineTimeoutMs,
    maxBasisSize: params.maxBasisSize,
    maxTerms: params.maxTerms,
    onProgress: options.onProgress,
  };
}

export function computeJob(payload: JobPayload, options: ComputeOptions): Record<string, unknown> {
  switch (payload.kind) {
    case "analysis": {
      const network = networkFor(payload.csv, payload.params);
      const started = Date.now();
      const onPartial = options.onPartial;
      const withPending = (r: SteadyStateAnalysis) => ({
        ...analysisResultJson(r),
        unfinished: [...r.unfinished, { stage: "multistationarity", reason: MULTISTATIONARITY_NOT_REACHED.reason }],
        multistationarity: MULTISTATIONARITY_NOT_REACHED,
      });
      const r = analyseNetwork(network, {
        ...analysisOptions(network, payload.params, options),
        ...(options.distribution ? { distribution: options.distribution } : {}),
        initial: initialMap(payload.params.initial),
        ...(onPartial ? { onPartial: (p: SteadyStateAnalysis) => onPartial(withPending(p)) } : {}),
      });
      onPartial?.(withPending(r));
      // The multistationarity verdict is about "some constants", so it ignores the run's values; it gets a small share of the time.
      options.onProgress?.({ phase: "multistationarity", message: "deficiency theorems, injectivity, witness search" });
      const left = options.engineTimeoutMs - (Date.now() - started);
      let verdict: MultistationarityJson;
      try {
        verdict = left > 500 ? multistationarityJson(multistationarity(parseNetworkCsv(payload.csv), { timeoutMs: Math.min(10_000, left / 2) })) : { verdict: "undecided", method: "none", reason: "no time left after the analysis" };
      } catch (e) {
        verdict = { verdict: "undecided", method: "none", reason: `not finished: ${(e as Error).message}` };
      }
      return { ...analysisResultJson(r), multistationarity: verdict } satisfies FreshAnalysisResult;
    }
    case "relation": {
      // Rate constants and totals may appear: symbolic in a symbolic run, substituted in a numeric one.
      const network = networkFor(payload.csv, payload.parent);
      const opts = analysisOptions(network, payload.parent, options);
      try {
        const relation = testRelationOnNetwork(network, payload.params.expression, {
          order: opts.order,
          initial: payload.parent.rateMode === "numeric" ? initialMap(payload.parent.initial) : undefined,
          deadline: Date.now() + options.engineTimeoutMs,
          maxBasisSize: opts.maxBasisSize,
          maxTerms: opts.maxTerms,
        });
        return { relation, warnings: [] };
      } catch (e) {
        if (e instanceof Error && e.name === "AlgebraError" && (e as { code?: string }).code === "parse") throw new Error(`relation '${payload.params.expression}': ${e.message}`);
        if (e instanceof Error && e.name === "AlgebraError" && ["timeout", "budget"].includes((e as { code?: string }).code ?? ""))
          return { relation: null, warnings: [`Relation ${payload.params.expression} not decided: ${e.message}.`] };
        throw e;
      }
    }

    case "scan":
      return computeScan(payload, options);
    case "timecourse": {
      const network = networkFor(payload.csv, payload.parent);
      return simulateTimeCourse(network, payload.params.initial ?? payload.parent.initial ?? {}, payload.params.endTime, options);
    }
  }
}

export interface ScanPoint {
  value: number;
  /** Positive steady states at this value, or null when that point was not finished. */
  states: { concentrations: Record<string, number>; verdict: string }[] | null;
  note?: string;
}

/**
 * A parameter scan: the whole numeric steady-state analysis at each grid point (exact lex basis,
 * real-root isolation, stability), so a bistable window shows as a range with three positive states.
 */
function computeScan(payload: Extract<JobPayload, { kind: "scan" }>, options: ComputeOptions): Record<string, unknown> {
  const { params, parent } = payload;
  const grid = scanGrid(params);
  const start = Date.now();
  // Exact fold points and windows first (half the time at most); the grid below stays as before.
  let exact: ExactScan | null = null;
  let exactNote: string | null = null;
  try {
    options.onProgress?.({ phase: "folds", message: `exact fold points of ${params.parameter.name}` });
    const f = foldScan(networkFor(payload.csv, parent), {
      parameter: params.parameter.name,
      from: parseRational(decimalText(params.from))!,
      to: parseRational(decimalText(params.to))!,
      initial: initialMap(parent.initial) ?? new Map(),
      grid: scanGrid({ ...params, points: Math.max(params.points, 41) }).map((x) => parseRational(decimalText(x))!),
      timeoutMs: options.engineTimeoutMs / 2,
    });
    exact = { folds: f.folds, windows: f.windows, curve: f.points, eliminant: f.eliminant, assumptions: f.assumptions, warnings: f.warnings };
  } catch (e) {
    exactNote = `Exact fold points not computed: ${jobErrorText(e)}`;
  }
  const points: ScanPoint[] = [];
  let species: readonly string[] = [];
  grid.forEach((value, i) => {
    const left = options.engineTimeoutMs - (Date.now() - start);
    if (left <= 0) {
      points.push({ value, states: null, note: "time limit reached before this point" });
      return;
    }
    options.onProgress?.({ phase: "scan", message: `point ${i + 1} of ${grid.length} (${params.parameter.name} = ${value.toPrecision(6)})` });
    const exact = parseRational(decimalText(value))!;
    const network =
      params.parameter.kind === "rate" ? networkFor(payload.csv, parent, { rate: params.parameter.name, value: exact }) : networkFor(payload.csv, parent);
    species = network.species;
    const initial = initialMap(parent.initial) ?? new Map();
    if (params.parameter.kind === "initial") initial.set(params.parameter.name, exact);
    try {
      const r = analyseNetwork(network, {
        ...analysisOptions(network, parent, { ...options, onProgress: undefined }),
        timeoutMs: Math.min(left, Math.max(1000, options.engineTimeoutMs / 4)),
        initial,
        skipFullBasis: true,
      });
      const complete = r.steadyStateSet === "finite" && r.steadyStates !== null;
      points.push({
        value,
        states: complete ? r.steadyStates!.map((s) => ({ concentrations: s.concentrations, verdict: s.verdict })) : null,
        ...(complete ? {} : { note: r.steadyStateSet === "continuum" ? "a continuum of steady states" : "not finished" }),
      });
    } catch (e) {
      points.push({ value, states: null, note: jobErrorText(e) });
    }
  });
  return { parameter: params.parameter, spacing: params.spacing, species: [...species], points, exact, exactNote };
}
