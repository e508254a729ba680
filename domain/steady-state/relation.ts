import { divide } from "../algebra/index";
import { QQ } from "../algebra/index";
import { groebnerBasis, type GroebnerOptions } from "../algebra/index";
import { fromTerms, mul, sub, substitute, terms } from "../algebra/index";
import { PolynomialRing } from "../algebra/index";
import type { Rational } from "../algebra/index";
import { fromInt } from "../algebra/rational";
import { mapToRing, monomialOf, saturate } from "./ideal";
import { analyseStructure, type Network } from "../network/index";
import { kineticsRing, rateTable, type KineticsRing, type QPoly } from "./kinetics";
import { variablesOf, isNonZeroConstant } from "../algebra/poly-tools";
import { steadyStateSystem, totalsFromInitial } from "./system";

export interface RelationResult {
  readonly expression: string;
  /** The expression lies in the saturated steady-state ideal (remainder zero). */
  readonly inIdeal: boolean;
  /** It vanishes on every (complex) point of the saturated variety: radical membership. */
  readonly vanishes: boolean;
  /** Normal form modulo the saturated ideal's Gröbner basis ("0" when in the ideal). */
  readonly remainder: string;
}

/** Totals of the conservation laws for a relation that names them (T1, T2, … as the analysis names them). */
export interface RelationTotals {
  /** Names of the totals, one per law. */
  readonly names: readonly string[];
  /** Conservation laws as integer vectors aligned with kin.species. */
  readonly laws: readonly (readonly bigint[])[];
  /** Numeric totals (from initial concentrations), or null: the totals stay symbolic. */
  readonly values: readonly Rational[] | null;
}

/**
 * Relation test: does an expression in species and rate constants vanish at every positive steady
 * state? The steady-state ideal is saturated by the product of the species and of the rate symbols
 * (both positive), then ideal membership by the remainder of division by its Gröbner basis, and
 * radical membership by the Rabinowitsch trick: g ∈ √I ⇔ 1 ∈ I + ⟨1 − y·g⟩ (Cox, Little & O'Shea,
 * "Ideals, Varieties, and Algorithms", 4th ed. 2015, ch. 4 §2, Proposition 8). Membership does not
 * depend on the order, so grevlex (fast) is used.
 * Rate constants may appear in the expression in every run: symbolic ones stay symbols, ones with a
 * value are replaced by it. Totals (`totals.names`) may appear too: with numeric totals they are
 * replaced by their values; in both cases, when the expression names a total, the conservation equations
 * Σ w·x − T join the ideal (the question is then about one class), and symbolic totals are saturated like
 * the rate symbols (positive). An expression without totals is tested at every positive steady state.
 * Example: for A + B -> 2B (k1), B -> A (k2), the relation k1*A − k2 is in the ideal; with k1 = 2
 * and k2 = 3 given, "k1*A - k2" is tested as 2*A − 3.
 */
export function testRelation(text: string, kin: KineticsRing, odeRows: readonly QPoly[], options: GroebnerOptions, totals?: RelationTotals): RelationResult {
  const symbolicTotals = totals && !totals.values ? totals.names.filter((t) => kin.ring.indexOf(t) < 0) : [];
  const ring = new PolynomialRing([...kin.ring.vars, ...symbolicTotals], QQ, "grevlex");
  // Parse in a ring that also knows the named constants with values, then substitute them.
  const valued = [...kin.rateValues.keys()].filter((k) => ring.indexOf(k) < 0);
  const numericTotals = totals?.values ? totals.names.filter((t) => ring.indexOf(t) < 0) : [];
  const wide = new PolynomialRing([...ring.vars, ...valued, ...numericTotals], QQ, "grevlex");
  const values = new Map<number, Rational>();
  valued.forEach((k) => values.set(wide.indexOf(k), kin.rateValues.get(k)!));
  numericTotals.forEach((t) => values.set(wide.indexOf(t), totals!.values![totals!.names.indexOf(t)]));
  const parsed = wide.parse(text);
  // Only a relation that names a total is a question about one class; others keep every positive steady state.
  const namesTotal = (totals?.names ?? []).some((t) => wide.indexOf(t) >= 0 && variablesOf(parsed).has(wide.indexOf(t)));
  const g = mapToRing(values.size > 0 ? substitute(parsed, values) : parsed, ring);
  const params = [...kin.rateParameters, ...symbolicTotals].map((p) => ring.indexOf(p));
  const saturator = monomialOf(ring, [...kin.species.map((_, i) => i), ...params]);
  const equations = odeRows.map((p) => mapToRing(p, ring));
  // Totals named or given: the class is part of the question, so its conservation equations join the ideal.
  if (totals && namesTotal)
    totals.laws.forEach((w, j) => {
      const lhs = fromTerms(
        ring,
        w.flatMap((c, i) => (c === 0n ? [] : [{ coeff: fromInt(c), exponents: ring.vars.map((_, k) => (k === i ? 1 : 0)) }])),
      );
      const name = totals.names[j];
      equations.push(sub(lhs, totals.values ? ring.constant(totals.values[j]) : ring.indexOf(name) >= 0 ? ring.variable(name) : ring.zero()));
    });
  const basis = saturate(equations, saturator, options);
  const remainder = basis.length > 0 ? divide(g, basis).remainder : g;
  const inIdeal = remainder.coeffs.length === 0;
  let vanishes = inIdeal;
  if (!inIdeal) {
    let y = "_y";
    while (ring.indexOf(y) >= 0) y = `_${y}`;
    const big = new PolynomialRing([...ring.vars, y], QQ, "grevlex");
    const lift = (p: QPoly) => fromTerms(big, terms(p).map((t) => ({ coeff: t.coeff, exponents: [...t.exponents, 0] })));
    const probe = groebnerBasis([...basis.map(lift), sub(big.one(), mul(big.variable(y), lift(g)))], options);
    vanishes = probe.length === 1 && isNonZeroConstant(probe[0]);
  }
  return { expression: ring.format(g), inIdeal, vanishes, remainder: ring.format(remainder) };
}

/**
 * The relation test straight from a network (what the worker's relation job runs): the kept ODE
 * rows in the given order, and the totals T1, T2, … of the structure's conservation laws — numeric
 * from `initial` when given, else symbolic.
 * Example: for A <-> B (k1 = 1, k2 = 3) with initial A = 4, "A - 3" is in the ideal.
 */
export function testRelationOnNetwork(
  network: Network,
  text: string,
  options: GroebnerOptions & { order?: readonly string[]; initial?: ReadonlyMap<string, Rational> } = {},
): RelationResult {
  const laws = analyseStructure(network).conservationLaws.map((law) => network.species.map((s) => BigInt(law[s] ?? 0)));
  const order = options.order ?? network.species;
  const kin = kineticsRing(network, { speciesOrder: order });
  const sys = steadyStateSystem(network, kin, laws, null);
  const taken = new Set([...network.species, ...rateTable(network).keys()]);
  const names = laws.map((_, i) => {
    let n = `T${i + 1}`;
    while (taken.has(n)) n = `_${n}`;
    return n;
  });
  const aligned = sys.conservationLaws;
  const values = options.initial ? totalsFromInitial(laws, network.species, options.initial) : null;
  return testRelation(text, kin, sys.keptRows.map((i) => sys.odes[i]), options, laws.length > 0 ? { names, laws: aligned, values } : undefined);
}
