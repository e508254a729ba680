import { AlgebraError, QQ, PolynomialRing, eliminate, equals, fromTerms, isZeroPoly, leadingMonomial, mul, partialDerivative, substitute, sub, terms } from "../algebra/index";
import type { Rational } from "../algebra/index";
import { ONE, ZERO, add as addQ, compare, fromInt, mul as mulQ, rational, sub as subQ, toNumber } from "../algebra/rational";
import {
  type RatPoly,
  type RootInterval,
  fromRationalCoefficients,
  isExactRoot,
  isolateRealRoots,
  mulRat,
  refineRootInterval,
  compareRootWithRational,
  rationalIntervalToFloat,
} from "../algebra/univariate/index";
import { analyseStructure, type Network } from "../network/index";
import { stabilityOnClass } from "../numeric/stability";
import { Budget, type BudgetOptions, isOutOfBudget } from "./budget";
import { evaluateFloat, floatSystem } from "./float-eval";
import { mapToRing, monomialOf, saturate } from "./ideal";
import { kineticsRing, massActionOdes, rateTable, type KineticsRing, type QPoly, type QRing } from "./kinetics";
import { computeParametrisation } from "./parametrisation";
import { defaultOrder, SteadyStateInputError } from "./order";
import { degreeIn, exactQuotient, mayVanishAtPositivePoints, normaliseEquation, substituteFraction, variablesOf, isNonZeroConstant } from "../algebra/poly-tools";
import { independentRows, stoichiometricRows, totalsFromInitial } from "./system";
import { positiveSolutions } from "./zero-dimensional";

/** What is varied: a rate constant, the total of one conservation law (T1, T2, … as `analyse` names them), or one initial concentration. */
export type ScanParameterKind = "rate" | "total" | "initial";

export interface FoldScanOptions extends BudgetOptions {
  /** Rate-constant name, total name (T1, …) or species name (its initial concentration). */
  readonly parameter: string;
  readonly from: Rational;
  readonly to: Rational;
  /** Initial concentrations (unlisted species 0): they give the totals that are not varied. */
  readonly initial?: ReadonlyMap<string, Rational>;
  /** Evenly spaced points for the curve (default 41); points near each fold are added. */
  readonly points?: number;
  /** The curve's parameter values instead of the even grid (e.g. log-spaced); points near each fold are still added. */
  readonly grid?: readonly Rational[];
}

export interface FoldPoint {
  /** The fold value, to 10 significant digits. */
  readonly value: number;
  /** An interval with rational ends, width below 1e-9, holding exactly this critical value. */
  readonly interval: [number, number];
  /** The same interval exactly, as "num/den" text. */
  readonly exact: [string, string];
}

export interface ScanWindow {
  readonly from: number;
  readonly to: number;
  /** Number of positive steady states at every parameter value inside the open interval. */
  readonly count: number;
  /** The rational sample point where the count was computed exactly. */
  readonly sample: string;
}

export interface ScanState {
  readonly concentrations: Record<string, number>;
  /** true stable, false unstable, null undecided (eigenvalue with numerically zero real part). */
  readonly stable: boolean | null;
}

export interface FoldScan {
  readonly parameter: string;
  readonly kind: ScanParameterKind;
  readonly folds: FoldPoint[];
  readonly windows: ScanWindow[];
  readonly points: { value: number; steadyStates: ScanState[] }[];
  /** The univariate eliminant E(x, p) whose discriminant and boundary values gave the folds. */
  readonly eliminant: { variable: string; polynomial: string };
  /** Every critical value in the range (folds are those where the count changes). */
  readonly criticalValues: number[];
  readonly assumptions: string;
  readonly warnings: string[];
}

