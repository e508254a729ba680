/**
 * The algebra and numerics of one job, run only inside the job's child process (never in the web
 * server). Pure apart from the progress callback: input CSV and params in, plain JSON out. The
 * analysis result is exactly the CLI's `analyse --json` object (one code path: domain/cli/analyse.ts).
 */
import { parseRational, type Rational } from "@domain/algebra/rational";
import { toJson } from "@domain/cli/analyse";
import { parseNetworkCsv, type Network } from "@domain/network/index";
import { analyseNetwork, type AnalysisProgress } from "@domain/steady-state/index";
import { suggestedOrder } from "~/analyses/suggested-order";
import type { AnalysisParams, RelationParams, ScanParams, TimeCourseParams } from "~/analyses/params";
import { decimalText, effectiveOrder, scanGrid } from "~/analyses/params";
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
}

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
      const r = analyseNetwork(network, { ...analysisOptions(network, payload.params, options), initial: initialMap(payload.params.initial) });
      return toJson(r);
    }
    case "relation": {
      const network = networkFor(payload.csv, payload.parent);
      const r = analyseNetwork(network, { ...analysisOptions(network, payload.parent, options), relations: [payload.params.expression], skipFullBasis: true });
      return { relation: r.relations[0] ?? null, warnings: r.warnings.filter((w) => /Relation|relation/.test(w)) };
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
      points.push({ value, states: null, note: (e as Error).message });
    }
  });
  return { parameter: params.parameter, spacing: params.spacing, species: [...species], points };
}
