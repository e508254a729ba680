import { QQ, PolynomialRing, add, fromTerms, mul, partialDerivative, sub, terms } from "../algebra/index";
import type { Rational } from "../algebra/index";
import { ONE, ZERO, add as addQ, div as divQ, fromInt, isZero, mul as mulQ, rational, sign, sub as subQ } from "../algebra/rational";
import { createMatrix, nonNegativeLeftKernelRays, rref } from "../linear/index";
import { analyseStructure, type Network, type NetworkStructure } from "../network/index";
import { seededRandom } from "../numeric/multistart";
import { analyseNetwork } from "./analyse";
import { Budget, type BudgetOptions, isOutOfBudget } from "./budget";
import { kineticsRing, massActionOdes, rateTable, type QPoly } from "./kinetics";
import { signPattern } from "../algebra/poly-tools";

export type MultistationarityVerdict = "monostationary" | "multistationary" | "undecided";

export interface MultistationarityWitness {
  /** Rate constant → exact value ("3/2"). */
  readonly rates: Record<string, string>;
  /** Total of each conservation law (T1, T2, … in the order of the structure's laws) → exact value. */
  readonly totals: Record<string, string>;
  /** The initial concentrations that give these totals (exact), so `analyse --initial` reproduces the witness. */
  readonly initial: Record<string, string>;
  /** At least two positive steady states of that class, found by the exact engine. */
  readonly steadyStates: Record<string, number>[];
}

export interface MultistationarityResult {
  readonly verdict: MultistationarityVerdict;
  /** Which criterion decided (or "none"). */
  readonly method: string;
  readonly reason: string;
  readonly witness?: MultistationarityWitness;
  /** What the verdict assumes. */
  readonly assumptions: string[];
  readonly sources: string[];
}

const CRACIUN_FEINBERG_2005 =
  "G. Craciun and M. Feinberg, Multiple equilibria in complex chemical reaction networks: I. The injectivity property, SIAM J. Appl. Math. 65 (2005) 1526–1546";
const FELIU_WIUF_2012 =
  "E. Feliu and C. Wiuf, Preclusion of switch behavior in networks with mass-action kinetics, Appl. Math. Comput. 219 (2012) 1449–1467";
const CONRADI_2017 =
  "C. Conradi, E. Feliu, M. Mincheva and C. Wiuf, Identifying parameter regions for multistationarity, PLoS Comput. Biol. 13 (2017) e1005751";
const ASSUMPTIONS = [
  "Mass-action kinetics.",
  "Positive concentrations only: steady states with a zero concentration are not counted.",
  "Steady states are counted within one stoichiometric compatibility class (fixed totals of the conservation laws).",
  "\"Multistationary\" means: for some positive rate constants and some totals there are two or more positive steady states; the rate values in the file are not used.",
  "\"Monostationary\" means: for every choice of positive rate constants and totals there is at most one positive steady state.",
];

/**
 * Can the network have two or more positive steady states in one stoichiometric compatibility
 * class for some positive rate constants? Criteria, in order:
 *  1. deficiency zero theorem (Feinberg 1987; Horn & Jackson 1972) and deficiency one theorem
 *     (Feinberg 1995), from the structure analysis — "monostationary" when they apply;
 *  2. injectivity: with W a basis of the conservation laws in reduced row echelon form, replace
 *     the ODE rows at W's pivots by W; if det of the Jacobian of that map, a polynomial in the
 *     concentrations and rate constants, is non-zero with all coefficients of one sign, the map is
 *     injective on every positive class for every rate constant (Craciun & Feinberg 2005; Feliu &
 *     Wiuf 2012) — "monostationary";
 *  3. the determinant criterion on the positive parametrisation of the steady states by the rate
 *     constants (steady-state equations are linear in them): at a positive point x* and rate constants
 *     κ making x* a steady state, sign det M(x*, κ) = (−1)^(s+1), s = rank N, forces further steady
 *     states in the class of x* (Conradi, Feliu, Mincheva & Wiuf 2017, Theorem 1). Seeded random
 *     rational x* and κ are tried; a candidate is accepted only when the exact engine
 *     (`analyseNetwork` with those rates and x* as the initial state) lists ≥ 2 positive steady
 *     states — that list is the witness, so "multistationary" never rests on the theorem's hypotheses.
 * Otherwise "undecided".
 * Example: 0 <-> X, 2X <-> 3X is multistationary, e.g. with k = (6, 11, 6, 1) and X = 1, 2, 3.
 */