/**
 * Exact fold points of a one-parameter family of steady-state systems. With every other constant
 * numeric, the steady-state system (kept ODE rows and conservation equations) lives in Q[x₁…xₙ, p];
 * its saturation by x₁⋯xₙ·p (positive steady states only) gets a lex basis G with p last. Over Q(p)
 * the ideal must be zero-dimensional and in shape position (the eliminant E(xₙ, p) has as many roots
 * as the quotient has standard monomials). The number of positive steady states can change only at
 *  (a) roots of a leading coefficient (in the species) of an element of G — there G need not
 *      specialise (Kalkbrener, "On the stability of Gröbner bases under specializations",
 *      J. Symb. Comput. 24, 1997) and a coordinate may run off to infinity;
 *  (b) roots of the discriminant of E with respect to xₙ — two steady states meet (computed as the
 *      elimination ideal ⟨E, ∂E/∂xₙ⟩ ∩ Q[p], Cox, Little & O'Shea, "Ideals, Varieties, and
 *      Algorithms", 4th ed. 2015, ch. 3 §5–6);
 *  (c) values where a steady state reaches the boundary of the positive orthant:
 *      (G + ⟨xᵢ⟩) ∩ Q[p] for each species.
 * Between neighbouring critical values the count is constant; it is computed exactly at a rational
 * sample point in each interval (exact real-root isolation). Critical values where the counts on the
 * two sides differ are the folds (and boundary crossings); each is isolated in an interval of width
 * below 1e-9 by exact refinement.
 * Example: for 0 <-> X (k1, 11), 2X <-> 3X (6, 1) with k1 varied, E = X³ − 6X² + 11X − k1 and its
 * discriminant −(27k1² − 324k1 + 968) vanishes at k1 = 6 ± 2√3/9: three states for
 * 5.615… < k1 < 6.384…, one outside.
 */
export function foldScan(network: Network, options: FoldScanOptions): FoldScan {
  const budget = new Budget(options);
  const warnings: string[] = [];
  if (compare(options.from, options.to) >= 0) throw new SteadyStateInputError({ kind: "scan-range", problem: "from-not-below-to" });
  if (options.from.num < 0n) throw new SteadyStateInputError({ kind: "scan-range", problem: "from-negative" });
  const structure = analyseStructure(network);
  const lawsRec = structure.conservationLaws;
  const laws = lawsRec.map((law) => network.species.map((s) => BigInt(law[s] ?? 0)));
  const rates = rateTable(network);
  const totalNames = lawsRec.map((_, i) => `T${i + 1}`);
  const name = options.parameter;
  const kind: ScanParameterKind | null = rates.has(name) ? "rate" : network.species.includes(name) ? "initial" : totalNames.includes(name) ? "total" : null;
  if (!kind)
    throw new SteadyStateInputError({ kind: "scan-parameter", name, rates: [...rates.keys()], totals: totalNames });
  const missing = [...rates.entries()].filter(([k, v]) => k !== name && !v).map(([k]) => k);
  if (missing.length > 0) throw new SteadyStateInputError({ kind: "scan-rates-missing", missing });
  if (laws.length > 0 && !options.initial && !(kind === "total" && laws.length === 1))
    throw new SteadyStateInputError({ kind: "scan-totals-needed", totals: totalNames });
  if (options.initial)
    for (const s of options.initial.keys())
      if (!network.species.includes(s)) throw new SteadyStateInputError({ kind: "unknown-species", input: "initial", name: s, species: network.species });

  const varied: Network = kind === "rate" ? { ...network, reactions: network.reactions.map((r) => (r.rate === name ? { ...r, rateValue: undefined } : r)) } : network;
  const suggested = defaultOrder(network, lawsRec).order;
  const pName = kind === "rate" ? name : freshName(kind === "total" ? name : `${name}_0`, [...network.species, ...rates.keys()]);
  const attempts = [suggested, ...suggested.slice(0, -1).map((s) => [...suggested.filter((t) => t !== s), s])];
  let last: Error | null = null;
  // Linear elimination first (Feliu & Wiuf 2012): the lex bases then only see the species it leaves.
  const full = buildFamily(varied, suggested, laws, kind, name, pName, options.initial ?? new Map());
  const reduced = reduceFamily(full, budget, warnings);
  if (reduced === "infeasible") return finish(full, varied, options, budget, [], "no positive steady state for any value of the parameter (linear elimination)", warnings, name, kind, { variable: suggested[suggested.length - 1], polynomial: "1" });
  if (reduced) {
    const u = reduced.unknowns;
    const orders = [u, ...u.slice(0, -1).map((s) => [...u.filter((t) => t !== s), s])];
    for (const uo of orders) {
      const r = reorderReduced(reduced, uo);
      budget.progress("folds", `lex basis of the reduced steady-state family in ${uo.join(", ")}, ${pName}`);
      const sat = r.saturator.reduce((a, b) => mul(a, b), monomialOf(r.ring, r.ring.vars.map((_, i) => i)));
      const G = saturate(r.equations, sat, budget.groebner(0.5, "folds"));
      const analysis = criticalPolynomials(G, r.ring, uo.length, budget, r.boundary);
      if (analysis.kind === "not-shape") {
        last = new Error(analysis.reason);
        continue;
      }
      if (analysis.kind === "continuum") throw new SteadyStateInputError({ kind: "scan-continuum", name, at: null });
      const withReduced = { ...full, reduced: r };
      if (analysis.kind === "none") return finish(withReduced, varied, options, budget, [], analysis.note, warnings, name, kind, { variable: uo[uo.length - 1], polynomial: "1" });
      return finish(withReduced, varied, options, budget, analysis.polys, null, warnings, name, kind, analysis.eliminant);
    }
  }
  // Without linear elimination (or when its system is not in shape position): the full system.
  for (const order of attempts) {
    const built = buildFamily(varied, order, laws, kind, name, pName, options.initial ?? new Map());
    budget.progress("folds", `lex basis of the steady-state family in ${order.join(", ")}, ${pName}`);
    const G = saturate(built.equations, monomialOf(built.ring, built.ring.vars.map((_, i) => i)), budget.groebner(0.5, "folds"));
    const analysis = criticalPolynomials(G, built.ring, order.length, budget);
    if (analysis.kind === "not-shape") {
      last = new Error(analysis.reason);
      continue;
    }
    if (analysis.kind === "continuum") throw new SteadyStateInputError({ kind: "scan-continuum", name, at: null });
    if (analysis.kind === "none")
      return finish(built, varied, options, budget, [], analysis.note, warnings, name, kind, { variable: order[order.length - 1], polynomial: "1" });
    return finish(built, varied, options, budget, analysis.polys, null, warnings, name, kind, analysis.eliminant);
  }
  throw new AlgebraError("domain", `fold points: ${last?.message ?? "no shape position"} for any choice of the last species`);
}

