import { type Rational, compare, neg, rational, ZERO } from "../rational";
import { type RunLimits, checkLimits } from "./budget";
import { type IntPoly, type UPoly, mulInt, reflect, signAt, toIntegerPrimitive } from "./dense";
import { descartesCountUnitInterval, rootBoundExponent } from "./descartes";
import { UnivariateError } from "./errors";
import { primitivePart } from "./gcd";
import { type SquareFreeFactor, squareFreeFactorization } from "./squarefree";

/**
 * One real root, isolated. `lo === hi` (structurally equal rationals) means the root is exactly
 * `lo`. Otherwise the open interval (lo, hi) holds exactly one distinct real root, the
 * endpoints are not roots, and the square-free part of the polynomial changes sign between
 * them. `multiplicity` is the root's multiplicity in the polynomial that was isolated.
 */
export interface RootInterval {
  readonly lo: Rational;
  readonly hi: Rational;
  readonly multiplicity: number;
}

/** Options of isolateRealRoots: limits, and `positiveOnly` for roots > 0 only. */
export interface IsolationOptions extends RunLimits {
  /** Only strictly positive roots (e.g. positive steady states). */
  readonly positiveOnly?: boolean;
}

interface OpenInterval {
  lo: Rational;
  hi: Rational;
}

/** True when the interval is a single exact point. Example: isExactRoot({ lo: 1/2, hi: 1/2 }) is true. */
export const isExactRoot = (iv: { lo: Rational; hi: Rational }): boolean =>
  iv.lo.num === iv.hi.num && iv.lo.den === iv.hi.den;

/**
 * Exact real-root isolation. Returns one interval per distinct real root, in increasing order,
 * pairwise disjoint as closed intervals (hi_i < lo_{i+1}), each with rational (dyadic) endpoints
 * and the root's multiplicity; rational roots met on the way come back as exact points [r, r].
 * Example: isolateRealRoots(x^3 - 2x) gives three intervals, the middle one exactly [0, 0],
 * the others around ±√2 such as (-2, -1) and (1, 2).
 * Follows Collins & Akritas 1976, "Polynomial real root isolation using Descartes' rule of
 * signs" (the bisection form with Taylor shifts), with Fujiwara's root bound; multiplicities
 * from Yun's square-free factorisation (Yun 1976).
 */
export function isolateRealRoots(p: UPoly, options: IsolationOptions = {}): RootInterval[] {
  const a = toIntegerPrimitive(p);
  if (a.length === 0) throw new UnivariateError("zero-polynomial", "isolateRealRoots: every number is a root of the zero polynomial");
  if (a.length === 1) return [];
  const { factors } = squareFreeFactorization(a, options);
  let f: IntPoly = [1n];
  for (const { factor } of factors) f = mulInt(f, factor);
  f = primitivePart(f);

  const found: OpenInterval[] = [];
  let g = f;
  const zeroIsRoot = g[0] === 0n;
  if (zeroIsRoot) g = g.slice(1); // square-free, so x divides it once
  if (!options.positiveOnly) {
    for (const iv of isolatePositiveRoots(reflect(g), options).reverse()) found.push({ lo: neg(iv.hi), hi: neg(iv.lo) });
  }
  if (zeroIsRoot) found.push({ lo: ZERO, hi: ZERO }); // kept until separation moves neighbours off 0
  found.push(...isolatePositiveRoots(g, options));

  separateNeighbours(f, found, options);
  const kept = options.positiveOnly ? found.filter((iv) => iv.lo.num > 0n || !isExactRoot(iv)) : found;
  return kept.map((iv) => ({ lo: iv.lo, hi: iv.hi, multiplicity: multiplicityOf(iv, factors) }));
}

function multiplicityOf(iv: OpenInterval, factors: readonly SquareFreeFactor[]): number {
  if (factors.length === 1) return factors[0].multiplicity;
  for (const { factor, multiplicity } of factors) {
    if (isExactRoot(iv) ? signAt(factor, iv.lo) === 0 : signAt(factor, iv.lo) * signAt(factor, iv.hi) < 0) {
      return multiplicity;
    }
  }
  throw new UnivariateError("invalid-interval", "isolateRealRoots: internal error, root not found in any square-free factor");
}

/**
 * Roots of g in (0, ∞), g square-free with g(0) ≠ 0. Scales the roots into (0, 1) and bisects,
 * testing each piece with the Descartes count of its Möbius image.
 */