export function multistationarity(network: Network, options: BudgetOptions & { attempts?: number } = {}): MultistationarityResult {
  const budget = new Budget({ timeoutMs: 30_000, ...options });
  const structure = analyseStructure(network);
  const base = { assumptions: ASSUMPTIONS };
  const d0 = structure.deficiencyZeroTheorem;
  if (d0.applies)
    return {
      ...base,
      verdict: "monostationary",
      method: "deficiency zero theorem",
      reason: `${d0.reason} ${d0.conclusions.join(" ")}`.trim(),
      sources: d0.sources,
    };
  const d1 = structure.deficiencyOneTheorem;
  if (d1.applies)
    return {
      ...base,
      verdict: "monostationary",
      method: "deficiency one theorem",
      reason: `${d1.reason} ${d1.conclusions.join(" ")}`.trim(),
      sources: d1.sources,
    };
  budget.progress("multistationarity", "injectivity: sign pattern of the determinant");
  // The symbolic determinant grows quickly with the number of species; past 12 it is not tried.
  const inj = network.species.length <= 12 ? injectivity(network, structure) : { injective: false, sign: "not computed", terms: 0 };
  if (inj.injective)
    return {
      ...base,
      verdict: "monostationary",
      method: "injectivity",
      reason: `The determinant of the Jacobian of the steady-state map with conservation rows (${inj.terms} terms) has every coefficient ${inj.sign}: the map is injective on each positive class for all positive rate constants, so no class holds two positive steady states.`,
      sources: [CRACIUN_FEINBERG_2005, FELIU_WIUF_2012],
    };
  budget.progress("multistationarity", "searching for a witness with the determinant criterion");
  const witness = searchWitness(network, structure, budget, options.attempts ?? 60);
  if (witness)
    return {
      ...base,
      verdict: "multistationary",
      method: "determinant criterion with an exact witness",
      reason: `At the rate constants and totals of the witness the exact steady-state computation finds ${witness.steadyStates.length} positive steady states in one class (candidate chosen where the sign of det M is (−1)^(s+1), s = ${structure.rank}).`,
      witness,
      sources: [CONRADI_2017],
    };
  return {
    ...base,
    verdict: "undecided",
    method: "none",
    reason: `No criterion applies: the deficiency theorems do not, the determinant ${inj.sign === "not computed" ? "was not computed (more than 12 species)" : "has coefficients of both signs (not injective)"}, and the seeded search found no rate constants with two positive steady states within its budget.`,
    sources: [CRACIUN_FEINBERG_2005, FELIU_WIUF_2012, CONRADI_2017],
  };
}

/** The rows of W (RREF basis of the conservation laws) with their pivot columns. */
function conservationRref(structure: NetworkStructure): { rows: Rational[][]; pivots: number[] } {
  const laws = structure.conservationLaws.map((l) => structure.species.map((s) => fromInt(l[s] ?? 0)));
  if (laws.length === 0) return { rows: [], pivots: [] };
  const r = rref(createMatrix(laws.length, structure.species.length, (i, j) => laws[i][j]));
  return { rows: r.matrix.entries.slice(0, r.pivots.length).map((row) => [...row]), pivots: [...r.pivots] };
}

/**
 * det M(x, κ) symbolically and its sign pattern. M is the Jacobian of the ODE right-hand sides
 * with the rows at W's pivots replaced by the rows of W (Feliu & Wiuf 2012).
 */
export function injectivity(network: Network, structure: NetworkStructure = analyseStructure(network)): { injective: boolean; sign: string; terms: number; determinant: QPoly } {
  const symbolic: Network = { ...network, reactions: network.reactions.map((r) => ({ ...r, rateValue: undefined })) };
  const kin = kineticsRing(symbolic, { speciesOrder: network.species });
  const ring = new PolynomialRing(kin.ring.vars, QQ, "grevlex");
  const odes = massActionOdes(symbolic, kin).map((p) => fromTerms(ring, terms(p)));
  const { rows, pivots } = conservationRref(structure);
  const n = network.species.length;
  const m: QPoly[][] = network.species.map((_, i) => {
    const w = pivots.indexOf(i);
    if (w >= 0) return rows[w].map((c) => ring.constant(c));
    return network.species.map((_, j) => partialDerivative(odes[i], j));
  });
  const det = determinant(m, n, ring);
  const pattern = signPattern(det);
  return { injective: pattern === "positive" || pattern === "negative", sign: pattern, terms: det.coeffs.length, determinant: det };
}