interface Family {
  ring: QRing;
  /** Steady-state equations in Q[species…, p]. */
  equations: QPoly[];
  /** Kept ODE rows and conservation equations separately (same ring). */
  odeRows: QPoly[];
  conservation: QPoly[];
  /** ODE right-hand sides in Q[species…, p], aligned with the species order. */
  odes: QPoly[];
  species: string[];
  /** After linear elimination: the system in the species it leaves. */
  reduced?: Reduced;
}

/** The steady-state family after linear elimination, in Q[unknowns…, p]. */
interface Reduced {
  ring: QRing;
  unknowns: string[];
  equations: QPoly[];
  /** Numerators and denominators of mixed sign: saturated away, and boundary candidates. */
  saturator: QPoly[];
  boundary: QPoly[];
  /** Eliminated species as num/den in the full ring, by index. */
  eliminated: { index: number; num: QPoly; den: QPoly }[];
}

/**
 * Linear elimination of the kept ODE rows with the parameter symbolic (only pivots of one sign, so
 * no positive steady state is lost), then the conservation equations with the eliminated species
 * substituted and denominators cleared (as for the numeric steady states). Null when nothing was
 * eliminated or the elimination did not finish.
 */
function reduceFamily(full: Family, budget: Budget, warnings: string[]): Reduced | "infeasible" | null {
  const ring = full.ring;
  const pName = ring.vars[ring.n - 1];
  const kinRing = new PolynomialRing(ring.vars, QQ, `lex(${full.species.length}), grevlex(1)`);
  const kin = { ring: kinRing, species: full.species, rateParameters: [pName], totals: [], rateValues: new Map() } as KineticsRing;
  let param: ReturnType<typeof computeParametrisation>;
  try {
    param = computeParametrisation(kin, full.odeRows.map((q) => mapToRing(q, kinRing)), budget, { definitePivotsOnly: true });
  } catch (e) {
    if (isOutOfBudget(e)) return null;
    throw e;
  }
  if (param.infeasible) return "infeasible";
  if (param.eliminated.length === 0 || param.unknowns.length === 0 || !param.complete) return null;
  const elim = param.eliminated.map((e) => ({ index: ring.indexOf(e.species), num: mapToRing(e.expression.num, ring), den: mapToRing(e.expression.den, ring) }));
  const dens: QPoly[] = [];
  const mixed: QPoly[] = [];
  for (const e of elim) {
    if ([...variablesOf(e.den)].length > 0 && !dens.some((x) => equals(x, e.den))) dens.push(e.den);
    for (const q of [e.num, e.den]) if ([...variablesOf(q)].length > 0 && mayVanishAtPositivePoints(q) && !mixed.some((x) => equals(x, q))) mixed.push(q);
  }
  const isSpecies = (k: number) => k < full.species.length;
  const eqs: QPoly[] = param.remaining.map((q) => mapToRing(q, ring));
  for (const c of full.conservation) {
    let eq = c;
    for (const e of elim) eq = substituteFraction(eq, e.index, e.num, e.den).value;
    for (const d of dens)
      for (;;) {
        const q = exactQuotient(eq, d);
        if (!q) break;
        eq = q;
      }
    eq = normaliseEquation(eq, isSpecies);
    if (!isZeroPoly(eq)) eqs.push(eq);
  }
  if (eqs.length === 0) return null;
  const small = new PolynomialRing([...param.unknowns, pName], QQ, "lex");
  const move = (q: QPoly) => mapToRing(q, small);
  warnings.push(`Linear elimination (Feliu & Wiuf 2012) solved ${param.eliminated.map((e) => e.species).join(", ")}; the fold computation works in ${param.unknowns.join(", ")}.`);
  return { ring: small, unknowns: [...param.unknowns], equations: eqs.map(move), saturator: mixed.map(move), boundary: mixed.map(move), eliminated: elim };
}

