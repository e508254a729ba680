import { fromInt, toNumber } from "../algebra/rational";
import { createMatrix, multiply, type Matrix } from "../linear/matrix";
import { formatComplex, type Complex } from "./complex";
import type { Network } from "./model";
import { splitComplex } from "./constant-species";

/**
 * The network's complexes in order of first appearance (rows top to bottom, each row's left side
 * before its right side), formed from the species that are not held constant.
 * Example: `E + S <-> C`, `C -> E + P` gives [E + S, C, E + P]; `A + 2X <-> 3X` with A constant gives [2X, 3X].
 */
export function complexesOf(network: Network): Complex[] {
  const constant = new Set((network.constants ?? []).map((c) => c.name));
  const seen = new Map<string, Complex>();
  const note = (c: Complex) => {
    const key = formatComplex(c);
    if (!seen.has(key)) seen.set(key, c);
  };
  for (const r of network.rows) {
    note(splitComplex(r.left, constant)[0]);
    note(splitComplex(r.right, constant)[0]);
  }
  for (const r of network.reactions) {
    note(r.reactant);
    note(r.product);
  }
  return [...seen.values()];
}

/** Index of each complex's canonical text in `complexes`. Example: [E + S, C] → { "E + S" → 0, "C" → 1 }. */
export const complexIndex = (complexes: readonly Complex[]): Map<string, number> =>
  new Map(complexes.map((c, i) => [formatComplex(c), i]));

/**
 * Complex composition matrix Y (species × complexes): Y[s][c] is the coefficient of species s in
 * complex c (Horn & Jackson, Arch. Rational Mech. Anal. 47 (1972), §2).
 * Example: species [E, S, C], complexes [E + S, C] give Y = [[1, 0], [1, 0], [0, 1]].
 */
export function complexCompositionMatrix(species: readonly string[], complexes: readonly Complex[]): Matrix {
  return createMatrix(species.length, complexes.length, (i, j) => fromInt(complexes[j][species[i]] ?? 0));
}

/**
 * Incidence matrix I (complexes × reactions) of the reaction graph: −1 at the reactant complex and
 * +1 at the product complex of each directed reaction (Feinberg, Chem. Eng. Sci. 42 (1987)).
 * Example: complexes [A, B] and the reaction A → B give I = [[-1], [1]].
 */
export function incidenceMatrix(network: Network, complexes: readonly Complex[]): Matrix {
  const index = complexIndex(complexes);
  const from = network.reactions.map((r) => index.get(formatComplex(r.reactant))!);
  const to = network.reactions.map((r) => index.get(formatComplex(r.product))!);
  return createMatrix(complexes.length, network.reactions.length, (i, j) =>
    fromInt(i === from[j] ? -1 : i === to[j] ? 1 : 0),
  );
}

/**
 * Stoichiometric matrix N = Y·I (species × directed reactions, in reaction order): column j is
 * product − reactant of reaction j. Example: `2A -> B` gives the column (−2, 1) for species [A, B].
 */
export function stoichiometricMatrix(network: Network): Matrix {
  const complexes = complexesOf(network);
  return multiply(complexCompositionMatrix(network.species, complexes), incidenceMatrix(network, complexes));
}

/** Integer matrix as plain numbers for JSON (entries here are small integers). Example: [[-1/1]] → [[-1]]. */
export const toIntegerRows = (m: Matrix): number[][] => m.entries.map((r) => r.map(toNumber));
