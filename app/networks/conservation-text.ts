/**
 * A conservation law as a readable sum: { E: 1, C: 1 } → `E + C`, { A: 2, B: -1 } → `2A − B`.
 * The total on the right-hand side is named by the caller (e.g. `total₁`).
 */
export function lawAsSum(law: Record<string, number>, speciesOrder: readonly string[]): string {
  const terms = Object.entries(law)
    .filter(([, c]) => c !== 0)
    .sort(([a], [b]) => speciesOrder.indexOf(a) - speciesOrder.indexOf(b));
  if (terms.length === 0) return "0";
  return terms
    .map(([s, c], i) => {
      const mag = Math.abs(c) === 1 ? "" : String(Math.abs(c));
      const sign = c < 0 ? (i === 0 ? "−" : " − ") : i === 0 ? "" : " + ";
      return `${sign}${mag}${s}`;
    })
    .join("");
}

const SUBSCRIPTS = "₀₁₂₃₄₅₆₇₈₉";
export const subscript = (n: number) => [...String(n)].map((d) => SUBSCRIPTS[Number(d)]).join("");

/** `E + C = total` when there is one law, `… = total₁`, `… = total₂` when several. */
export function lawsAsEquations(laws: Record<string, number>[], speciesOrder: readonly string[]): string[] {
  return laws.map((law, i) => `${lawAsSum(law, speciesOrder)} = total${laws.length === 1 ? "" : subscript(i + 1)}`);
}