function reorderReduced(r: Reduced, unknowns: readonly string[]): Reduced {
  const ring = new PolynomialRing([...unknowns, r.ring.vars[r.ring.n - 1]], QQ, "lex");
  const move = (q: QPoly) => mapToRing(q, ring);
  return { ...r, ring, unknowns: [...unknowns], equations: r.equations.map(move), saturator: r.saturator.map(move), boundary: r.boundary.map(move) };
}

/** The steady-state equations with the parameter as the last ring variable. */
function buildFamily(
  network: Network,
  order: readonly string[],
  laws: readonly (readonly bigint[])[],
  kind: ScanParameterKind,
  name: string,
  pName: string,
  initial: ReadonlyMap<string, Rational>,
): Family {
  const kin = kineticsRing(network, { speciesOrder: order });
  const ring = new PolynomialRing([...order, pName], QQ, "lex");
  const odes = massActionOdes(network, kin).map((p) => mapToRing(p, ring));
  const kept = independentRows(stoichiometricRows(network, order));
  const totals = totalsFromInitial(laws, network.species, initial);
  const p = ring.variable(pName);
  const odeRows = kept.map((i) => odes[i]);
  const conservation: QPoly[] = [];
  laws.forEach((w, j) => {
    const lhs = fromTerms(
      ring,
      network.species.flatMap((s, i) => (w[i] === 0n ? [] : [{ coeff: fromInt(w[i]), exponents: ring.vars.map((v) => (v === s ? 1 : 0)) }])),
    );
    let rhs: QPoly;
    if (kind === "total" && `T${j + 1}` === name) rhs = p;
    else if (kind === "initial" && w[network.species.indexOf(name)] !== 0n) {
      const c = w[network.species.indexOf(name)];
      const rest = subQ(totals[j], mulQ(fromInt(c), initial.get(name) ?? ZERO));
      rhs = fromTerms(ring, [
        { coeff: rest, exponents: ring.vars.map(() => 0) },
        { coeff: fromInt(c), exponents: ring.vars.map((v) => (v === pName ? 1 : 0)) },
      ]);
    } else rhs = ring.constant(totals[j]);
    conservation.push(sub(lhs, rhs));
  });
  return { ring, equations: [...odeRows, ...conservation], odeRows, conservation, odes, species: [...order] };
}

type Critical =
  | { kind: "ok"; polys: RatPoly[]; eliminant: { variable: string; polynomial: string } }
  | { kind: "none"; note: string }
  | { kind: "continuum" }
  | { kind: "not-shape"; reason: string };

