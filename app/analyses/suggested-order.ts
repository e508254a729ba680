import { analyseStructure, type Network, type NetworkStructure } from "@domain/network/index";
import { defaultOrder } from "@domain/steady-state/index";

/**
 * The engine's suggested elimination order with its reason, exactly as analyseNetwork computes it
 * (it needs the conservation laws: one species per law is kept free). The web server passes the
 * laws of the structure the worker stored (structure-store.server.ts) and so does no algebra; the
 * worker may let it compute them.
 */
export function suggestedOrder(
  network: Network,
  conservationLaws: NetworkStructure["conservationLaws"] = analyseStructure(network).conservationLaws,
): { order: string[]; reason: string } {
  return defaultOrder(network, conservationLaws);
}
