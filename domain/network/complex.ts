/**
 * A complex: species → positive integer coefficient, with keys in sorted (code-point) order.
 * The empty complex (inflow/outflow) has no keys and is written `0`.
 *
 * Example: the complex `E + S` is { E: 1, S: 1 }; `2A` is { A: 2 }.
 */
export type Complex = Readonly<Record<string, number>>;

/**
 * Species (and rate) names: a letter, then letters, digits or `_` — but not a name every
 * JavaScript object already has (`toString`, `valueOf`, `constructor`, …): complexes and many
 * tables are plain objects keyed by name, and such a name would read the built-in instead.
 */
export const SPECIES_NAME = /^(?!(?:constructor|hasOwnProperty|isPrototypeOf|propertyIsEnumerable|toLocaleString|toString|valueOf)$)[A-Za-z][A-Za-z0-9_]*$/;

/** Builds a complex from (species, coefficient) pairs, summing repeats and sorting keys. Example: [["S",1],["E",1]] → { E: 1, S: 1 }. */
export function makeComplex(terms: Iterable<readonly [string, number]>): Complex {
  const sums = new Map<string, number>();
  for (const [s, c] of terms) sums.set(s, (sums.get(s) ?? 0) + c);
  const out: Record<string, number> = {};
  for (const s of [...sums.keys()].sort(compareNames)) if (sums.get(s)! !== 0) out[s] = sums.get(s)!;
  return out;
}

/** Code-point order, independent of locale (so `B` sorts before `a`). Example: ["b", "B", "A"] sorts to ["A", "B", "b"]. */
export const compareNames = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);

/**
 * Canonical text of a complex: terms in sorted order joined by ` + `, a coefficient written
 * directly before the name, `0` for the empty complex. With `speciesOrder`, terms follow that
 * order instead (used by the CSV writer so species keep their order of first appearance).
 * Example: { A: 2, B: 1 } → `2A + B`.
 */
export function formatComplex(c: Complex, speciesOrder?: readonly string[]): string {
  const names = Object.keys(c);
  if (speciesOrder) names.sort((a, b) => rankIn(speciesOrder, a) - rankIn(speciesOrder, b) || compareNames(a, b));
  if (names.length === 0) return "0";
  return names.map((s) => (c[s] === 1 ? s : `${c[s]}${s}`)).join(" + ");
}

/** True when both complexes have the same species and coefficients. Example: sameComplex({A:1},{A:1}) is true. */
export function sameComplex(a: Complex, b: Complex): boolean {
  return formatComplex(a) === formatComplex(b);
}

const rankIn = (order: readonly string[], s: string): number => {
  const i = order.indexOf(s);
  return i < 0 ? order.length : i;
};