/** Laplace expansion along rows with memoised minors over column subsets (fine for the few species of a network). */
function determinant(m: QPoly[][], n: number, ring: PolynomialRing<Rational>): QPoly {
  const memo = new Map<number, QPoly>();
  const rec = (row: number, used: number): QPoly => {
    if (row === n) return ring.one();
    const hit = memo.get(used);
    if (hit) return hit;
    let acc = ring.zero();
    let sgn = 1;
    for (let j = 0; j < n; j++) {
      if (used & (1 << j)) continue;
      const e = m[row][j];
      if (e.coeffs.length > 0) {
        const t = mul(e, rec(row + 1, used | (1 << j)));
        acc = sgn > 0 ? add(acc, t) : sub(acc, t);
      }
      sgn = -sgn;
    }
    memo.set(used, acc);
    return acc;
  };
  return rec(0, 0);
}

/** Exact determinant of a rational matrix by Gaussian elimination. */
function rationalDeterminant(a: Rational[][]): Rational {
  const m = a.map((r) => [...r]);
  const n = m.length;
  let det = ONE;
  for (let c = 0; c < n; c++) {
    let p = c;
    while (p < n && isZero(m[p][c])) p++;
    if (p === n) return ZERO;
    if (p !== c) {
      [m[p], m[c]] = [m[c], m[p]];
      det = mulQ(det, fromInt(-1));
    }
    det = mulQ(det, m[c][c]);
    for (let r = c + 1; r < n; r++) {
      if (isZero(m[r][c])) continue;
      const f = divQ(m[r][c], m[c][c]);
      for (let k = c; k < n; k++) m[r][k] = subQ(m[r][k], mulQ(f, m[c][k]));
    }
  }
  return det;
}

const VALUES = [rational(1n, 10n), rational(1n, 4n), rational(1n, 2n), ONE, fromInt(2), fromInt(3), fromInt(5), fromInt(10)];
const fmtQ = (r: Rational) => (r.den === 1n ? `${r.num}` : `${r.num}/${r.den}`);

/**
 * Seeded search: random positive rational x*, the cone of rate constants κ ≥ 0 (one per rate
 * symbol) with f(x*, κ) = 0 from its extreme rays, random positive combinations κ with every entry
 * positive; where sign det M(x*, κ) = (−1)^(s+1) the engine is asked for every positive steady
 * state of x*'s class.
 */
function searchWitness(network: Network, structure: NetworkStructure, budget: Budget, attempts: number): MultistationarityWitness | null {
  const random = seededRandom(20170912);
  const pick = <T,>(xs: readonly T[]) => xs[Math.floor(random() * xs.length)];
  const species = network.species;
  const rateNames = [...rateTable(network).keys()];
  const { rows: W, pivots } = conservationRref(structure);
  const wantSign = structure.rank % 2 === 0 ? -1 : 1; // (−1)^(s+1)
  const n = species.length;
  for (let attempt = 0; attempt < attempts; attempt++) {
    if (Date.now() > budget.deadline) return null;
    const x = species.map(() => pick(VALUES));
    // A[i][r] = Σ over reactions with symbol r of (net change of species i) · x^reactant.
    const A: Rational[][] = species.map(() => rateNames.map(() => ZERO));
    const monomial = (c: Record<string, number>) => Object.entries(c).reduce((acc, [s, e]) => mulQ(acc, powQ(x[species.indexOf(s)], e)), ONE);
    for (const r of network.reactions) {
      const j = rateNames.indexOf(r.rate);
      const mono = monomial(r.reactant);
      for (let i = 0; i < n; i++) {
        const d = (r.product[species[i]] ?? 0) - (r.reactant[species[i]] ?? 0);
        if (d !== 0) A[i][j] = addQ(A[i][j], mulQ(fromInt(d), mono));
      }
    }
    let rays: bigint[][];
    try {
      rays = nonNegativeLeftKernelRays(createMatrix(rateNames.length, n, (r, i) => A[i][r]));
    } catch {
      continue;
    }
    if (rays.length === 0) continue;
    const cover = rateNames.map((_, j) => rays.some((ray) => ray[j] > 0n));
    if (!cover.every(Boolean)) continue; // no strictly positive κ makes x* a steady state
    for (let tries = 0; tries < 8; tries++) {
      const c = rays.map(() => BigInt(1 + Math.floor(random() * 9)));
      const kappa = rateNames.map((_, j) => fromInt(rays.reduce((acc, ray, r) => acc + ray[j] * c[r], 0n)));
      const jac = jacobianAt(network, rateNames, x, kappa);
      const M = jac.map((row, i) => (pivots.includes(i) ? W[pivots.indexOf(i)] : row));
      const det = rationalDeterminant(M);
      if (sign(det) !== wantSign) continue;
      const witness = verify(network, rateNames, kappa, x, structure, budget);
      if (witness) return witness;
    }
  }
  return null;
}

