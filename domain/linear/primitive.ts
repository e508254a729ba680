import { gcdBig, type Rational } from "../algebra/rational";

const lcm = (a: bigint, b: bigint): bigint => (a / gcdBig(a, b)) * b;

/**
 * The primitive integer vector on the same ray (or line) as `v`: clear denominators, divide by
 * the gcd of the entries, and make the first non-zero entry positive (so a non-positive vector
 * becomes non-negative). The zero vector stays zero. Common practice (content / primitive part,
 * as in Cox, Little, O'Shea, "Ideals, Varieties, and Algorithms", 4th ed. 2015, for polynomials).
 *
 * Example: primitiveIntegerVector([1/2, -1/3, 0]) is [3, -2, 0]; [-2, 0, -4] gives [1, 0, 2].
 */
export function primitiveIntegerVector(v: readonly Rational[]): bigint[] {
  let den = 1n;
  for (const x of v) if (x.num !== 0n) den = lcm(den, x.den);
  const ints = v.map((x) => (x.num * den) / x.den);
  return primitiveOfIntegers(ints);
}

/** Divides an integer vector by the gcd of its entries and makes the first non-zero entry positive. Example: [0, -4, 6] → [0, 2, -3]. */
export function primitiveOfIntegers(v: readonly bigint[]): bigint[] {
  let g = 0n;
  for (const x of v) g = gcdBig(g, x);
  if (g === 0n) return v.slice();
  const first = v.find((x) => x !== 0n)!;
  if (first < 0n) g = -g;
  return v.map((x) => x / g);
}
