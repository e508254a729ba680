/**
 * What the structure alone says a network can do, as typed facts for the verdict card: how many
 * positive steady states each compatibility class holds, whether several can coexist, and which
 * species are robust. Every fact holds under mass-action kinetics, for positive concentrations
 * and for every choice of positive rate constants (the structure knows no values); `open` means
 * the structure does not decide it and an analysis with given or generic constants must.
 *
 * Sources: deficiency zero theorem (Feinberg, Chem. Eng. Sci. 42, 1987; Horn & Jackson, Arch.
 * Rational Mech. Anal. 47, 1972); deficiency one theorem (Feinberg, Arch. Rational Mech. Anal.
 * 132, 1995); robustness from two non-terminal complexes (Shinar & Feinberg, "Structural sources
 * of robustness in biochemical reaction networks", Science 327, 2010, 1389–1391).
 *
 * Example: E + S <-> C -> E + P gives { count: "none", by: "deficiency-zero" }: δ = 0 and not
 * weakly reversible, so no positive steady state for any rate constants.
 */
import type { NetworkStructure } from "./structure";

export type StructuralCount = "exactly-one" | "at-most-one" | "none" | "open";
export type DecidedBy = "deficiency-zero" | "deficiency-one" | null;

export interface StructurallyRobust {
  readonly species: string;
  /** The two non-terminal complexes that differ in this species alone. */
  readonly complexes: readonly [string, string];
}

export interface StructuralCapabilities {
  readonly steadyStatesPerClass: { readonly count: StructuralCount; readonly by: DecidedBy };
  /** True when no class can hold two positive steady states, whatever the rate constants. */
  readonly multistationarityRuledOut: boolean;
  /** The single steady state of each class is locally asymptotically stable (deficiency zero, weakly reversible). */
  readonly stable: boolean;
  /**
   * Species with absolute concentration robustness by the Shinar–Feinberg criterion. The theorem
   * also asks that a positive steady state exist, which the structure alone does not settle here.
   */
  readonly robust: readonly StructurallyRobust[];
}

export function structuralCapabilities(s: NetworkStructure): StructuralCapabilities {
  const dz = s.deficiencyZeroTheorem.applies;
  const d1 = s.deficiencyOneTheorem.applies;
  const steadyStatesPerClass: StructuralCapabilities["steadyStatesPerClass"] = dz
    ? { count: s.weaklyReversible ? "exactly-one" : "none", by: "deficiency-zero" }
    : d1
      ? { count: s.weaklyReversible ? "exactly-one" : "at-most-one", by: "deficiency-one" }
      : { count: "open", by: null };
  return {
    steadyStatesPerClass,
    multistationarityRuledOut: dz || d1,
    stable: dz && s.weaklyReversible,
    robust: shinarFeinbergRobust(s),
  };
}

/**
 * Shinar & Feinberg (Science 2010), Theorem: a mass-action network of deficiency one that has a
 * positive steady state is robust in species S when two non-terminal complexes differ in S alone
 * (y − y′ has S as its only non-zero entry). Non-terminal: in no terminal strong linkage class.
 * Example: A + B -> 2B, B -> A has δ = 4 − 2 − 1 = 1 and non-terminal complexes A + B and B,
 * which differ in A alone: A takes the same value (k2/k1) at every positive steady state.
 */
export function shinarFeinbergRobust(s: NetworkStructure): StructurallyRobust[] {
  if (s.deficiency !== 1) return [];
  const terminal = new Set(s.terminalStrongLinkageClasses.flat());
  const nonTerminal = s.complexes.map((name, j) => ({ name, j })).filter((c) => !terminal.has(c.name));
  const found = new Map<string, StructurallyRobust>();
  for (let a = 0; a < nonTerminal.length; a++) {
    for (let b = a + 1; b < nonTerminal.length; b++) {
      const differing = s.species.filter((_, i) => s.complexComposition[i]![nonTerminal[a]!.j] !== s.complexComposition[i]![nonTerminal[b]!.j]);
      if (differing.length === 1 && !found.has(differing[0]!))
        found.set(differing[0]!, { species: differing[0]!, complexes: [nonTerminal[a]!.name, nonTerminal[b]!.name] });
    }
  }
  return s.species.filter((sp) => found.has(sp)).map((sp) => found.get(sp)!);
}
