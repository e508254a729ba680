import { analyseStructure, type Network } from "@domain/network/index";
import { defaultOrder } from "@domain/steady-state/index";

/**
 * The engine's suggested elimination order with its reason, exactly as analyseNetwork computes it
 * (it needs the conservation laws: one species per law is kept free). Structure only — exact
 * linear algebra on the stoichiometric matrix, no Gröbner bases — so the form may call it.
 */
export function suggestedOrder(network: Network): { order: string[]; reason: string } {
  return defaultOrder(network, analyseStructure(network).conservationLaws);
}
