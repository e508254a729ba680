import { type Rational, rational } from "../rational";
import { type RunLimits, checkLimits } from "./budget";
import { type IntPoly, homogeneousValue } from "./dense";

/** When refinement stops: hi - lo <= width, or hi - lo <= relativeWidth·min(|lo|, |hi|). */
export interface StopRule {
  readonly width?: Rational;
  readonly relativeWidth?: Rational;
}

/**
 * The interval (L/D, (L + W)/D) with D, W > 0. Refinement only ever multiplies D and moves L,
 * and W never changes, so nothing is normalised (no gcds of long integers) until the end.
 */
interface Frame {
  L: bigint;
  W: bigint;
  D: bigint;
}

const signOf = (v: bigint): number => (v > 0n ? 1 : v < 0n ? -1 : 0);
const absB = (v: bigint): bigint => (v < 0n ? -v : v);

/** num/den normalised, stripping the common power of two by bit tests before the gcd. */
function normalise(num: bigint, den: bigint): Rational {
  if (num === 0n) return { num: 0n, den: 1n };
  const a = absB(num);
  const twos = Math.min((a & -a).toString(2).length, (den & -den).toString(2).length) - 1;
  return twos > 0 ? rational(num >> BigInt(twos), den >> BigInt(twos)) : rational(num, den);
}

function stopped(fr: Frame, stop: StopRule): boolean {
  if (stop.width && fr.W * stop.width.den <= stop.width.num * fr.D) return true;
  const hiNum = fr.L + fr.W;
  if (stop.relativeWidth && signOf(fr.L) * signOf(hiNum) > 0) {
    const m = absB(fr.L) < absB(hiNum) ? absB(fr.L) : absB(hiNum);
    if (fr.W * stop.relativeWidth.den <= stop.relativeWidth.num * m) return true;
  }
  return false;
}

/**
 * Refines (lo, hi), where the square-free f has exactly one root and sign sLo ≠ 0 at lo, until
 * the stop rule holds; returns the new endpoints, equal when a grid point hits the root exactly.
 * Each step tries the secant guess on a grid of N cells and keeps it only when exact signs
 * confirm the root lies in that cell (then N is squared: quadratic convergence near a simple
 * root); otherwise it bisects and N shrinks back (Abbott 2006, "Quadratic interval refinement
 * for real roots", recalled from memory).
 * Example: on x^2 - 2 from (1, 2) with width 1/1000 it returns (11585/8192, 23171/16384).
 */
export function refineByQir(
  f: IntPoly,
  lo: Rational,
  hi: Rational,
  sLo: number,
  stop: StopRule,
  limits: RunLimits,
): { lo: Rational; hi: Rational } {
  const D0 = lo.den === hi.den ? lo.den : (lo.den * hi.den) / gcd(lo.den, hi.den);
  const L0 = lo.num * (D0 / lo.den);
  let fr: Frame = { L: L0, W: hi.num * (D0 / hi.den) - L0, D: D0 };
  const signAtPoint = (num: bigint, den: bigint): number => signOf(homogeneousValue(f, { num, den }));
  let cells = 4n;
  let steps = 0;
  while (!stopped(fr, stop)) {
    if ((steps++ & 15) === 0) checkLimits(limits, "root refinement");
    const next = secantStep(f, fr, cells, sLo, signAtPoint);
    if (next && "exact" in next) return { lo: next.exact, hi: next.exact };
    if (next) {
      fr = next;
      cells *= cells;
      continue;
    }
    cells = cells > 4n ? 1n << BigInt((cells.toString(2).length - 1) >> 1) : 4n;
    const mid = 2n * fr.L + fr.W;
    const s = signAtPoint(mid, 2n * fr.D);
    if (s === 0) {
      const exact = normalise(mid, 2n * fr.D);
      return { lo: exact, hi: exact };
    }
    fr = s === sLo ? { L: mid, W: fr.W, D: 2n * fr.D } : { L: 2n * fr.L, W: fr.W, D: 2n * fr.D };
  }
  return { lo: normalise(fr.L, fr.D), hi: normalise(fr.L + fr.W, fr.D) };
}

function gcd(a: bigint, b: bigint): bigint {
  while (b !== 0n) [a, b] = [b, a % b];
  return a < 0n ? -a : a;
}

/** The secant guess on a grid of `cells` cells, confirmed by exact signs; null when unconfirmed. */
function secantStep(
  f: IntPoly,
  fr: Frame,
  cells: bigint,
  sLo: number,
  signAtPoint: (num: bigint, den: bigint) => number,
): Frame | { exact: Rational } | null {
  // Both endpoints share the denominator D, so the values compare as H(L, D) and H(L + W, D).
  const vLo = homogeneousValue(f, { num: fr.L, den: fr.D });
  const vHi = homogeneousValue(f, { num: fr.L + fr.W, den: fr.D });
  // Secant root at fraction vLo/(vLo - vHi) of the width; cell index j = round(cells·fraction).
  let num = vLo * cells;
  let den = vLo - vHi;
  if (den < 0n) [num, den] = [-num, -den];
  let j = (2n * num + den) / (2n * den);
  if (j < 0n) j = 0n;
  if (j > cells) j = cells;
  // Grid point i is (L·cells + i·W) / (D·cells).
  const D = fr.D * cells;
  const P = (i: bigint): bigint => fr.L * cells + i * fr.W;
  const sAt = (i: bigint): number => (i === 0n ? sLo : i === cells ? -sLo : signAtPoint(P(i), D));
  const sj = sAt(j);
  if (sj === 0) return { exact: normalise(P(j), D) };
  const k = sj === sLo ? j + 1n : j - 1n; // the neighbour on the root's side
  const sk = sAt(k);
  if (sk === 0) return { exact: normalise(P(k), D) };
  if (sk === sj) return null;
  return { L: P(k < j ? k : j), W: fr.W, D };
}
