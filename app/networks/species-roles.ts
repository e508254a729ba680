import type { NetworkStructure } from "@domain/network/index";

export interface SpeciesRoles {
  species: string;
  /** Reactions whose net change of the species is positive (column of N > 0). */
  madeBy: string[];
  /** Reactions with the species in their reactant complex: its concentration is in their rate. */
  usedBy: string[];
}

/**
 * Which reactions make and which use each species, for the species table. "Used by" is read from
 * the reactant complexes (Y and the incidence matrix), not from the net change N = Y·I, so a species
 * on both sides still counts: in `2X + Y -> 3X` the net change of X is +1, yet X is a reactant.
 * Example: for `2X + Y -> 3X` (reaction r1), X is made by [r1] and used by [r1]; Y is used by [r1].
 */
export function speciesRoles(
  structure: Pick<NetworkStructure, "species" | "reactionList" | "stoichiometricMatrix" | "complexComposition" | "incidenceMatrix">,
): SpeciesRoles[] {
  const { species, reactionList, stoichiometricMatrix: n, complexComposition: y, incidenceMatrix: inc } = structure;
  return species.map((sp, i) => ({
    species: sp,
    madeBy: reactionList.filter((_, j) => n[i]![j]! > 0).map((r) => r.id),
    usedBy: reactionList.filter((_, j) => inc.some((row, c) => row[j] === -1 && y[i]![c]! > 0)).map((r) => r.id),
  }));
}
