import { QQ } from "../algebra/index";
import { equals, isZeroPoly, mul } from "../algebra/index";
import { PolynomialRing } from "../algebra/index";
import type { Complex } from "../numeric/eigenvalues";
import { newton } from "../numeric/newton";
import { stabilityOnClass, type StabilityVerdict } from "../numeric/stability";
import type { Budget } from "./budget";
import { floatSystem, evaluateFloat } from "./float-eval";
import { mapToRing } from "./ideal";
import type { QPoly } from "./kinetics";
import type { ParametrisationResult } from "./parametrisation";
import { exactQuotient, mayVanishAtPositivePoints, normaliseEquation, substituteFraction, variablesOf } from "./poly-tools";
import { stoichiometricRows, type SteadyStateSystem } from "./system";
import { positiveSolutions } from "./zero-dimensional";
import type { Network } from "../network/index";

export interface NumericSteadyState {
  /** Species → concentration, in the network's species order. */
  readonly concentrations: Record<string, number>;
  /** true = stable, false = unstable, null = undecided (an eigenvalue with numerically zero real part). */
  readonly stable: boolean | null;
  readonly verdict: StabilityVerdict;
  /** Eigenvalues of the Jacobian restricted to the stoichiometric subspace. */
  readonly eigenvalues: Complex[];
  /** max |dx/dt| at the reported point. */
  readonly residual: number;
}

export interface NumericSteadyStatesResult {
  readonly states: NumericSteadyState[];
  /** "finite": every positive steady state of the class is listed. */
  readonly status: "finite" | "positive-dimensional";
  /** The univariate polynomial whose real roots were isolated. */
  readonly eliminant: { variable: string; polynomial: string } | null;
  readonly warnings: string[];
}

/**
 * All positive steady states in one stoichiometric class, exactly: the parametrisation (or what
 * is left after linear elimination) is substituted into the conservation equations with numeric
 * totals, denominators cleared; the resulting small system is solved by `positiveSolutions`
 * (saturation, lex basis, univariate eliminant, exact real-root isolation, back substitution,
 * refinement); each point is completed, polished by two Newton steps on the full system, and
 * classified by the eigenvalues of the Jacobian restricted to im N.
 * Example: for 0 <-> X (6, 11) and 2X <-> 3X (6, 1), dX/dt = −(X − 1)(X − 2)(X − 3) and the class holds
 * X = 1 (stable), 2 (unstable) and 3 (stable).
 */
export function numericSteadyStates(network: Network, sys: SteadyStateSystem, param: ParametrisationResult, budget: Budget): NumericSteadyStatesResult {
  const { kin } = sys;
  const ring = kin.ring;
  const warnings: string[] = [];
  const unknownIdx = param.unknowns.map((s) => ring.indexOf(s));
  const dens: QPoly[] = [];
  // Saturating also by numerators and denominators that may vanish keeps every eliminated species
  // away from 0 and ∞, so its sign is certain (ones of one sign are positive at positive points anyway).
  const nonZero: QPoly[] = [];
  for (const e of param.eliminated) {
    const d = e.expression.den;
    if ([...variablesOf(d)].length > 0 && !dens.some((x) => equals(x, d))) dens.push(d);
    for (const q of [e.expression.num, d])
      if ([...variablesOf(q)].length > 0 && mayVanishAtPositivePoints(q) && !nonZero.some((x) => equals(x, q))) nonZero.push(q);
  }
  const isSpecies = (k: number) => k < kin.species.length;
  const reduced: QPoly[] = [...param.remaining];
  for (const c of sys.conservationEquations) {
    let eq = c;
    for (const e of param.eliminated) eq = substituteFraction(eq, ring.indexOf(e.species), e.expression.num, e.expression.den).value;
    for (const d of dens)
      for (;;) {
        const q = exactQuotient(eq, d);
        if (!q) break;
        eq = q;
      }
    eq = normaliseEquation(eq, isSpecies);
    if (!isZeroPoly(eq)) reduced.push(eq);
  }
  let points: number[][];
  let status: "finite" | "positive-dimensional" = "finite";
  let eliminant: NumericSteadyStatesResult["eliminant"] = null;
  if (unknownIdx.length === 0) {
    points = reduced.length === 0 ? [[]] : [];
  } else if (reduced.length === 0) {
    status = "positive-dimensional";
    points = [];
  } else {
    budget.progress("steady-states", `solving ${reduced.length} equation(s) in ${param.unknowns.join(", ")} exactly`);
    const small = new PolynomialRing(param.unknowns, QQ, "lex");
    const extra = nonZero.length > 0 ? mapToRing(nonZero.reduce((a, b) => mul(a, b)), small) : undefined;
    const solved = positiveSolutions(
      reduced.map((p) => mapToRing(p, small)),
      { ...budget.groebner(1), extraSaturation: extra },
    );
    eliminant = solved.eliminant;
    if (solved.status === "positive-dimensional") status = "positive-dimensional";
    points = solved.points;
  }
  if (status === "positive-dimensional")
    warnings.push("The steady states in this stoichiometric class form a continuum (the ideal is not zero-dimensional): no finite list exists.");
  const all = kin.species.map((_, i) => i);
  const full = floatSystem(sys.equations, all);
  const odes = floatSystem(sys.odes, all);
  const n = stoichiometricRows(network, kin.species);
  const states: NumericSteadyState[] = [];
  for (const pt of points) {
    let x = new Array<number>(ring.n).fill(0);
    unknownIdx.forEach((k, i) => (x[k] = pt[i]));
    for (const e of param.eliminated) {
      const k = ring.indexOf(e.species);
      x[k] = evaluateFloat(e.expression.num, x) / evaluateFloat(e.expression.den, x);
    }
    // Two Newton steps on the full square system remove the rounding of the rational evaluation.
    const polished = newton((v) => ({ f: full.values(v), jacobian: full.jacobian(v) }), x, { maxIterations: 2, residualTol: 0 });
    const close = polished.x.every((v, i) => Math.abs(v - x[i]) <= 1e-8 * Math.max(Math.abs(x[i]), 1e-300));
    if (close && maxAbs(odes.values(polished.x)) <= maxAbs(odes.values(x))) x = polished.x;
    if (x.some((v) => !(v > 0))) continue; // an eliminated species is negative: not a positive steady state
    const stability = stabilityOnClass(odes.jacobian(x), n);
    const concentrations: Record<string, number> = {};
    for (const s of network.species) concentrations[s] = x[ring.indexOf(s)];
    states.push({
      concentrations,
      stable: stability.verdict === "stable" ? true : stability.verdict === "unstable" ? false : null,
      verdict: stability.verdict,
      eigenvalues: stability.eigenvalues,
      residual: maxAbs(odes.values(x)),
    });
  }
  return { states, status, eliminant, warnings };
}

const maxAbs = (v: number[]) => v.reduce((m, x) => Math.max(m, Math.abs(x)), 0);