/** The univariate polynomials in p whose roots hold every value where the count of positive steady states may change. */
function criticalPolynomials(G: QPoly[], ring: QRing, ns: number, budget: Budget, boundary: readonly QPoly[] = []): Critical {
  const pIdx = ns;
  const isConst = (g: QPoly) => isNonZeroConstant(g);
  if (G.length === 1 && isConst(G[0])) return { kind: "none", note: "no positive steady state for any positive value of the parameter (the saturated ideal is the whole ring)" };
  const pOnly = G.filter((g) => leadingMonomial(g).slice(0, ns).every((e) => e === 0));
  if (pOnly.length > 0) return { kind: "none", note: `positive steady states exist only at isolated parameter values (roots of ${ring.format(pOnly[0])})` };
  const lms = G.map((g) => leadingMonomial(g).slice(0, ns));
  for (let i = 0; i < ns; i++) if (!lms.some((m) => m[i] > 0 && m.every((e, k) => k === i || e === 0))) return { kind: "continuum" };
  const D = countStandard(lms, ns);
  const last = ns - 1;
  const inLast = G.filter((g) => leadingMonomial(g).slice(0, last).every((e) => e === 0));
  const E = inLast[0];
  if (!E || degreeIn(E, last) !== D) return { kind: "not-shape", reason: `the eliminant in ${ring.vars[last]} has degree ${E ? degreeIn(E, last) : 0}, not the ${D} solutions of the system` };
  const polys: RatPoly[] = [];
  const toUni = (q: QPoly): RatPoly | null => {
    const c: Rational[] = [];
    for (const t of terms(q)) {
      if (t.exponents.some((e, k) => e > 0 && k !== pIdx)) return null;
      const d = t.exponents[pIdx];
      while (c.length <= d) c.push(ZERO);
      c[d] = addQ(c[d], t.coeff);
    }
    return fromRationalCoefficients(c);
  };
  const addPoly = (q: QPoly | undefined) => {
    if (!q) return;
    const u = toUni(q);
    if (u && u.length > 1) polys.push(u);
  };
  // (a) leading coefficients in the species.
  for (const g of G) addPoly(leadingCoefficientInSpecies(g, ns));
  // (b) discriminant of E in the last species.
  const pairRing = new PolynomialRing([ring.vars[last], ring.vars[pIdx]], QQ, "lex");
  const e2 = mapToRing(E, pairRing);
  const disc = eliminate([e2, partialDerivative(e2, 0)], [ring.vars[last]], budget.groebner(0.5, "folds"));
  if (disc.length === 0) return { kind: "not-shape", reason: "the eliminant has a repeated factor for every parameter value" };
  for (const q of disc) addPoly(mapToRing(q, ring));
  // (c) a steady state reaching the boundary xᵢ = 0.
  const species = ring.vars.slice(0, ns);
  // (c′) after linear elimination: an eliminated species reaching 0 or ∞ (a numerator or denominator of mixed sign vanishing).
  for (const z of [...species.map((_, i) => ring.variable(i)), ...boundary]) {
    budget.check("fold points");
    for (const q of eliminate([...G, z], species, budget.groebner(0.3, "folds"))) addPoly(q);
  }
  return { kind: "ok", polys, eliminant: { variable: ring.vars[last], polynomial: pairRing.format(e2) } };
}

function leadingCoefficientInSpecies(g: QPoly, ns: number): QPoly {
  const lm = leadingMonomial(g);
  const picked = terms(g)
    .filter((t) => t.exponents.slice(0, ns).every((e, k) => e === lm[k]))
    .map((t) => ({ coeff: t.coeff, exponents: t.exponents.map((e, k) => (k < ns ? 0 : e)) }));
  return fromTerms(g.ring, picked);
}

/** Number of monomials outside the monomial ideal generated by `lms` (finite when each variable has a pure power). */
function countStandard(lms: readonly number[][], n: number): number {
  const bound = Array.from({ length: n }, (_, i) => Math.min(...lms.filter((m) => m[i] > 0 && m.every((e, k) => k === i || e === 0)).map((m) => m[i])));
  let count = 0;
  const e = new Array<number>(n).fill(0);
  const walk = (k: number) => {
    if (count > 100_000) throw new AlgebraError("budget", "fold points: more than 100000 solutions");
    if (k === n) {
      if (!lms.some((m) => m.every((x, i) => x <= e[i]))) count++;
      return;
    }
    for (let d = 0; d < bound[k]; d++) {
      e[k] = d;
      walk(k + 1);
    }
    e[k] = 0;
  };
  walk(0);
  return count;
}

