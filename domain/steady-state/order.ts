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
 * linear algebra), then the others in order of appearance, and last — kept free — one species per
 * conservation law (its first species in order of appearance that is not non-interacting), so that
 * the free species are like the totals' natural coordinates (enzymes, unmodified substrate).
 * Example: E + S <-> C -> E + P with laws E + C and S + C + P gives [C, P, E, S].
 */
export function defaultOrder(network: Network, laws: readonly Record<string, number>[] = []): { order: string[]; reason: string } {
  const first = nonInteractingSpecies(network);
  const free: string[] = [];
  for (const law of laws) {
    const pick = network.species.find((s) => (law[s] ?? 0) !== 0 && !first.includes(s) && !free.includes(s));
    if (pick) free.push(pick);
  }
  free.sort((a, b) => network.species.indexOf(a) - network.species.indexOf(b));
  const middle = network.species.filter((s) => !first.includes(s) && !free.includes(s));
  const order = [...first, ...middle, ...free];
  const parts: string[] = [];
  if (first.length > 0)
    parts.push(`${first.join(", ")} never combine with another species, so they enter the steady-state equations linearly and are eliminated first by linear algebra (Feliu & Wiuf 2012)`);
  parts.push("the other species follow in order of appearance");
  if (free.length > 0) parts.push(`${free.join(", ")} come last to be kept free, one for each conservation law`);
  return { order, reason: parts.join("; ") };
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
