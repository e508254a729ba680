/**
 * Independent check of a parametrisation printed by `analyse --json`: at seeded random positive
 * rational values of the free species and the rate constants, the expressions must give positive
 * values for the other species at which every mass-action ODE right-hand side vanishes exactly
 * (bench/lib/mass-action.ts, no code from domain/). A rational parametrisation that passes at
 * random points is right with overwhelming probability (Schwartz–Zippel lemma: Schwartz,
 * J. ACM 27, 1980), and the substitution is exact, so a pass is never a rounding accident.
 *
 * Example: for A -> B (k1), B -> A (k2), { free: ["A"], expressions: { B: "k1*A/k2" } } passes.
 */
import type { Reaction } from "./mass-action";
import { massActionRhs } from "./mass-action";
import { evaluateExpression } from "./expression";
import type { Poly } from "./poly";
import { q, qAdd, qIsZero, qMul, qToString, type Q } from "./rational";

export interface ParametrisationJson {
  readonly free: readonly string[];
  readonly expressions: Readonly<Record<string, string>>;
}

export type CheckResult = { readonly ok: true; readonly points: number } | { readonly ok: false; readonly reason: string };

function evaluatePoly(p: Poly, values: readonly Q[]): Q {
  let sum = q(0n);
  for (const t of p.values()) {
    let v = t.coef;
    t.exps.forEach((e, i) => {
      for (let k = 0; k < e; k++) v = qMul(v, values[i]);
    });
    sum = qAdd(sum, v);
  }
  return sum;
}

/** Positive rationals like 7/3 from a small xorshift generator (seeded, so runs repeat). */
function positiveRationals(seed: number): () => Q {
  let s = seed >>> 0 || 1;
  const next = () => ((s ^= s << 13), (s ^= s >>> 17), (s ^= s << 5), s >>> 0);
  return () => q(BigInt(1 + (next() % 97)), BigInt(1 + (next() % 13)));
}

export function checkParametrisation(
  param: ParametrisationJson | null | undefined,
  reactions: readonly Reaction[],
  species: readonly string[],
  rates: readonly string[],
  points = 3,
): CheckResult {
  if (!param) return { ok: false, reason: "no parametrisation in the output" };
  const expressed = Object.keys(param.expressions);
  const covered = [...param.free, ...expressed];
  const missing = species.filter((s) => !covered.includes(s));
  if (missing.length > 0) return { ok: false, reason: `species neither free nor expressed: ${missing.join(", ")}` };
  if (new Set(covered).size !== covered.length || covered.length !== species.length)
    return { ok: false, reason: `free and expressed species overlap or are unknown: ${covered.join(", ")}` };
  const variables = [...species, ...rates];
  const rhs = massActionRhs(reactions, variables);
  const draw = positiveRationals(20_081);
  for (let point = 0; point < points; point++) {
    const values = new Map<string, Q>();
    for (const name of [...param.free, ...rates]) values.set(name, draw());
    for (const s of expressed) {
      const v = evaluateExpression(param.expressions[s], values);
      if (v.n <= 0n) return { ok: false, reason: `${s} = ${qToString(v)} is not positive at point ${point + 1}` };
      values.set(s, v);
    }
    const at = variables.map((v) => values.get(v)!);
    const bad = rhs.findIndex((p) => !qIsZero(evaluatePoly(p, at)));
    if (bad >= 0) return { ok: false, reason: `d${variables[bad]}/dt = ${qToString(evaluatePoly(rhs[bad], at))}, not 0, at point ${point + 1}` };
  }
  return { ok: true, points };
}
