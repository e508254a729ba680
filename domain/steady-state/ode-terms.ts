import { terms, toNumber } from "../algebra/index";
import type { Network } from "../network/index";
import { kineticsRing, massActionOdes } from "./kinetics";

/** One term of a mass-action right-hand side: coefficient · rate · Π factor^power. */
export interface OdeTerm {
  /** Integer coefficient (net stoichiometry, merged), never 0. */
  readonly coefficient: number;
  readonly rate: string;
  /** Species with their exponents, in the network's species order, then the constant species. */
  readonly factors: readonly { readonly species: string; readonly power: number; readonly constant?: true }[];
}

export interface SpeciesOde {
  readonly species: string;
  readonly terms: readonly OdeTerm[];
}

/**
 * The mass-action ODEs as typed terms for display (text, TeX): the exact polynomials of
 * `massActionOdes` with every rate constant and every constant species kept symbolic, read back
 * term by term. Terms come in the order of the first reaction that contributes them (the order a
 * reader of the file expects), not in the ring's monomial order.
 * Example: E + S <-> C (k1, k2), C -> E + P (k3) gives for S the terms −1·k1·E·S and +1·k2·C.
 */
export function massActionTerms(network: Network): SpeciesOde[] {
  const kin = kineticsRing(network, { substituteRates: false });
  const { ring } = kin;
  const rates = new Set(network.reactions.map((r) => r.rate));
  const held = (network.constants ?? []).map((c) => c.name);
  const speciesIndex = kin.species.map((s) => ring.indexOf(s));
  const heldIndex = held.map((s) => ring.indexOf(s));
  // Each reaction's monomial (rate · reactant · held species), to order the terms by first use.
  const firstUse = new Map<string, number>();
  network.reactions.forEach((r, j) => {
    const exps = new Array<number>(ring.n).fill(0);
    for (const [s, c] of Object.entries(r.reactant)) exps[ring.indexOf(s)] = c;
    exps[ring.indexOf(r.rate)] += 1;
    for (const [s, c] of Object.entries(r.held ?? {})) exps[ring.indexOf(s)] += c;
    const key = exps.join(",");
    if (!firstUse.has(key)) firstUse.set(key, j);
  });
  return massActionOdes(network, kin).map((p, i) => ({
    species: kin.species[i]!,
    terms: terms(p)
      .map((t) => {
        const rate = ring.vars.find((v, k) => t.exponents[k] === 1 && rates.has(v));
        if (rate === undefined) throw new Error(`mass-action term without a rate constant in d${kin.species[i]}/dt`);
        const factors: { species: string; power: number; constant?: true }[] = [];
        kin.species.forEach((s, k) => {
          const power = t.exponents[speciesIndex[k]!]!;
          if (power !== 0) factors.push({ species: s, power });
        });
        held.forEach((s, k) => {
          const power = t.exponents[heldIndex[k]!]!;
          if (power !== 0) factors.push({ species: s, power, constant: true });
        });
        return { term: { coefficient: toNumber(t.coeff), rate, factors }, first: firstUse.get([...t.exponents].join(",")) ?? Infinity };
      })
      .sort((a, b) => a.first - b.first)
      .map((x) => x.term),
  }));
}
