import { type Rational, add, compare, div, fromInt, rational, sign, toNumber, ZERO } from "../rational";
import type { RunLimits } from "./budget";
import { type IntPoly, type UPoly, signAt } from "./dense";
import { UnivariateError } from "./errors";
import { type RootInterval, isExactRoot } from "./isolate";
import { refineByQir } from "./qir";
import { squareFreePart } from "./squarefree";

/** Targets of refineRootInterval (at least one of width, relativeWidth) and limits. */
export interface RefineOptions extends RunLimits {
  /** Stop once hi - lo <= width. */
  readonly width?: Rational;
  /** Stop once hi - lo <= relativeWidth · min(|lo|, |hi|) (the interval then excludes 0). */
  readonly relativeWidth?: Rational;
}

// Refining every root of one polynomial should not redo its gcd each time; polynomials are
// readonly arrays, so caching by identity is safe.
const squareFreeCache = new WeakMap<UPoly, IntPoly>();
function squareFreeOf(p: UPoly, limits?: RunLimits): IntPoly {
  let f = squareFreeCache.get(p);
  if (!f) {
    f = squareFreePart(p, limits);
    squareFreeCache.set(p, f);
  }
  return f;
}

/** Checks an interval against the square-free part f; returns f's sign at lo (0 for exact roots). */
function validate(f: IntPoly, iv: { lo: Rational; hi: Rational }, what: string): number {
  if (isExactRoot(iv)) {
    if (signAt(f, iv.lo) !== 0) throw new UnivariateError("invalid-interval", `${what}: ${fmt(iv.lo)} is not a root`);
    return 0;
  }
  const sLo = signAt(f, iv.lo);
  const sHi = signAt(f, iv.hi);
  if (compare(iv.lo, iv.hi) >= 0 || sLo === 0 || sHi === 0 || sLo === sHi) {
    throw new UnivariateError(
      "invalid-interval",
      `${what}: (${fmt(iv.lo)}, ${fmt(iv.hi)}) is not an isolating interval from isolateRealRoots`,
    );
  }
  return sLo;
}

const fmt = (r: Rational): string => (r.den === 1n ? `${r.num}` : `${r.num}/${r.den}`);

/**
 * Shrinks an isolating interval (from isolateRealRoots) around its root until it meets `width`
 * and/or `relativeWidth`; exact roots come back unchanged. Each step is checked by exact signs:
 * a secant guess on a grid of N cells is accepted only when the signs confirm the root lies in
 * that cell (then N is squared), otherwise the step is a plain bisection (and N shrinks).
 * Example: refineRootInterval(x^2 - 2, (1, 2), { width: 1/1000 }) gives an interval of width
 * <= 1/1000 around 1.41421…: (11585/8192, 23171/16384).
 * Follows Abbott 2006, "Quadratic interval refinement for real roots" (recalled from memory),
 * falling back to bisection (common practice).
 */
export function refineRootInterval(p: UPoly, interval: RootInterval, options: RefineOptions): RootInterval {
  if (!options.width && !options.relativeWidth) {
    throw new UnivariateError("invalid-argument", "refineRootInterval: give width or relativeWidth");
  }
  if ((options.width && sign(options.width) <= 0) || (options.relativeWidth && sign(options.relativeWidth) <= 0)) {
    throw new UnivariateError("invalid-argument", "refineRootInterval: width and relativeWidth must be positive");
  }
  const f = squareFreeOf(p, limits(options));
  const sLo = validate(f, interval, "refineRootInterval");
  if (isExactRoot(interval)) return interval;
  // A root at 0 cannot be approached in relative terms: settle it first.
  if (sign(interval.lo) < 0 && sign(interval.hi) > 0 && signAt(f, ZERO) === 0) {
    return { lo: ZERO, hi: ZERO, multiplicity: interval.multiplicity };
  }
  const { lo, hi } = refineByQir(f, interval.lo, interval.hi, sLo, options, limits(options));
  return { lo, hi, multiplicity: interval.multiplicity };
}

const limits = (o: RefineOptions): RunLimits => ({ deadline: o.deadline, signal: o.signal });

/**
 * Float approximation of the root in an isolating interval, accurate to about 1e-15 relative
 * (the interval is refined to relative width 2^-56 and its midpoint rounded once).
 * Example: approximateRoot(x^2 - 2, (1, 2)) is 1.4142135623730951.
 * Common practice: exact refinement, a single rounding at the end.
 */
export function approximateRoot(p: UPoly, interval: RootInterval, options: RunLimits = {}): number {
  if (isExactRoot(interval)) {
    validate(squareFreeOf(p, options), interval, "approximateRoot");
    return toNumber(interval.lo);
  }
  const r = refineRootInterval(p, interval, { ...options, relativeWidth: rational(1n, 1n << 56n) });
  return toNumber(div(add(r.lo, r.hi), fromInt(2)));
}

/**
 * Exact comparison of the root isolated in `interval` with a rational r: -1 when root < r,
 * 0 when equal, 1 when root > r. Example: compareRootWithRational(x^2 - 2, (1, 2), 7/5) is 1
 * (√2 > 1.4). Common practice (sign of the square-free part at r against its sign at lo).
 */
export function compareRootWithRational(p: UPoly, interval: RootInterval, r: Rational): -1 | 0 | 1 {
  const f = squareFreeOf(p);
  const sLo = validate(f, interval, "compareRootWithRational");
  if (isExactRoot(interval)) return compare(interval.lo, r);
  if (compare(r, interval.lo) <= 0) return 1;
  if (compare(r, interval.hi) >= 0) return -1;
  const sR = signAt(f, r);
  if (sR === 0) return 0;
  return sR === sLo ? 1 : -1;
}

/** The rational value of a finite float, exactly. Example: floatToRational(0.375) is 3/8. */
export function floatToRational(x: number): Rational {
  if (!Number.isFinite(x)) throw new UnivariateError("invalid-argument", `floatToRational: ${x} is not finite`);
  let m = x;
  let d = 1n;
  while (!Number.isInteger(m)) {
    m *= 2;
    d *= 2n;
  }
  return rational(BigInt(m), d);
}

function nextFloat(x: number, up: boolean): number {
  if (x === 0) return up ? Number.MIN_VALUE : -Number.MIN_VALUE;
  const buf = new DataView(new ArrayBuffer(8));
  buf.setFloat64(0, x);
  const bits = buf.getBigUint64(0);
  buf.setBigUint64(0, (x > 0) === up ? bits + 1n : bits - 1n);
  return buf.getFloat64(0);
}

/**
 * Float enclosure of a rational interval, rounded outwards so that lo <= exact lo and
 * hi >= exact hi as real numbers; `mid` is the nearest float to the exact midpoint.
 * Example: rationalIntervalToFloat({ lo: 1/3, hi: 1/2 }) gives lo = 0.33333333333333331 (just
 * below 1/3), hi = 0.5, mid ≈ 0.4166666666666667. Common practice (outward rounding).
 */
export function rationalIntervalToFloat(interval: { lo: Rational; hi: Rational }): { lo: number; hi: number; mid: number } {
  let lo = toNumber(interval.lo);
  let hi = toNumber(interval.hi);
  if (Number.isFinite(lo) && compare(floatToRational(lo), interval.lo) > 0) lo = nextFloat(lo, false);
  if (Number.isFinite(hi) && compare(floatToRational(hi), interval.hi) < 0) hi = nextFloat(hi, true);
  return { lo, hi, mid: toNumber(div(add(interval.lo, interval.hi), fromInt(2))) };
}
