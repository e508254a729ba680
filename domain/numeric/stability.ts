import { matMul, orthonormalColumnBasis, transpose, type Matrix } from "./dense";
import { eigenvalues, type Complex } from "./eigenvalues";

export type StabilityVerdict = "stable" | "unstable" | "undecided";

/**
 * The Jacobian restricted to the stoichiometric subspace im N: with Q an orthonormal basis of im N,
 * J_restricted = Qᵀ J Q (Q⁺ = Qᵀ for orthonormal Q). Conservation laws make J singular in the full
 * space; the restriction drops exactly those zero eigenvalues.
 * Example: for J = [[-1, 1], [1, -1]] and N = [[-1], [1]] (A <-> B) the restriction is [[-2]].
 * (Feinberg, "Foundations of Chemical Reaction Network Theory", Springer 2019, ch. 3 — linearisation on the stoichiometric class.)
 */
export function restrictedJacobian(jacobian: Matrix, stoichiometric: Matrix): Matrix {
  const q = orthonormalColumnBasis(stoichiometric);
  if (q.length === 0 || q[0].length === 0) return [];
  return matMul(matMul(transpose(q), jacobian), q);
}

/**
 * Linear stability from eigenvalues: stable when every real part is below −tol·scale, unstable when one
 * is above +tol·scale, undecided otherwise (a numerically zero real part; linearisation says nothing).
 * `scale` is max(1, largest |λ|) so the tolerance is relative. (Hartman–Grobman; common practice for the tolerance.)
 * Example: stabilityVerdict([{ re: -2, im: 0 }, { re: -1e-14, im: 1 }]) is "undecided".
 */
export function stabilityVerdict(values: Complex[], tol = 1e-9): StabilityVerdict {
  const scale = Math.max(1, ...values.map((v) => Math.hypot(v.re, v.im)));
  if (values.some((v) => v.re > tol * scale)) return "unstable";
  if (values.every((v) => v.re < -tol * scale)) return "stable";
  return "undecided";
}

export interface StabilityReport {
  eigenvalues: Complex[];
  verdict: StabilityVerdict;
}

/** Eigenvalues of the Jacobian restricted to im N with the verdict. Example: A <-> B (k=1 both ways) gives [−2], "stable". */
export function stabilityOnClass(jacobian: Matrix, stoichiometric: Matrix, tol = 1e-9): StabilityReport {
  const values = eigenvalues(restrictedJacobian(jacobian, stoichiometric));
  return { eigenvalues: values, verdict: stabilityVerdict(values, tol) };
}