function isolatePositiveRoots(g: IntPoly, limits: RunLimits): OpenInterval[] {
  if (g.length <= 1) return [];
  const n = g.length - 1;
  const s = rootBoundExponent(g);
  const bound = 1n << BigInt(s);
  // Node (q, c, k): q(x) is a positive multiple of g(bound·(c + x)/2^k); the piece is x ∈ (0, 1).
  const out: OpenInterval[] = [];
  const endpoint = (c: bigint, k: number): Rational => rational(c * bound, 1n << BigInt(k));
  const stack: { q: IntPoly; c: bigint; k: number }[] = [
    { q: primitivePart(g.map((v, i) => v << BigInt(s * i))), c: 0n, k: 0 },
  ];
  let steps = 0;
  while (stack.length > 0) {
    if ((steps++ & 63) === 0) checkLimits(limits, "real-root isolation");
    const { q, c, k } = stack.pop()!;
    const count = descartesCountUnitInterval(q, 2);
    if (count === 0) continue;
    const endpointsAreRoots = q[0] === 0n || q.reduce((acc, v) => acc + v, 0n) === 0n;
    if (count === 1 && !endpointsAreRoots) {
      out.push({ lo: endpoint(c, k), hi: endpoint(c + 1n, k) });
      continue;
    }
    // Halves: left(x) = 2^n q(x/2), right(x) = left(x + 1); right(0) is the value at the midpoint.
    const left = q.map((v, i) => v << BigInt(n - i));
    const right = [...left];
    for (let i = 0; i < n; i++) for (let j = n - 1; j >= i; j--) right[j] += right[j + 1];
    if (right[0] === 0n) out.push({ lo: endpoint(2n * c + 1n, k + 1), hi: endpoint(2n * c + 1n, k + 1) });
    stack.push({ q: removePowerOfTwo(right), c: 2n * c + 1n, k: k + 1 });
    stack.push({ q: removePowerOfTwo(left), c: 2n * c, k: k + 1 });
  }
  return out.sort((x, y) => compare(x.lo, y.lo) || compare(x.hi, y.hi));
}

/**
 * Divides out the largest power of two common to all coefficients: the part of the content the
 * halving steps create, found by bit tests instead of gcds of long integers.
 */
function removePowerOfTwo(p: bigint[]): bigint[] {
  let shift = Infinity;
  for (const v of p) {
    if (v === 0n) continue;
    const a = v < 0n ? -v : v;
    shift = Math.min(shift, (a & -a).toString(2).length - 1);
    if (shift === 0) return p;
  }
  if (shift === Infinity) return p;
  const s = BigInt(shift);
  return p.map((v) => v >> s);
}

/**
 * One bisection step on a sign-changing interval of the square-free f; may land on the root.
 * Example: bisectOnce(x^2 - 2, (1, 2)) is (1, 3/2). Common practice.
 */
export function bisectOnce(f: IntPoly, iv: OpenInterval): OpenInterval {
  const mid = rational(iv.lo.num * iv.hi.den + iv.hi.num * iv.lo.den, 2n * iv.lo.den * iv.hi.den);
  const sMid = signAt(f, mid);
  if (sMid === 0) return { lo: mid, hi: mid };
  // An endpoint may itself be a neighbouring root (sign 0); then judge by the other one.
  const sLo = signAt(f, iv.lo);
  if (sLo !== 0) return sMid === sLo ? { lo: mid, hi: iv.hi } : { lo: iv.lo, hi: mid };
  return sMid === signAt(f, iv.hi) ? { lo: iv.lo, hi: mid } : { lo: mid, hi: iv.hi };
}

/** Shrinks intervals that share an endpoint with a neighbour until hi_i < lo_{i+1}. */
function separateNeighbours(f: IntPoly, ivs: OpenInterval[], limits: RunLimits): void {
  for (let i = 0; i + 1 < ivs.length; i++) {
    while (compare(ivs[i].hi, ivs[i + 1].lo) >= 0) {
      checkLimits(limits, "real-root isolation");
      if (!isExactRoot(ivs[i])) ivs[i] = bisectOnce(f, ivs[i]);
      if (!isExactRoot(ivs[i + 1])) ivs[i + 1] = bisectOnce(f, ivs[i + 1]);
    }
  }
}
