/**
 * Exact rationals as plain data: `{ num, den }` with bigint parts, den > 0, gcd(num, den) = 1.
 * Every constructor normalises, so equality is structural (`eq`).
 *
 * Example: rational(6n, -4n) is { num: -3n, den: 2n }; add(r(1,2), r(1,3)) is 5/6.
 */
import { isHuge, lehmerGcd } from "./lehmer-gcd";

export interface Rational {
  readonly num: bigint;
  readonly den: bigint;
}

const SAFE = 9007199254740991n;

export function gcdBig(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  // Huge operands (coefficient growth over Q): Lehmer's method, which finishes through this function.
  if (isHuge(a) && isHuge(b)) return lehmerGcd(a, b, gcdBig);
  while (b !== 0n) {
    // Once both parts are below 2^53 finish in doubles: much cheaper than bigint division.
    if (a <= SAFE && b <= SAFE) {
      let x = Number(a), y = Number(b);
      while (y !== 0) {
        const t = x % y;
        x = y;
        y = t;
      }
      return BigInt(x);
    }
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

export function rational(num: bigint, den: bigint = 1n): Rational {
  if (den === 0n) throw new RangeError("rational: zero denominator");
  if (den < 0n) {
    num = -num;
    den = -den;
  }
  const g = gcdBig(num, den);
  return g === 1n || g === 0n ? { num, den } : { num: num / g, den: den / g };
}

export const ZERO: Rational = { num: 0n, den: 1n };
export const ONE: Rational = { num: 1n, den: 1n };

export const fromInt = (n: bigint | number): Rational => ({ num: BigInt(n), den: 1n });
export const isZero = (a: Rational): boolean => a.num === 0n;
export const eq = (a: Rational, b: Rational): boolean => a.num === b.num && a.den === b.den;
export const sign = (a: Rational): -1 | 0 | 1 => (a.num > 0n ? 1 : a.num < 0n ? -1 : 0);
export const neg = (a: Rational): Rational => ({ num: -a.num, den: a.den });

export function add(a: Rational, b: Rational): Rational {
  if (a.den === b.den) return rational(a.num + b.num, a.den);
  return rational(a.num * b.den + b.num * a.den, a.den * b.den);
}

export const sub = (a: Rational, b: Rational): Rational => add(a, neg(b));

export function mul(a: Rational, b: Rational): Rational {
  // Cross-cancel first so intermediate products stay small.
  const g1 = gcdBig(a.num, b.den);
  const g2 = gcdBig(b.num, a.den);
  const n1 = g1 > 1n ? a.num / g1 : a.num;
  const d2 = g1 > 1n ? b.den / g1 : b.den;
  const n2 = g2 > 1n ? b.num / g2 : b.num;
  const d1 = g2 > 1n ? a.den / g2 : a.den;
  return { num: n1 * n2, den: d1 * d2 };
}

export function inv(a: Rational): Rational {
  if (a.num === 0n) throw new RangeError("rational: division by zero");
  return a.num < 0n ? { num: -a.den, den: -a.num } : { num: a.den, den: a.num };
}

export const div = (a: Rational, b: Rational): Rational => mul(a, inv(b));

export function compare(a: Rational, b: Rational): -1 | 0 | 1 {
  const d = a.num * b.den - b.num * a.den;
  return d > 0n ? 1 : d < 0n ? -1 : 0;
}

export function toNumber(a: Rational): number {
  const n = Number(a.num);
  const d = Number(a.den);
  if (Number.isFinite(n) && Number.isFinite(d)) return n / d;
  // Scale down huge parts while keeping ~17 significant digits.
  const shift = BigInt(Math.max(a.num.toString(2).length, a.den.toString(2).length) - 1000);
  return Number(a.num >> (shift > 0n ? shift : 0n)) / Number(a.den >> (shift > 0n ? shift : 0n));
}

/** Canonical text: `3`, `-3/2`. */
export const formatRational = (a: Rational): string =>
  a.den === 1n ? a.num.toString() : `${a.num}/${a.den}`;

/**
 * Reads an integer, a fraction `a/b` or an exact decimal `1.25`, `2e-3`; returns null when the text is none of these.
 * Example: parseRational("0.125") is 1/8.
 */
export function parseRational(text: string): Rational | null {
  const s = text.trim();
  let m = /^([+-]?\d+)\s*\/\s*([+-]?\d+)$/.exec(s);
  if (m) {
    const den = BigInt(m[2]);
    return den === 0n ? null : rational(BigInt(m[1]), den);
  }
  m = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(s);
  if (!m || (m[2] === "" && (m[3] ?? "") === "")) return null;
  const digits = (m[2] || "0") + (m[3] ?? "");
  let exp = -(m[3] ?? "").length + (m[4] ? parseInt(m[4], 10) : 0);
  let num = BigInt(digits) * (m[1] === "-" ? -1n : 1n);
  let den = 1n;
  if (exp >= 0) num *= 10n ** BigInt(exp);
  else den = 10n ** BigInt(-exp);
  return rational(num, den);
}
