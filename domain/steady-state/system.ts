import { fromTerms, sub } from "../algebra/index";
import type { Rational } from "../algebra/index";
import { ZERO, add as addQ, fromInt, mul as mulQ } from "../algebra/rational";
import { createMatrix } from "../linear/matrix";
import { rref } from "../linear/rref";
import type { Network } from "../network/index";
import { type KineticsRing, type QPoly, massActionOdes } from "./kinetics";

/**
 * The steady-state system: the ODE rows of a maximal independent set of rows of N, plus one
 * equation Σ wₛ·xₛ − T = 0 per conservation law w (T a total symbol or a number). Dropping exactly
 * as many rows as there are independent conservation laws keeps the system square and of full
 * rank (Feinberg, "Foundations of Chemical Reaction Network Theory", Springer 2019, §3.4; common practice).
 */
export interface SteadyStateSystem {
  readonly kin: KineticsRing;
  /** dxₛ/dt for every species, aligned with kin.species. */
  readonly odes: readonly QPoly[];
  /** Indices into kin.species of the ODE rows kept (linearly independent rows of N). */
  readonly keptRows: readonly number[];
  /** Conservation laws as integer vectors aligned with kin.species. */
  readonly conservationLaws: readonly (readonly bigint[])[];
  /** The conservation equations Σ w·x − T (empty when totals are not requested). */
  readonly conservationEquations: readonly QPoly[];
  /** Kept ODE rows then conservation equations. */
  readonly equations: readonly QPoly[];
}

/** Stoichiometric matrix with rows in the order `species`. Example: A -> B gives [[-1], [1]] for [A, B]. */
export function stoichiometricRows(network: Network, species: readonly string[]): number[][] {
  return species.map((s) => network.reactions.map((r) => (r.product[s] ?? 0) - (r.reactant[s] ?? 0)));
}

/**
 * Indices of a maximal set of linearly independent rows of N, taken greedily in the given species
 * order (species early in the elimination order keep their ODE; the last ones give way to conservation laws).
 * Example: for A <-> B the rows are dependent and [0] (A's row) is kept.
 */
export function independentRows(n: readonly (readonly number[])[]): number[] {
  if (n.length === 0) return [];
  const cols = n[0].length;
  const t = createMatrix(cols, n.length, (i, j) => fromInt(n[j][i]));
  return [...rref(t).pivots];
}

/**
 * Builds the steady-state system. `laws` are aligned with `network.species` (as the structure
 * analysis reports them); `totals` are numbers (from initial concentrations) or, when null, the
 * ring's total symbols. Example: E + S <-> C -> E + P (species E, S, C, P) keeps the ODE rows of E and S
 * and adds E + C − T1 and S + C + P − T2.
 */
export function steadyStateSystem(
  network: Network,
  kin: KineticsRing,
  laws: readonly (readonly bigint[])[],
  totals: readonly Rational[] | null,
): SteadyStateSystem {
  const { ring } = kin;
  const odes = massActionOdes(network, kin);
  const keptRows = independentRows(stoichiometricRows(network, kin.species));
  const position = kin.species.map((s) => network.species.indexOf(s));
  const aligned = laws.map((w) => position.map((p) => w[p]));
  const conservationEquations: QPoly[] = [];
  const useTotals = totals !== null || kin.totals.length === laws.length;
  if (useTotals)
    aligned.forEach((w, j) => {
      const terms = w.flatMap((c, i) => {
        if (c === 0n) return [];
        const exponents = new Array<number>(ring.n).fill(0);
        exponents[i] = 1;
        return [{ coeff: fromInt(c), exponents }];
      });
      const left = fromTerms(ring, terms);
      const right = totals ? ring.constant(totals[j]) : ring.variable(kin.totals[j]);
      conservationEquations.push(sub(left, right));
    });
  return {
    kin,
    odes,
    keptRows,
    conservationLaws: aligned,
    conservationEquations,
    equations: [...keptRows.map((i) => odes[i]), ...conservationEquations],
  };
}

/**
 * Totals Σ wₛ·xₛ(0) of each conservation law (aligned with `species`) from initial concentrations.
 * Example: law E + C with E(0) = 1/10, C(0) = 0 gives 1/10.
 */
export function totalsFromInitial(
  laws: readonly (readonly bigint[])[],
  species: readonly string[],
  initial: ReadonlyMap<string, Rational>,
): Rational[] {
  return laws.map((w) => w.reduce((acc, c, i) => addQ(acc, mulQ(fromInt(c), initial.get(species[i]) ?? ZERO)), ZERO));
}
