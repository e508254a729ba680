/**
 * Default rate-constant name of the i-th directed reaction (1-based): `k<i>`, or `k<i>_2`,
 * `k<i>_3`, … when that name is already a rate symbol or a species. Deterministic, so the same
 * file always gets the same names.
 *
 * Example: defaultRateName(3, new Set(["k3"])) is "k3_2".
 */
export function defaultRateName(index: number, taken: ReadonlySet<string>): string {
  const base = `k${index}`;
  if (!taken.has(base)) return base;
  for (let n = 2; ; n++) if (!taken.has(`${base}_${n}`)) return `${base}_${n}`;
}
