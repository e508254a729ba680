/**
 * Writes a benchmark reaction list in the product's network CSV format (header `reaction,rate`,
 * one directed reaction per row, `A + B -> C`), so `analyse` reads the same network whose
 * steady-state ideal the Gröbner systems hold.
 *
 * Example: networkCsv([{ reactants: { S0: 1, E: 1 }, products: { ES0: 1 }, rate: "k1" }], ["a comment"])
 * is "# a comment\nreaction,rate\nS0 + E -> ES0,k1\n".
 */
import type { Reaction } from "./mass-action";
import { qToString } from "./rational";

const side = (species: Readonly<Record<string, number>>): string => {
  const parts = Object.entries(species).map(([s, c]) => (c === 1 ? s : `${c}${s}`));
  return parts.length === 0 ? "0" : parts.join(" + ");
};

export function networkCsv(reactions: readonly Reaction[], comments: readonly string[]): string {
  const rows = reactions.map((r) => `${side(r.reactants)} -> ${side(r.products)},${typeof r.rate === "string" ? r.rate : qToString(r.rate)}`);
  return [...comments.map((c) => `# ${c}`), "reaction,rate", ...rows].join("\n") + "\n";
}
