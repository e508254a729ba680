import { QQ } from "../algebra/index";
import { equals, isZeroPoly, leadingMonomial, mul, sub } from "../algebra/index";
import type { Rational } from "../algebra/index";
import { fromInt, rational } from "../algebra/rational";
import { PolynomialRing } from "../algebra/index";
import type { Complex } from "../numeric/eigenvalues";
import { newton } from "../numeric/newton";
import { stabilityOnClass, type StabilityVerdict } from "../numeric/stability";
import type { Budget } from "./budget";
import { floatSystem, evaluateFloat } from "./float-eval";
import { mapToRing } from "./ideal";
import type { QPoly } from "./kinetics";
import type { ParametrisationResult } from "./parametrisation";
import { divideOut, mayVanishAtPositivePoints, normaliseEquation, substituteFraction, variablesOf, isNonZeroConstant } from "../algebra/poly-tools";
import { stoichiometricRows, type SteadyStateSystem } from "./system";
import { isZeroDimensional, positiveSolutions } from "./zero-dimensional";
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
  /** For a continuum: one positive steady state of the class, proven to exist (species → value), if one was found. */
  readonly positivePoint?: Record<string, number> | null;
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
    for (const d of dens) eq = divideOut(eq, d);
    eq = normaliseEquation(eq, isSpecies);
    if (!isZeroPoly(eq)) reduced.push(eq);
  }
  let points: number[][];
  let status: "finite" | "positive-dimensional" = "finite";
  let eliminant: NumericSteadyStatesResult["eliminant"] = null;
  let pointsInSpecies = false;
  if (unknownIdx.length === 0) {
    points = reduced.length === 0 ? [[]] : [];
  } else if (reduced.length === 0) {
    // No equation is left on the unknowns: every value of them away from the pivots' zero sets is a
    // solution, so the complex solution set is proven infinite.
    status = "positive-dimensional";
    points = [];
  } else {
    budget.progress("steady-states", `solving ${reduced.length} equation(s) in ${param.unknowns.join(", ")} exactly`);
    const small = new PolynomialRing(param.unknowns, QQ, "lex");
    // Clearing denominators multiplies by them, which adds their zero sets as spurious (non-positive)
    // components; saturating by every denominator removes them again, so the dimension seen here is
    // that of the class's steady states and not of a leftover after elimination.
    const guards = [...dens, ...nonZero.filter((q) => !dens.some((d) => equals(d, q)))];
    const extra = guards.length > 0 ? mapToRing(guards.reduce((a, b) => mul(a, b)), small) : undefined;
    const solved = positiveSolutions(
      reduced.map((p) => mapToRing(p, small)),
      { ...budget.groebner(0.5, "steady-states"), extraSaturation: extra },
    );
    eliminant = solved.eliminant;
    points = solved.points;
    if (solved.status === "positive-dimensional") {
      // The reduced system may still have lost a condition at an intermediate pivot: only the
      // dimension of the whole class's saturated ideal (all species, numeric totals) is a proof.
      budget.progress("steady-states", "checking the dimension of the saturated steady-state ideal of the class");
      const whole = new PolynomialRing(kin.species, QQ, "lex");
      const wholeSolved = positiveSolutions(
        sys.equations.map((p) => mapToRing(p, whole)),
        budget.groebner(1, "steady-states"),
      );
      if (wholeSolved.status === "positive-dimensional") status = "positive-dimensional";
      else {
        eliminant = wholeSolved.eliminant;
        points = wholeSolved.points;
        pointsInSpecies = true;
      }
    }
  }
  if (status === "positive-dimensional") warnings.push(CONTINUUM_WARNING);
  const xs = points.map((pt) => {
    const x = new Array<number>(ring.n).fill(0);
    if (pointsInSpecies) kin.species.forEach((s, i) => (x[ring.indexOf(s)] = pt[i]));
    else {
      unknownIdx.forEach((k, i) => (x[k] = pt[i]));
      for (const e of param.eliminated) {
        const k = ring.indexOf(e.species);
        x[k] = evaluateFloat(e.expression.num, x) / evaluateFloat(e.expression.den, x);
      }
    }
    return x;
  });
  return { states: classifyPoints(network, sys, xs, budget), status, eliminant, warnings };
}

const CONTINUUM_WARNING =
  "The steady states in this stoichiometric class form a continuum: the saturated steady-state ideal of the class has positive dimension (infinitely many complex solutions with no zero concentration), so no finite list exists.";

/**
 * The positive steady states of one class straight from the reduced lex basis of its saturated
 * steady-state ideal (species only, numeric constants and totals): positive dimension proves a
 * continuum (Cox, Little & O'Shea ch. 5 §3, Theorem 6); dimension 0 goes on to the exact roots.
 * Example: for A <-> B (1, 1) with A + B = 2 the basis {A − 1, B − 1} gives the one state A = B = 1.
 */
