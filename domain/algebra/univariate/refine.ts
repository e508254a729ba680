import {
  type Rational,
  add,
  compare,
  div,
  fromInt,
  mul,
  rational,
  sign,
  sub,
  toNumber,
} from "../rational";
import { type RunLimits, checkLimits } from "./budget";
import { type IntPoly, type UPoly, homogeneousValue, signAt } from "./dense";
import { UnivariateError } from "./errors";
import { type RootInterval, bisectOnce, isExactRoot } from "./isolate";
import { squareFreePart } from "./squarefree";

export interface RefineOptions extends RunLimits {
  /** Stop once hi - lo <= width. */
  readonly width?: Rational;
  /** Stop once hi - lo <= relativeWidth · min(|lo|, |hi|) (the interval then excludes 0). */
  readonly relativeWidth?: Rational;
}

const abs = (a: Rational): Rational => (a.num < 0n ? { num: -a.num, den: a.den } : a);

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

function done(iv: { lo: Rational; hi: Rational }, options: RefineOptions): boolean {
  const w = sub(iv.hi, iv.lo);
  if (options.width && compare(w, options.width) <= 0) return true;
  if (options.relativeWidth && sign(iv.lo) * sign(iv.hi) > 0) {
    const m = compare(abs(iv.lo), abs(iv.hi)) < 0 ? abs(iv.lo) : abs(iv.hi);
    if (compare(w, mul(options.relativeWidth, m)) <= 0) return true;
  }
  return false;
}

/**
 * Shrinks an isolating interval (from isolateRealRoots) around its root until it meets `width`
 * and/or `relativeWidth`; exact roots come back unchanged. Each step is checked by exact signs:
 * a secant guess on a grid of N cells is accepted only when the signs confirm the root lies in
 * that cell (then N is squared), otherwise the step is a plain bisection (and N shrinks).
 * Example: refineRootInterval(x^2 - 2, (1, 2), { width: 1/1000 }) gives an interval of width
 * <= 1/1000 around 1.41421…, e.g. (181/128, 1449/1024).
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
  const f = squareFreePart(p);
  validate(f, interval, "refineRootInterval");
  let iv: { lo: Rational; hi: Rational } = { lo: interval.lo, hi: interval.hi };
  // A root at 0 cannot be approached in relative terms: settle it first.
  if (sign(iv.lo) < 0 && sign(iv.hi) > 0 && signAt(f, fromInt(0)) === 0) iv = { lo: fromInt(0), hi: fromInt(0) };
  let cells = 4n;
  let steps = 0;
  while (!isExactRoot(iv) && !done(iv, options)) {
    if ((steps++ & 15) === 0) checkLimits(limits(options), "root refinement");
    const next = secantStep(f, iv, cells);
    if (next) {
      iv = next;
      cells = cells < 1n << 64n ? cells * cells : cells;
    } else {
      iv = bisectOnce(f, iv);
      cells = cells > 4n ? sqrtPow2(cells) : 4n;
    }
  }
  return { lo: iv.lo, hi: iv.hi, multiplicity: interval.multiplicity };
}

const limits = (o: RefineOptions): RunLimits => ({ deadline: o.deadline, signal: o.signal });

function sqrtPow2(n: bigint): bigint {
  return 1n << BigInt(Math.floor((n.toString(2).length - 1) / 2));
}

/** One quadratic-interval-refinement step: the secant guess, confirmed on a grid of `cells` cells. */
function secantStep(f: IntPoly, iv: { lo: Rational; hi: Rational }, cells: bigint): { lo: Rational; hi: Rational } | null {
  // Values as integer fractions H/den^n (homogenised Horner), so no gcd of huge numbers is needed.
  const n = BigInt(f.length - 1);
  const vLo = homogeneousValue(f, iv.lo) * iv.hi.den ** n;
  const vHi = homogeneousValue(f, iv.hi) * iv.lo.den ** n;
  const w = sub(iv.hi, iv.lo);
  // Secant root t = lo + w·vLo/(vLo - vHi); its cell index j = round(cells·(t - lo)/w).
  let num = vLo * cells;
  let den = vLo - vHi;
  if (den < 0n) [num, den] = [-num, -den];
  let j = (2n * num + den) / (2n * den);
  if (j < 0n) j = 0n;
  if (j > cells) j = cells;
  const point = (i: bigint): Rational => add(iv.lo, mul(w, rational(i, cells)));
  const sLo = signAt(f, iv.lo);
  const sAt = (i: bigint): number => (i === 0n ? sLo : i === cells ? -sLo : signAt(f, point(i)));
  const sj = sAt(j);
  if (sj === 0) return { lo: point(j), hi: point(j) };
  if (sj === sLo) {
    // Root to the right of point j: confirm it before point j+1.
    const s2 = sAt(j + 1n);
    if (s2 === 0) return { lo: point(j + 1n), hi: point(j + 1n) };
    return s2 !== sLo ? { lo: point(j), hi: j + 1n === cells ? iv.hi : point(j + 1n) } : null;
  }
  const s0 = sAt(j - 1n);
  if (s0 === 0) return { lo: point(j - 1n), hi: point(j - 1n) };
  return s0 === sLo ? { lo: j - 1n === 0n ? iv.lo : point(j - 1n), hi: point(j) } : null;
}

/**
 * Float approximation of the root in an isolating interval, accurate to about 1e-15 relative
 * (the interval is refined to relative width 2^-56 and its midpoint rounded once).
 * Example: approximateRoot(x^2 - 2, (1, 2)) is 1.4142135623730951.
 * Common practice: exact refinement, a single rounding at the end.
 */
export function approximateRoot(p: UPoly, interval: RootInterval, options: RunLimits = {}): number {
  if (isExactRoot(interval)) {
    validate(squareFreePart(p), interval, "approximateRoot");
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
  const f = squareFreePart(p);
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
