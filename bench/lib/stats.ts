/**
 * Summary statistics for benchmark timings.
 *
 * Example: median([3, 1, 2]) is 2; median([4, 1, 3, 2]) is 2.5 (mean of the middle two,
 * the usual convention: Hyndman and Fan, "Sample quantiles in statistical packages", 1996).
 */
export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError("median of no values");
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 === 1 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}