function freshName(base: string, taken: readonly string[]): string {
  let n = base.replace(/[^A-Za-z0-9_]/g, "_");
  while (taken.includes(n)) n = `_${n}`;
  return n;
}

const WIDTH = rational(1n, 10n ** 10n);

/** Real roots of the critical polynomials strictly inside (from, to), sorted, isolated to width < 1e-9. */
function criticalRoots(polys: readonly RatPoly[], from: Rational, to: Rational, budget: Budget): { p: RatPoly; iv: RootInterval }[] {
  if (polys.length === 0) return [];
  let product: RatPoly = fromRationalCoefficients([ONE]);
  for (const q of polys) product = mulRat(product, q);
  const roots = isolateRealRoots(product, { deadline: budget.deadline });
  const out: { p: RatPoly; iv: RootInterval }[] = [];
  for (const r of roots) {
    if (compareRootWithRational(product, r, from) <= 0 || compareRootWithRational(product, r, to) >= 0) continue;
    let iv = r;
    if (!isExactRoot(iv)) iv = refineRootInterval(product, iv, { width: WIDTH, relativeWidth: rational(1n, 10n ** 13n), deadline: budget.deadline });
    // Keep the interval inside (from, to) so the sample points between roots stay in range.
    out.push({ p: product, iv });
  }
  return out;
}

/** A rational with a small denominator strictly between a and b (a < b). */
export function simpleRationalBetween(a: Rational, b: Rational): Rational {
  for (let d = 1n; ; d *= 2n) {
    // smallest multiple of 1/d strictly above a
    const num = floorDiv(a.num * d, a.den) + 1n;
    const r = rational(num, d);
    if (compare(r, b) < 0) return r;
  }
}

const floorDiv = (a: bigint, b: bigint) => (a >= 0n ? a / b : -((-a + b - 1n) / b));

