import { isZeroPoly, neg } from "../algebra/index";
import type { KineticsRing, QPoly } from "./kinetics";
import { coefficientsIn, degreeIn, divideOut, normaliseEquation, signPattern, substituteFraction, variablesOf } from "../algebra/poly-tools";
import { type RationalExpression, composeExpression, simplifyFraction } from "./rational-expression";

/** One species solved from one equation in which it occurs linearly. */
export interface EliminatedSpecies {
  readonly species: string;
  /** Its value in terms of the species not eliminated and the parameters (fully back-substituted). */
  readonly expression: RationalExpression;
  /** The coefficient a of the species in the equation a·x + b it was solved from; must not vanish. */
  readonly pivot: QPoly;
}

export interface LinearEliminationResult {
  /** In elimination order. */
  readonly eliminated: readonly EliminatedSpecies[];
  /** Species not eliminated, in ring order. */
  readonly remainingSpecies: readonly string[];
  /** Equations left over, in the remaining species and the parameters only (normalised, non-zero). */
  readonly remaining: readonly QPoly[];
  /** Set when an equation shows that no positive steady state exists for positive parameters. */
  readonly infeasible: string | null;
}

export interface LinearEliminationOptions {
  /** Species that must stay (kept free); default none. */
  keep?: ReadonlySet<string>;
  /** Called after each step (for progress reports). */
  onStep?: (species: string) => void;
  /** Throws when called if the budget is exhausted. */
  check?: () => void;
  /**
   * Use only pivots a whose coefficients have one sign (a ≠ 0 at every positive point), so that no
   * positive steady state is lost where a pivot vanishes — needed when every state must be found.
   */
  definitePivotsOnly?: boolean;
}

/**
 * Linear elimination (Feliu & Wiuf, "Variable elimination in chemical reaction networks with
 * mass-action kinetics", SIAM J. Appl. Math. 72, 2012; Thomson & Gunawardena, "Unlimited
 * multistability in multisite phosphorylation systems", Nature 460, 2009): repeatedly take an
 * equation a·x + b = 0 in which a species x occurs only linearly, solve x = −b/a by exact
 * polynomial arithmetic, and substitute it (clearing denominators) into the other equations and
 * into the earlier solutions. Choices where a and b have opposite, definite signs come first (the
 * solution is then positive for positive inputs), then species early in the ring order.
 * Boundary factors (monomials in species) are removed from equations: positive steady states only.
 *
 * Example: E + S <-> C (k1, k2), C -> E + P (k3): from dC/dt = k1·E·S − (k2 + k3)·C it solves
 * C = k1·E·S/(k2 + k3).
 */
export function linearElimination(kin: KineticsRing, equations: readonly QPoly[], options: LinearEliminationOptions = {}): LinearEliminationResult {
  const ring = kin.ring;
  const speciesCount = kin.species.length;
  const isSpecies = (k: number) => k < speciesCount;
  const keep = options.keep ?? new Set<string>();
  let eqs = equations.map((e) => normaliseEquation(e, isSpecies)).filter((e) => !isZeroPoly(e));
  const solved: { index: number; num: QPoly; den: QPoly; pivot: QPoly }[] = [];
  const pivots: QPoly[] = [];
  const done = new Set<number>();

  const infeasibility = (list: readonly QPoly[]): string | null => {
    for (const e of list) {
      const vars = [...variablesOf(e)];
      const pattern = signPattern(e);
      if ((pattern === "positive" || pattern === "negative") && e.coeffs.length === 1)
        return "a steady-state equation reduces to a single product of concentrations and rate constants, which cannot vanish when all of them are positive";
      if (pattern === "positive" || pattern === "negative")
        return `the steady-state equation ${ring.format(e)} = 0 (after removing factors that are products of species) has coefficients of one sign, so it has no solution with positive species and parameters`;
      if (!vars.some(isSpecies)) return `the steady states require the parameter relation ${ring.format(e)} = 0`;
    }
    return null;
  };

  for (;;) {
    options.check?.();
    const bad = infeasibility(eqs);
    if (bad) return finish(bad);
    let best: { eq: number; x: number; a: QPoly; b: QPoly; score: number[] } | null = null;
    eqs.forEach((e, ei) => {
      for (const x of variablesOf(e)) {
        if (!isSpecies(x) || done.has(x) || keep.has(kin.species[x])) continue;
        if (degreeIn(e, x) !== 1) continue;
        const [b, a] = coefficientsIn(e, x);
        if (isZeroPoly(b) || isZeroPoly(a)) continue;
        const sa = signPattern(a);
        if (options.definitePivotsOnly && sa === "mixed") continue;
        const sb = signPattern(b);
        const definite = (sa === "positive" && sb === "negative") || (sa === "negative" && sb === "positive");
        const score = [definite ? 0 : 1, x, a.coeffs.length + b.coeffs.length];
        if (!best || lexLess(score, best.score)) best = { eq: ei, x, a, b, score };
      }
    });
    if (!best) break;
    const { eq, x, a, b } = best as { eq: number; x: number; a: QPoly; b: QPoly };
    const num = neg(b);
    pivots.push(a);
    for (const s of solved) {
      const composed = composeExpression(s, x, num, a, pivots);
      s.num = composed.num;
      s.den = composed.den;
    }
    const own = simplifyFraction(num, a, pivots);
    solved.push({ index: x, num: own.num, den: own.den, pivot: a });
    done.add(x);
    eqs = eqs
      .filter((_, i) => i !== eq)
      .map((e) => {
        const v = divideOut(substituteFraction(e, x, num, a).value, a);
        return normaliseEquation(v, isSpecies);
      })
      .filter((e) => !isZeroPoly(e));
    options.onStep?.(kin.species[x]);
  }
  return finish(null);

  function finish(infeasible: string | null): LinearEliminationResult {
    // A pivot of one sign never vanishes at positive points; a mixed one qualifies the verdict.
    const mixed = pivots.filter((p) => signPattern(p) === "mixed").map((p) => ring.format(p));
    return {
      eliminated: solved.map((s) => ({ species: kin.species[s.index], expression: { num: s.num, den: s.den }, pivot: s.pivot })),
      remainingSpecies: kin.species.filter((_, i) => !done.has(i)),
      remaining: eqs,
      infeasible: infeasible && mixed.length > 0 ? `${infeasible} (wherever ${mixed.join(", ")} ≠ 0)` : infeasible,
    };
  }
}

function lexLess(a: number[], b: number[]): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] < b[i];
  return false;
}
