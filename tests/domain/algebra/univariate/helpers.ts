import { type Rational, compare, rational } from "@domain/algebra/rational";
import { type IntPoly, type RootInterval, isExactRoot, signAt, squareFreePart } from "@domain/algebra/univariate";

/** Seeded PRNG (mulberry32, common practice) so property tests are reproducible. */
export function prng(seed: number): { int(lo: number, hi: number): number; pick<T>(xs: readonly T[]): T } {
  let a = seed >>> 0;
  const next = (): number => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    int: (lo, hi) => lo + Math.floor(next() * (hi - lo + 1)),
    pick: (xs) => xs[Math.floor(next() * xs.length)],
  };
}

export const q = (num: number | bigint, den: number | bigint = 1): Rational => rational(BigInt(num), BigInt(den));

/**
 * Checks the promises of isolateRealRoots on p: increasing, disjoint as closed intervals,
 * endpoints not roots, a sign change of the square-free part across each open interval.
 */
export function expectValidIsolation(p: IntPoly, ivs: readonly RootInterval[]): string[] {
  const problems: string[] = [];
  const f = squareFreePart(p);
  ivs.forEach((iv, i) => {
    if (isExactRoot(iv)) {
      if (signAt(f, iv.lo) !== 0) problems.push(`#${i}: exact point is not a root`);
    } else {
      if (compare(iv.lo, iv.hi) >= 0) problems.push(`#${i}: lo >= hi`);
      const a = signAt(f, iv.lo);
      const b = signAt(f, iv.hi);
      if (a === 0 || b === 0) problems.push(`#${i}: an endpoint is a root`);
      if (a === b) problems.push(`#${i}: no sign change`);
    }
    if (i > 0 && compare(ivs[i - 1].hi, iv.lo) >= 0) problems.push(`#${i - 1}, #${i}: not disjoint or not increasing`);
  });
  return problems;
}

/** |r| as a float, for coarse test checks only. */
export const absFloat = (r: Rational): number => Math.abs(Number(r.num) / Number(r.den));
