import { fromInt } from "../algebra/rational";
import { LinearBudgetError } from "../linear/errors";
import { nonNegativeLeftKernelRays } from "../linear/extreme-rays";
import { matrixFromRationals, type Matrix } from "../linear/matrix";
import { primitiveIntegerVector } from "../linear/primitive";
import { leftKernel, rank } from "../linear/rref";

export interface ConservationAnalysis {
  /** A basis of {y : yᵀN = 0}: primitive integer vectors, non-negative ones first (extreme rays where they suffice). */
  readonly basis: bigint[][];
  /** Minimal semi-positive conservation laws (extreme rays), or null when the size budget was exceeded. */
  readonly minimalSemiPositive: bigint[][] | null;
  /** True when some conservation law is positive on every species; null when unknown (budget). */
  readonly conservative: boolean | null;
  readonly warnings: string[];
}

export interface ConservationOptions {
  /** Budget for the extreme-ray enumeration (intermediate generators), default 20 000. */
  readonly maxRays?: number;
}

/**
 * Conservation laws of a stoichiometric matrix N (species × reactions): the left kernel, of
 * dimension (species − rank N). The basis prefers non-negative vectors: extreme rays of
 * {y ≥ 0 : yᵀN = 0} are taken greedily (in species order of their supports) while they raise the rank, and the
 * basis is completed from the RREF kernel basis if they do not span. The network is conservative
 * when a strictly positive law exists, i.e. when the extreme rays together cover every species
 * (Schuster & Höfer, J. Chem. Soc. Faraday Trans. 87 (1991); Horn & Jackson 1972, §4).
 *
 * Example: Michaelis–Menten E + S <-> C -> E + P (species E, S, C, P) gives the basis
 * (1, 0, 1, 0) for E + C and (0, 1, 1, 1) for S + C + P; the network is conservative.
 */
export function analyseConservation(n: Matrix, options: ConservationOptions = {}): ConservationAnalysis {
  const warnings: string[] = [];
  const dimension = n.rows - rank(n);
  let rays: bigint[][] | null;
  try {
    rays = nonNegativeLeftKernelRays(n, { maxRays: options.maxRays });
  } catch (e) {
    if (!(e instanceof LinearBudgetError)) throw e;
    rays = null;
    warnings.push(`Minimal semi-positive conservation laws not computed: ${e.message}.`);
  }
  const candidates = rays ?? [];
  const kernel = leftKernel(n).map(primitiveIntegerVector);
  const basis: bigint[][] = [];
  for (const v of [...candidates, ...kernel]) {
    if (basis.length === dimension) break;
    if (rankOf([...basis, v]) > basis.length) basis.push(v);
  }
  const conservative = rays === null ? null : n.rows === 0 || rays.length > 0 && n.entries.every((_, i) => rays!.some((r) => r[i] !== 0n));
  return { basis, minimalSemiPositive: rays, conservative, warnings };
}

const rankOf = (vectors: readonly (readonly bigint[])[]): number =>
  rank(matrixFromRationals(vectors.map((v) => v.map(fromInt)), vectors[0]?.length ?? 0));
