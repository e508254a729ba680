import { formatRational } from "../../../../domain/algebra/rational";
import { formatComplex, type Network } from "../../../../domain/network/index";

/**
 * What "the same network" means in the round-trip tests: the set of species and the directed
 * reactions in order (reactant, product, held part, rate symbol, rate value), the constant species
 * with their held values and the stored initial values. Labels are names for people
 * and are compared separately where a test needs them.
 */
export function networkSignature(n: Network): { species: string[]; reactions: string[]; constants: string[]; initial: string[] } {
  return {
    species: [...n.species].sort(),
    reactions: n.reactions.map(
      (r) =>
        `${formatComplex(r.reactant)} -> ${formatComplex(r.product)}${r.held ? ` held ${formatComplex(r.held)}` : ""} @${r.rate}=${r.rateValue ? formatRational(r.rateValue) : "?"}`,
    ),
    constants: (n.constants ?? []).map((c) => `${c.name}=${c.value ? formatRational(c.value) : "symbolic"}`).sort(),
    initial: (n.initial ?? []).map((i) => `${i.name}=${formatRational(i.value)}`).sort(),
  };
}
