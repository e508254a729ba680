import { QQ } from "../algebra/index";
import type { Polynomial } from "../algebra/index";
import { add, fromTerms, zeroPoly } from "../algebra/index";
import type { Rational } from "../algebra/index";
import { ONE, fromInt, mul as mulQ } from "../algebra/rational";
import { PolynomialRing } from "../algebra/index";
import type { Network } from "../network/index";

export type QPoly = Polynomial<Rational>;
export type QRing = PolynomialRing<Rational>;

/**
 * The polynomial ring of a network's kinetics: species first (in the elimination order, highest
 * first), then the symbolic parameters (rate constants without a value, then totals) in a lower
 * block. The order is the block order lex(species), grevlex(parameters): lex on species gives the
 * triangular structure, and parameters below every species make the basis valid for generic
 * parameter values (Cox, Little & O'Shea, "Ideals, Varieties, and Algorithms", 4th ed. 2015,
 * ch. 3 §1 elimination orders; ch. 6 §3 on specialisation).
 */
export interface KineticsRing {
  readonly ring: QRing;
  /** Species in ring order (elimination order). */
  readonly species: readonly string[];
  /**
   * Rate symbols kept symbolic, in first-use order, then the constant species without a value
   * (a symbolic concentration behaves like a rate parameter).
   */
  readonly rateParameters: readonly string[];
  /** Total symbols (one per conservation law), possibly empty. */
  readonly totals: readonly string[];
  /** Values substituted for rate symbols and for constant species with a given concentration. */
  readonly rateValues: ReadonlyMap<string, Rational>;
}

export interface KineticsRingOptions {
  /** Species order, highest (eliminated first) to lowest (kept free); default the network's order. */
  speciesOrder?: readonly string[];
  /** Substitute the rate values the file gives (default true). */
  substituteRates?: boolean;
  /** How many total symbols to add (default 0). */
  totalCount?: number;
}

/** The rate symbols of the network with the value given anywhere in the file. */
export function rateTable(network: Network): Map<string, Rational | undefined> {
  const table = new Map<string, Rational | undefined>();
  for (const r of network.reactions) table.set(r.rate, table.get(r.rate) ?? r.rateValue);
  return table;
}

/**
 * Builds the ring. Example: for `E + S <-> C`, `C -> E + P` with symbolic k1, k2, k3 the ring is
 * Q[E, S, C, P, k1, k2, k3] with order lex(4), grevlex(3).
 */
export function kineticsRing(network: Network, options: KineticsRingOptions = {}): KineticsRing {
  const species = [...(options.speciesOrder ?? network.species)];
  const substitute = options.substituteRates ?? true;
  const rateValues = new Map<string, Rational>();
  const rateParameters: string[] = [];
  for (const [name, value] of rateTable(network)) {
    if (substitute && value) rateValues.set(name, value);
    else rateParameters.push(name);
  }
  const constants = network.constants ?? [];
  for (const c of constants) {
    if (substitute && c.value) rateValues.set(c.name, c.value);
    else rateParameters.push(c.name);
  }
  const taken = new Set([...species, ...rateTable(network).keys(), ...constants.map((c) => c.name)]);
  const totals: string[] = [];
  for (let i = 1; i <= (options.totalCount ?? 0); i++) {
    let name = `T${i}`;
    while (taken.has(name)) name = `_${name}`;
    taken.add(name);
    totals.push(name);
  }
  const params = [...rateParameters, ...totals];
  const order = params.length === 0 ? "lex" : `lex(${species.length}), grevlex(${params.length})`;
  const ring = new PolynomialRing([...species, ...params], QQ, order);
  return { ring, species, rateParameters, totals, rateValues };
}

/**
 * Mass-action right-hand sides dx_s/dt = Σ_reactions k·x^y(reactant)·(y_s(product) − y_s(reactant)),
 * one polynomial per species of `kin.species` (Horn & Jackson, Arch. Rational Mech. Anal. 47, 1972, eq. 2.5).
 * A constant species of the reactant multiplies k by its concentration (its value, or its symbol).
 * Example: E + S <-> C (k1, k2), C -> E + P (k3) gives dS/dt = −k1·E·S + k2·C; with A constant
 * at 2, A + 2X -> 3X (k1) gives dX/dt = 2·k1·X².
 */
export function massActionOdes(network: Network, kin: KineticsRing): QPoly[] {
  const { ring } = kin;
  const out = kin.species.map(() => zeroPoly(ring));
  const index = new Map(kin.species.map((s, i) => [s, i]));
  for (const r of network.reactions) {
    const exps = new Array<number>(ring.n).fill(0);
    for (const [s, c] of Object.entries(r.reactant)) exps[index.get(s)!] = c;
    const value = kin.rateValues.get(r.rate);
    if (!value) exps[ring.indexOf(r.rate)] += 1;
    let coefficient = value ?? ONE;
    for (const [s, c] of Object.entries(r.held ?? {})) {
      const held = kin.rateValues.get(s);
      if (held) for (let i = 0; i < c; i++) coefficient = mulQ(coefficient, held);
      else exps[ring.indexOf(s)] += c;
    }
    const change = new Map<string, number>();
    for (const [s, c] of Object.entries(r.product)) change.set(s, (change.get(s) ?? 0) + c);
    for (const [s, c] of Object.entries(r.reactant)) change.set(s, (change.get(s) ?? 0) - c);
    for (const [s, d] of change) {
      if (d === 0) continue;
      const i = index.get(s)!;
      out[i] = add(out[i], fromTerms(ring, [{ coeff: mulQ(fromInt(d), coefficient), exponents: exps }]));
    }
  }
  return out;
}