export function steadyStatesFromBasis(network: Network, sys: SteadyStateSystem, basis: readonly QPoly[], budget: Budget): NumericSteadyStatesResult {
  const { kin } = sys;
  if (basis.length === 0) return { states: [], status: "positive-dimensional", eliminant: null, warnings: [CONTINUUM_WARNING] };
  if (basis.length === 1 && isNonZeroConstant(basis[0]))
    return { states: [], status: "finite", eliminant: null, warnings: [] };
  const speciesRing = new PolynomialRing(kin.species, QQ, "lex");
  const inSpecies = basis.map((p) => mapToRing(p, speciesRing));
  if (!isZeroDimensional(inSpecies)) {
    const point = positivePointOnContinuum(inSpecies, budget);
    const positivePoint = point ? Object.fromEntries(network.species.map((sp) => [sp, point[kin.species.indexOf(sp)]])) : null;
    return { states: [], status: "positive-dimensional", eliminant: null, warnings: [CONTINUUM_WARNING], positivePoint };
  }
  budget.progress("steady-states", `isolating the real roots of the class's lex basis (${basis.length} polynomials)`);
  const solved = positiveSolutions(inSpecies, { ...budget.groebner(1, "steady-states"), saturated: true });
  const xs = solved.points.map((pt) => {
    const x = new Array<number>(kin.ring.n).fill(0);
    kin.species.forEach((s, i) => (x[kin.ring.indexOf(s)] = pt[i]));
    return x;
  });
  return { states: classifyPoints(network, sys, xs, budget), status: "finite", eliminant: solved.eliminant, warnings: [] };
}

/**
 * One positive point of a positive-dimensional variety given by a lex basis, proven to exist: fix
 * variables outside the leading monomials' support to small positive rationals until the slice is
 * zero-dimensional, then isolate its positive roots exactly (a generic slice of a d-dimensional
 * variety by d hyperplanes x_i = c_i is finite; Cox, Little & O'Shea ch. 9 §3 — common practice).
 * Returns null when the tried slices hold no positive point (which proves nothing either way).
 * Example: {A + B − 2} fixes B = 1 and finds A = 1.
 */
function positivePointOnContinuum(basis: readonly QPoly[], budget: Budget): number[] | null {
  const ring = basis[0].ring;
  const values = [fromInt(1), rational(1n, 2n), fromInt(2), rational(3n, 2n)];
  for (const start of values) {
    const fixed = new Map<number, Rational>();
    let polys = [...basis];
    for (let round = 0; round < ring.n; round++) {
      budget.check("positive point on the continuum");
      const free = freeVariables(polys, fixed);
      if (free.length === 0) break;
      const k = free[free.length - 1];
      fixed.set(k, values[(values.indexOf(start) + round) % values.length]);
      const slice = [...basis, ...[...fixed].map(([i, v]) => sub(ring.variable(i), ring.constant(v)))];
      const solved = positiveSolutions(slice, budget.groebner(0.2, "steady-states"));
      if (solved.status === "empty") break;
      if (solved.status === "positive-dimensional") {
        polys = solved.basis;
        continue;
      }
      // positiveSolutions lists only points with every coordinate positive, proven by exact isolation.
      if (solved.points.length === 0) break;
      return solved.points[0];
    }
  }
  return null;
}

/** Variables (not yet fixed) on which no leading monomial is a pure power: candidates to fix next. */
function freeVariables(polys: readonly QPoly[], fixed: ReadonlyMap<number, Rational>): number[] {
  const n = polys[0].ring.n;
  const lms = polys.map(leadingMonomial);
  const out: number[] = [];
  for (let k = 0; k < n; k++) if (!fixed.has(k) && !lms.some((m) => m[k] > 0 && m.every((e, j) => j === k || e === 0))) out.push(k);
  return out;
}

/**
 * Completes candidate points (coordinates in the kinetics ring): two Newton steps on the full
 * square system remove the rounding of the rational evaluation; points with a coordinate that is
 * not positive and finite are dropped; each state gets the eigenvalues of its Jacobian restricted
 * to the stoichiometric subspace im N and a stability verdict.
 */
function classifyPoints(network: Network, sys: SteadyStateSystem, points: readonly number[][], budget: Budget): NumericSteadyState[] {
  const { kin } = sys;
  const ring = kin.ring;
  const all = kin.species.map((_, i) => i);
  const full = floatSystem(sys.equations, all);
  const odes = floatSystem(sys.odes, all);
  const n = stoichiometricRows(network, kin.species);
  const states: NumericSteadyState[] = [];
  for (const start of points) {
    budget.check("stability of the steady states");
    let x = start;
    const polished = newton((v) => ({ f: full.values(v), jacobian: full.jacobian(v) }), x, { maxIterations: 2, residualTol: 0 });
    const close = polished.x.every((v, i) => Math.abs(v - x[i]) <= 1e-8 * Math.max(Math.abs(x[i]), 1e-300));
    if (close && maxAbs(odes.values(polished.x)) <= maxAbs(odes.values(x))) x = polished.x;
    if (x.some((v) => !(v > 0 && Number.isFinite(v)))) continue; // an eliminated species is negative: not a positive steady state
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
  return states;
}

const maxAbs = (v: number[]) => v.reduce((m, x) => Math.max(m, Math.abs(x)), 0);
