import type { Rational } from "../algebra/rational";
import type { Complex } from "./complex";

export type Arrow = "->" | "<-" | "<->";

/** One data row of the file, as written (rate names resolved, defaults filled in). */
export interface NetworkRow {
  /** 1-based line number in the source file. */
  readonly line: number;
  readonly label?: string;
  /** Left-hand side as written. */
  readonly left: Complex;
  readonly arrow: Arrow;
  /** Right-hand side as written. */
  readonly right: Complex;
  /** Rate symbol of the direction the arrow shows (for `<->`, left to right). */
  readonly rate: string;
  /** Rate symbol of right to left, only for `<->`. */
  readonly reverseRate?: string;
  /** Values as written on this row (a symbol's value may come from another row). */
  readonly rateValue?: Rational;
  readonly reverseRateValue?: Rational;
}

/** One directed reaction `reactant → product`; a `<->` row gives two. */
export interface DirectedReaction {
  /** `r1`, `r2`, … in order. */
  readonly id: string;
  readonly label?: string;
  readonly reactant: Complex;
  readonly product: Complex;
  /** Rate-constant symbol. */
  readonly rate: string;
  /** Its value when any row gives one. */
  readonly rateValue?: Rational;
  /** 1-based line number of the source row. */
  readonly row: number;
  /** Whether this is the row's written direction or the reverse half of a `<->` row. */
  readonly direction: "forward" | "reverse";
  /**
   * The constant species of the reactant as written (e.g. { A: 1 } for `A + 2X -> 3X` with A held
   * constant): their concentrations multiply the rate constant. `reactant` and `product` hold only
   * the other species. Absent when the reactant has no constant species.
   */
  readonly held?: Complex;
}

/**
 * A species held at a fixed concentration (a feed, a chemostatted cofactor), declared on a
 * `# constant: A = 2, ATP` line of the file. It is not a variable of the network: it leaves the
 * species list, the complexes and the stoichiometric matrix, and its concentration multiplies the
 * rate constant of each reaction that consumes it.
 */
export interface ConstantSpecies {
  readonly name: string;
  /** The given concentration; absent means symbolic (a parameter named like the species). */
  readonly value?: Rational;
  /** 1-based line of the declaration. */
  readonly line: number;
}

/**
 * A species' initial concentration stored with the version, declared on a `# initial: X = 1`
 * line. The default starting point of analyses and time courses; the structure does not use it.
 */
export interface InitialValue {
  readonly name: string;
  /** ≥ 0, exact. */
  readonly value: Rational;
  /** 1-based line of the declaration. */
  readonly line: number;
}

export interface Network {
  /**
   * In order of first appearance in the file (left to right, top to bottom), without the
   * constant species.
   */
  readonly species: readonly string[];
  readonly reactions: readonly DirectedReaction[];
  /** Rows as written: their complexes still contain the constant species. */
  readonly rows: readonly NetworkRow[];
  /** Species held constant, in declaration order; absent or empty when none. */
  readonly constants?: readonly ConstantSpecies[];
  /** Initial concentrations of (non-constant) species, in declaration order; absent or empty when none. */
  readonly initial?: readonly InitialValue[];
}