function finish(
  family: Family,
  network: Network,
  options: FoldScanOptions,
  budget: Budget,
  polys: RatPoly[],
  note: string | null,
  warnings: string[],
  name: string,
  kind: ScanParameterKind,
  eliminant: { variable: string; polynomial: string },
): FoldScan {
  if (note) warnings.push(note);
  const roots = criticalRoots(polys, options.from, options.to, budget);
  const nSt = stoichiometricRows(network, family.species);
  const pIdx = family.species.length;
  const small = new PolynomialRing(family.species, QQ, "lex");
  const all = family.species.map((_, i) => i);
  const solveAt = (value: Rational): number[][] | null => {
    const r = family.reduced;
    if (!r) {
      const at = family.equations.map((q) => mapToRing(substitute(q, new Map([[pIdx, value]])), small)).filter((q) => q.coeffs.length > 0);
      if (at.length === 0) return null;
      const solved = positiveSolutions(at, budget.groebner(0.2, "scan"));
      return solved.status === "positive-dimensional" ? null : solved.points;
    }
    const ur = new PolynomialRing(r.unknowns, QQ, "lex");
    const k = r.ring.n - 1;
    const at = r.equations.map((q) => mapToRing(substitute(q, new Map([[k, value]])), ur)).filter((q) => q.coeffs.length > 0);
    if (at.length === 0) return null;
    const extra = r.saturator.length > 0 ? mapToRing(substitute(r.saturator.reduce((a, b) => mul(a, b)), new Map([[k, value]])), ur) : undefined;
    const solved = positiveSolutions(at, { ...budget.groebner(0.2, "scan"), extraSaturation: extra && extra.coeffs.length > 0 ? extra : undefined });
    if (solved.status === "positive-dimensional") return null;
    const pv = toNumber(value);
    const out: number[][] = [];
    for (const pt of solved.points) {
      const x = new Array<number>(family.ring.n).fill(0);
      r.unknowns.forEach((u, i) => (x[family.ring.indexOf(u)] = pt[i]));
      x[pIdx] = pv;
      for (const e of r.eliminated) x[e.index] = evaluateFloat(e.num, x) / evaluateFloat(e.den, x);
      const xs = x.slice(0, pIdx);
      if (xs.every((v) => v > 0)) out.push(xs);
    }
    return out;
  };
  const statesAt = (value: Rational): ScanState[] | null => {
    budget.check("scan");
    const points = solveAt(value);
    if (!points) return null;
    const odes = floatSystem(family.odes.map((q) => mapToRing(substitute(q, new Map([[pIdx, value]])), small)), all);
    return points.map((x) => {
      const st = stabilityOnClass(odes.jacobian(x), nSt);
      const concentrations: Record<string, number> = {};
      for (const s of network.species) concentrations[s] = x[family.species.indexOf(s)];
      return { concentrations, stable: st.verdict === "stable" ? true : st.verdict === "unstable" ? false : null };
    });
  };
  // Windows: one sample between neighbouring critical values.
  const gaps: [Rational, Rational][] = [];
  let lo = options.from;
  for (const r of roots) {
    gaps.push([lo, r.iv.lo]);
    lo = r.iv.hi;
  }
  gaps.push([lo, options.to]);
  const counts = gaps.map(([a, b]) => {
    const s = compare(a, b) < 0 ? simpleRationalBetween(a, b) : a;
    const st = statesAt(s);
    if (!st) throw new SteadyStateInputError({ kind: "scan-continuum", name, at: fmtQ(s) });
    return { sample: s, count: st.length };
  });
  const folds: FoldPoint[] = [];
  const windows: ScanWindow[] = [];
  let start = toNumber(options.from);
  counts.forEach((c, i) => {
    const next = roots[i];
    const isLast = i === counts.length - 1;
    if (!isLast && counts[i + 1].count === c.count) return; // not a fold: same count on both sides
    const end = isLast ? toNumber(options.to) : midpointValue(next.iv);
    windows.push({ from: start, to: end, count: c.count, sample: fmtQ(c.sample) });
    if (!isLast) {
      const f = rationalIntervalToFloat(next.iv);
      folds.push({ value: Number(f.mid.toPrecision(10)), interval: [f.lo, f.hi], exact: [fmtQ(next.iv.lo), fmtQ(next.iv.hi)] });
      start = end;
    }
  });
  // Points: an even grid plus points just beside each fold so the curves reach the turning points.
  const n = Math.max(2, options.points ?? 41);
  const span = subQ(options.to, options.from);
  const grid: Rational[] = options.grid ? options.grid.filter((x) => compare(x, options.from) >= 0 && compare(x, options.to) <= 0) : [];
  if (!options.grid) for (let i = 0; i < n; i++) grid.push(addQ(options.from, mulQ(span, rational(BigInt(i), BigInt(n - 1)))));
  for (const f of folds) {
    const v = rational(BigInt(f.exact[0].split("/")[0]), BigInt(f.exact[0].split("/")[1] ?? "1"));
    const w = rational(BigInt(f.exact[1].split("/")[0]), BigInt(f.exact[1].split("/")[1] ?? "1"));
    for (const off of [1e-2, 1e-3, 1e-5]) {
      const d = mulQ(span, rational(BigInt(Math.round(off * 1e6)), 1_000_000n));
      for (const x of [subQ(v, d), addQ(w, d)]) if (compare(x, options.from) > 0 && compare(x, options.to) < 0) grid.push(x);
    }
  }
  grid.sort(compare);
  const points: FoldScan["points"] = [];
  for (const x of grid) {
    if (Date.now() > budget.deadline) {
      warnings.push("the time limit was reached before every curve point was computed; folds and windows are complete");
      break;
    }
    const st = statesAt(x);
    if (st) points.push({ value: toNumber(x), steadyStates: st });
  }
  const criticalValues = roots.map((r) => Number(rationalIntervalToFloat(r.iv).mid.toPrecision(10)));
  return {
    parameter: name,
    kind,
    folds,
    windows,
    points,
    eliminant,
    criticalValues,
    assumptions: `Mass-action kinetics; positive concentrations only; every other rate constant${kind === "rate" ? "" : " and total"} fixed at the given value; ${name} varied over (${fmtQ(options.from)}, ${fmtQ(options.to)}); stability from the eigenvalues on the stoichiometric class (floating point).`,
    warnings,
  };
}

const midpointValue = (iv: RootInterval) => rationalIntervalToFloat(iv).mid;
const fmtQ = (r: Rational) => (r.den === 1n ? `${r.num}` : `${r.num}/${r.den}`);
