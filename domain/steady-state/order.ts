import type { Network } from "../network/index";

export class SteadyStateInputError extends Error {
  override name = "SteadyStateInputError";
}

/**
 * Species that never meet another species in a complex and occur with coefficient 1 — the
 * "non-interacting" species of Feliu & Wiuf (SIAM J. Appl. Math. 72, 2012, §3), such as
 * enzyme–substrate intermediates. They enter the steady-state equations linearly.
 * Example: in E + S <-> C -> E + P only C is non-interacting.
 */
export function nonInteractingSpecies(network: Network): string[] {
  const bad = new Set<string>();
  for (const r of network.reactions)
    for (const c of [r.reactant, r.product]) {
      const names = Object.keys(c);
      if (names.length > 1 || names.some((s) => c[s] !== 1)) names.forEach((s) => bad.add(s));
    }
  return network.species.filter((s) => !bad.has(s));
}

/**
 * The default elimination order with its reason: non-interacting species first (eliminated by
 * linear algebra), then the others in their order of appearance (the last ones kept free).
 * Example: E + S <-> C -> E + P gives [C, E, S, P].
 */
export function defaultOrder(network: Network): { order: string[]; reason: string } {
  const first = nonInteractingSpecies(network);
  const order = [...first, ...network.species.filter((s) => !first.includes(s))];
  const reason =
    first.length > 0
      ? `${first.join(", ")} never combine with another species, so they enter the steady-state equations linearly and are eliminated first by linear algebra (Feliu & Wiuf 2012); the remaining species follow in order of appearance, the last ones kept free`
      : "species in order of appearance; the last ones are kept free";
  return { order, reason };
}

/**
 * Resolves a user order: listed species first, in the given order; unlisted species follow in the
 * default order. Unknown or repeated names are errors.
 * Example: resolveOrder(["S"], ["C", "E", "S", "P"]) is ["S", "C", "E", "P"].
 */
export function resolveOrder(user: readonly string[], fallback: readonly string[]): string[] {
  const seen = new Set<string>();
  for (const s of user) {
    if (!fallback.includes(s)) throw new SteadyStateInputError(`--order: '${s}' is not a species of the network (species: ${fallback.join(", ")})`);
    if (seen.has(s)) throw new SteadyStateInputError(`--order: '${s}' is listed twice`);
    seen.add(s);
  }
  return [...user, ...fallback.filter((s) => !seen.has(s))];
}
