import type { NetworkFileProblem } from "./errors";
import type { Network } from "./model";

/**
 * What a network may be, checked cheaply (linear in the file) before any algebra, so one upload
 * cannot occupy a server for minutes: structure (conservation laws by extreme rays, deficiency)
 * grows much faster than the file, e.g. about 0.45 s for 50 species and 100 reactions but 14 s for
 * 200 and 400 on the reference machine. The limits are stated in the README.
 *
 * - species: at most 60; reactions (directed, a `<->` row counts twice): at most 150;
 * - stoichiometric coefficients: 1 to 1,000,000 (reaction-text.ts);
 * - rate values: at most 60 characters, decimal exponent from -100 to 100 (parse-csv.ts).
 *
 *   networkLimitProblems(parseNetworkCsv(bigCsv))
 *   // → [{ row: 1, message: "the network has 61 species", expected: "at most 60 species" }]
 */
export const NETWORK_LIMITS = {
  maxSpecies: 60,
  maxReactions: 150,
  maxRateValueChars: 60,
  maxRateValueExponent: 100,
} as const;

/** Problems of a parsed network that is larger than NETWORK_LIMITS (an empty list when it fits). */
export function networkLimitProblems(network: Pick<Network, "species" | "reactions">): NetworkFileProblem[] {
  const problems: NetworkFileProblem[] = [];
  if (network.species.length > NETWORK_LIMITS.maxSpecies) {
    problems.push({
      row: 1,
      message: `the network has ${network.species.length} species`,
      expected: `at most ${NETWORK_LIMITS.maxSpecies} species (larger networks are refused before any computation)`,
    });
  }
  if (network.reactions.length > NETWORK_LIMITS.maxReactions) {
    problems.push({
      row: 1,
      message: `the network has ${network.reactions.length} reactions (a \`<->\` row counts as two)`,
      expected: `at most ${NETWORK_LIMITS.maxReactions} reactions`,
    });
  }
  return problems;
}

/**
 * Is this decimal text small enough to turn into an exact rational cheaply? `1e60000000` would be
 * a 60-million-digit integer (tens of seconds) and `1e99999999999` more than a BigInt can hold.
 * Looks only at the text: its length and the digits of the exponent.
 *
 *   rateValueWithinLimits("2.5e-3")       // true
 *   rateValueWithinLimits("1e60000000")   // false
 */
export function rateValueWithinLimits(text: string): boolean {
  const s = text.trim();
  if (s.length > NETWORK_LIMITS.maxRateValueChars) return false;
  const exponent = /[eE]([+-]?)(\d+)$/.exec(s);
  if (!exponent) return true;
  const digits = exponent[2]!.replace(/^0+/, "");
  return digits.length <= 3 && Number(digits || "0") <= NETWORK_LIMITS.maxRateValueExponent;
}
