import { formatRational } from "../../../../domain/algebra/rational";
import { formatComplex, type Network } from "../../../../domain/network/index";

/**
 * What "the same network" means in the round-trip tests: the set of species and the directed
 * reactions in order (reactant, product, rate symbol, rate value). Labels are names for people
 * and are compared separately where a test needs them.
 */
export function networkSignature(n: Network): { species: string[]; reactions: string[] } {
  return {
    species: [...n.species].sort(),
    reactions: n.reactions.map(
      (r) => `${formatComplex(r.reactant)} -> ${formatComplex(r.product)} @${r.rate}=${r.rateValue ? formatRational(r.rateValue) : "?"}`,
    ),
  };
}
