import type { Rational } from "../rational";
import { type IntPoly, type UPoly, derivative, signAt, toIntegerPrimitive } from "./dense";
import { type RunLimits, checkLimits } from "./budget";
import { pseudoRemainder } from "./division";
import { UnivariateError } from "./errors";
import { primitivePart } from "./gcd";
import { squareFreePart } from "./squarefree";

/**
 * Sturm sequence p0 = p, p1 = p', p_{i+1} = -rem(p_{i-1}, p_i), each term scaled by a positive
 * constant only (so signs are those of the classical sequence), integer primitive.
 * Example: for x^2 - 2 it is [x^2 - 2, x, 1] (as integer lists [-2n, 0n, 1n], [0n, 1n], [1n]).
 * Sturm 1829, "Mémoire sur la résolution des équations numériques".
 */
export function sturmSequence(p: UPoly, limits?: RunLimits): IntPoly[] {
  const p0 = toIntegerPrimitive(p);
  if (p0.length === 0) throw new UnivariateError("zero-polynomial", "sturmSequence: the zero polynomial has no Sturm sequence");
  const seq: IntPoly[] = [p0];
  if (p0.length === 1) return seq;
  seq.push(primitivePart(derivative(p0)));
  for (;;) {
    checkLimits(limits, "Sturm sequence");
    const a = seq[seq.length - 2];
    const b = seq[seq.length - 1];
    let r = pseudoRemainder(a, b);
    if (r.length === 0) return seq;
    // prem multiplies by lc(b)^k with k = deg a - deg b + 1; undo a negative factor's sign.
    const k = a.length - b.length + 1;
    const factorNegative = b[b.length - 1] < 0n && k % 2 === 1;
    if (!factorNegative) r = r.map((c) => -c);
    const g = r.reduce((acc, c) => gcdAbs(acc, c), 0n);
    seq.push(g > 1n ? r.map((c) => c / g) : r);
  }
}

function gcdAbs(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

/**
 * Sign variations of a Sturm sequence at a rational point or at ±Infinity (zeros skipped).
 * Example: for [x^2 - 2, x, 1] it is 1 at 0 (signs -, 0, +) and 0 at +Infinity.
 */
export function sturmVariationsAt(seq: readonly IntPoly[], x: Rational | number): number {
  let count = 0;
  let last = 0;
  for (const q of seq) {
    let s: number;
    if (typeof x === "number") {
      const lead = q[q.length - 1] > 0n ? 1 : -1;
      s = x > 0 || (q.length - 1) % 2 === 0 ? lead : -lead;
    } else {
      s = signAt(q, x);
    }
    if (s === 0) continue;
    if (last !== 0 && s !== last) count++;
    last = s;
  }
  return count;
}

/**
 * Number of distinct real roots in the closed interval [lo, hi] (lo, hi omitted: -∞, +∞),
 * by Sturm's theorem on the square-free part: V(lo) - V(hi) counts roots in (lo, hi],
 * plus one when lo itself is a root. An independent cross-check of root isolation.
 * Example: countRealRootsSturm(x^3 - x, 0, 1) is 2 (the roots 0 and 1).
 * Sturm 1829; Basu, Pollack & Roy, "Algorithms in Real Algebraic Geometry" (Sturm's theorem,
 * chapter 2, recalled from memory).
 */
export function countRealRootsSturm(p: UPoly, lo?: Rational, hi?: Rational, limits?: RunLimits): number {
  const f = squareFreePart(p, limits);
  if (f.length === 0) throw new UnivariateError("zero-polynomial", "countRealRootsSturm: the zero polynomial has infinitely many roots");
  if (lo && hi && lo.num * hi.den > hi.num * lo.den) return 0;
  const seq = sturmSequence(f, limits);
  const vLo = sturmVariationsAt(seq, lo ?? -Infinity);
  const vHi = sturmVariationsAt(seq, hi ?? Infinity);
  return vLo - vHi + (lo && signAt(f, lo) === 0 ? 1 : 0);
}
