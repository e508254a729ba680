/** What analyses.progress holds while a job runs (shown on the page and by the API). */
export interface JobProgress {
  stage: string;
  message: string;
  elapsedMs: number;
  basisSize?: number;
  pairsLeft?: number;
  degree?: number;
}

/**
 * Reads the engine's progress line into fields; the engine reports Gröbner steps as
 * "Gröbner basis: 12 polynomials, 40 pairs left, degree 5".
 * Example: parseProgress({ phase: "groebner", message: "Gröbner basis: 3 polynomials, 2 pairs left, degree 4" }, 10)
 * gives { stage: "groebner", basisSize: 3, pairsLeft: 2, degree: 4, elapsedMs: 10, … }.
 */
export function parseProgress(p: { phase: string; message: string }, elapsedMs: number): JobProgress {
  const out: JobProgress = { stage: p.phase, message: p.message, elapsedMs };
  const m = /(\d+) polynomials, (\d+) pairs left(?:, degree (\d+))?/.exec(p.message);
  if (m) {
    out.basisSize = Number(m[1]);
    out.pairsLeft = Number(m[2]);
    if (m[3] !== undefined) out.degree = Number(m[3]);
  }
  return out;
}
