import type { Network } from "../network/index";

/**
 * What was wrong with an input of an analysis or a scan, as data: the domain names the input and
 * the problem, and each edge words it for its own users (the CLI names its options, the web its
 * form fields; see `inputProblemText` for wording that names neither).
 */
export type SteadyStateInputProblem =
  | { readonly kind: "unknown-species"; readonly input: "order" | "initial"; readonly name: string; readonly species: readonly string[] }
  | { readonly kind: "listed-twice"; readonly input: "order"; readonly name: string }
  | { readonly kind: "relation-syntax"; readonly relation: string; readonly detail: string }
  | { readonly kind: "scan-range"; readonly problem: "from-not-below-to" | "from-negative" }
  | { readonly kind: "scan-parameter"; readonly name: string; readonly rates: readonly string[]; readonly totals: readonly string[] }
  | { readonly kind: "scan-rates-missing"; readonly missing: readonly string[] }
  | { readonly kind: "scan-totals-needed"; readonly totals: readonly string[] }
  | { readonly kind: "scan-continuum"; readonly name: string; readonly at: string | null };

/** The inputs a problem can be about, as the edges name them (an option, a form field). */
export type InputName = "order" | "initial" | "from" | "to" | "vary";

/**
 * A problem in words, with `name` wording each input (the CLI passes `--initial`, the web page
 * "initial concentrations"). Example: an unknown species Z in the order reads
 * `<order>: 'Z' is not a species of the network (species: E, S)`.
 */
export function inputProblemText(p: SteadyStateInputProblem, name: (input: InputName) => string): string {
  switch (p.kind) {
    case "unknown-species":
      return `${name(p.input)}: '${p.name}' is not a species of the network (species: ${p.species.join(", ")})`;
    case "listed-twice":
      return `${name(p.input)}: '${p.name}' is listed twice`;
    case "relation-syntax":
      return `relation '${p.relation}': ${p.detail}`;
    case "scan-range":
      return p.problem === "from-not-below-to"
        ? `${name("from")} must be below ${name("to")}`
        : `${name("from")} must not be negative (rate constants, totals and concentrations are positive)`;
    case "scan-parameter":
      return `${name("vary")}: '${p.name}' is neither a rate constant (${p.rates.join(", ")}), a species (its initial concentration) nor a total (${p.totals.join(", ") || "no conservation laws"})`;
    case "scan-rates-missing":
      return `a scan needs a value for every other rate constant; missing: ${p.missing.join(", ")}`;
    case "scan-totals-needed":
      return `the network has conservation laws (${p.totals.join(", ")}): give ${name("initial")} so their totals are known`;
    case "scan-continuum":
      return p.at === null ? `the steady states form a continuum for generic ${p.name}: no finite count exists` : `the steady states form a continuum at ${p.name} = ${p.at}`;
  }
}

/** Input names in plain words, for messages that name no edge (logs, other callers of the domain). */
export const PLAIN_INPUT_NAMES: Record<InputName, string> = {
  order: "elimination order",
  initial: "initial concentrations",
  from: "the start of the range",
  to: "its end",
  vary: "scanned parameter",
};

/** Bad input to an analysis or scan: `problem` is the typed reason; the message words it without naming any edge. */
export class SteadyStateInputError extends Error {
  override name = "SteadyStateInputError";
  constructor(readonly problem: SteadyStateInputProblem) {
    super(inputProblemText(problem, (n) => PLAIN_INPUT_NAMES[n]));
  }
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
    if (!fallback.includes(s)) throw new SteadyStateInputError({ kind: "unknown-species", input: "order", name: s, species: [...fallback] });
    if (seen.has(s)) throw new SteadyStateInputError({ kind: "listed-twice", input: "order", name: s });
    seen.add(s);
  }
  return [...user, ...fallback.filter((s) => !seen.has(s))];
}