function powQ(a: Rational, e: number): Rational {
  let r = ONE;
  for (let i = 0; i < e; i++) r = mulQ(r, a);
  return r;
}

/** Exact Jacobian of the mass-action right-hand sides at x with rate constants κ. */
function jacobianAt(network: Network, rateNames: readonly string[], x: readonly Rational[], kappa: readonly Rational[]): Rational[][] {
  const species = network.species;
  const n = species.length;
  const J = species.map(() => species.map(() => ZERO));
  for (const r of network.reactions) {
    const k = kappa[rateNames.indexOf(r.rate)];
    for (let j = 0; j < n; j++) {
      const ej = r.reactant[species[j]] ?? 0;
      if (ej === 0) continue;
      // ∂/∂x_j of k·x^y = k·e_j·x^(y − e_j)
      let dm = mulQ(k, fromInt(ej));
      for (const [s, e] of Object.entries(r.reactant)) dm = mulQ(dm, powQ(x[species.indexOf(s)], s === species[j] ? e - 1 : e));
      for (let i = 0; i < n; i++) {
        const d = (r.product[species[i]] ?? 0) - (r.reactant[species[i]] ?? 0);
        if (d !== 0) J[i][j] = addQ(J[i][j], mulQ(fromInt(d), dm));
      }
    }
  }
  return J;
}

/** Runs the exact engine with these rates and x* as initial state; a witness when it lists ≥ 2 positive steady states. */
function verify(
  network: Network,
  rateNames: readonly string[],
  kappa: readonly Rational[],
  x: readonly Rational[],
  structure: NetworkStructure,
  budget: Budget,
): MultistationarityWitness | null {
  const value = new Map(rateNames.map((r, j) => [r, kappa[j]]));
  const numeric: Network = { ...network, reactions: network.reactions.map((r) => ({ ...r, rateValue: value.get(r.rate) })) };
  const initial = new Map(network.species.map((s, i) => [s, x[i]]));
  try {
    const left = budget.deadline - Date.now();
    if (left <= 0) return null;
    const r = analyseNetwork(numeric, { initial, skipFullBasis: true, deadline: budget.deadline, timeoutMs: Math.min(left, 20_000) });
    if (r.steadyStateSet !== "finite" || !r.steadyStates || r.steadyStates.length < 2) return null;
    const totals: Record<string, string> = {};
    structure.conservationLaws.forEach((law, i) => {
      totals[`T${i + 1}`] = fmtQ(network.species.reduce((acc, s, k) => addQ(acc, mulQ(fromInt(law[s] ?? 0), x[k])), ZERO));
    });
    return {
      rates: Object.fromEntries(rateNames.map((r, j) => [r, fmtQ(kappa[j])])),
      totals,
      initial: Object.fromEntries(network.species.map((s, i) => [s, fmtQ(x[i])])),
      steadyStates: r.steadyStates.map((s) => ({ ...s.concentrations })),
    };
  } catch (e) {
    if (isOutOfBudget(e)) return null;
    throw e;
  }
}
