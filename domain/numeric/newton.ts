import { norm2, normInf, solveLinear, type Matrix, type Vector } from "./dense";

/** Values and Jacobian of a square system F: Rⁿ → Rⁿ at x. */
export type SystemEvaluator = (x: Vector) => { f: Vector; jacobian: Matrix };

export interface NewtonOptions {
  maxIterations?: number;
  /** Converged when ‖F‖∞ ≤ residualTol. */
  residualTol?: number;
  /** Iterate in y = log x (x stays positive); for positive steady states. */
  logCoordinates?: boolean;
}

export interface NewtonResult {
  x: Vector;
  converged: boolean;
  iterations: number;
  residual: number;
}

/**
 * Damped Newton's method: full step first, halved until ‖F‖₂ decreases (Armijo test with c = 1e-4),
 * optionally in logarithmic coordinates so that iterates stay in the positive orthant.
 * (Deuflhard, "Newton Methods for Nonlinear Problems", Springer 2004, ch. 3; Dennis & Schnabel 1983, §6.3.)
 * Example: newton(x => ({ f: [x[0]*x[0] - 2], jacobian: [[2*x[0]]] }), [1]).x[0] ≈ 1.41421356237.
 */
export function newton(system: SystemEvaluator, x0: Vector, options: NewtonOptions = {}): NewtonResult {
  const maxIterations = options.maxIterations ?? 100;
  const residualTol = options.residualTol ?? 1e-12;
  const log = options.logCoordinates ?? false;
  let x = [...x0];
  let { f, jacobian } = system(x);
  let fn = norm2(f);
  for (let it = 0; it < maxIterations; it++) {
    if (!Number.isFinite(fn)) return { x, converged: false, iterations: it, residual: Infinity };
    if (normInf(f) <= residualTol) return { x, converged: true, iterations: it, residual: normInf(f) };
    // In log coordinates dF/dy = J · diag(x).
    const jac = log ? jacobian.map((row) => row.map((v, j) => v * x[j])) : jacobian;
    const step = solveLinear(jac, f.map((v) => -v));
    if (!step || step.some((v) => !Number.isFinite(v)))
      return { x, converged: false, iterations: it, residual: normInf(f) };
    let lambda = 1;
    let accepted = false;
    while (lambda >= 1e-8) {
      const trial = log
        ? x.map((v, i) => v * Math.exp(Math.max(-50, Math.min(50, lambda * step[i]))))
        : x.map((v, i) => v + lambda * step[i]);
      const next = system(trial);
      const nn = norm2(next.f);
      if (Number.isFinite(nn) && nn <= (1 - 1e-4 * lambda) * fn) {
        x = trial;
        f = next.f;
        jacobian = next.jacobian;
        fn = nn;
        accepted = true;
        break;
      }
      lambda /= 2;
    }
    if (!accepted) {
      // No decrease possible: either converged to rounding level or stuck.
      const rel = normInf(step) / Math.max(1, log ? 1 : normInf(x));
      return { x, converged: rel < 1e-13 && normInf(f) <= residualTol * 1e3, iterations: it, residual: normInf(f) };
    }
  }
  return { x, converged: normInf(f) <= residualTol, iterations: maxIterations, residual: normInf(f) };
}
