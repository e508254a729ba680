import { newton, type SystemEvaluator } from "./newton";
import type { Vector } from "./dense";

export interface MultistartOptions {
  /** Number of random starting points. */
  starts?: number;
  /** Seed of the deterministic generator (mulberry32). */
  seed?: number;
  /** Log-uniform sampling box per coordinate (positive bounds). */
  low: number[];
  high: number[];
  /** Two solutions are the same when every coordinate agrees to this relative tolerance. */
  dedupeTol?: number;
  residualTol?: number;
  /** Newton iterations per start (default 100). */
  maxIterations?: number;
}

/** A small deterministic PRNG in [0, 1) (mulberry32; common practice). */
export function seededRandom(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** True when a and b agree coordinatewise to relative tolerance tol. */
export const sameSolution = (a: Vector, b: Vector, tol: number): boolean =>
  a.every((v, i) => Math.abs(v - b[i]) <= tol * Math.max(Math.abs(v), Math.abs(b[i]), 1e-300));

/**
 * Positive solutions of a square system by many damped Newton runs in log coordinates from log-uniform
 * random starts; converged points are deduplicated. A heuristic (it can miss solutions), used as an
 * independent check of the exact solver, never as the answer. (Common practice.)
 * Example: for F(x) = (x − 1)(x − 2)(x − 3) on [0.1, 10] it finds 1, 2 and 3.
 */
export function multistartPositiveSolutions(system: SystemEvaluator, options: MultistartOptions): Vector[] {
  const random = seededRandom(options.seed ?? 1);
  const starts = options.starts ?? 200;
  const tol = options.dedupeTol ?? 1e-6;
  const found: Vector[] = [];
  for (let s = 0; s < starts; s++) {
    const x0 = options.low.map((lo, i) => Math.exp(Math.log(lo) + random() * (Math.log(options.high[i]) - Math.log(lo))));
    const result = newton(system, x0, { logCoordinates: true, residualTol: options.residualTol ?? 1e-11, maxIterations: options.maxIterations ?? 100 });
    if (!result.converged || result.x.some((v) => !(v > 0) || !Number.isFinite(v))) continue;
    if (!found.some((y) => sameSolution(y, result.x, tol))) found.push(result.x);
  }
  return found.sort((a, b) => a[0] - b[0]);
}
