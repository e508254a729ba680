import { AlgebraError } from "./errors";
import * as Q from "./rational";
import type { Rational } from "./rational";

/**
 * A coefficient field: the field object does the arithmetic, elements are plain data
 * (`Rational` for Q, a JS number in [0, p) for Z/p). Algorithms are written once against this
 * interface and the concrete field is chosen once per ring.
 *
 * Example: `primeField(7).mul(3, 5)` is 1; `QQ.div(QQ.fromBigInt(1n), QQ.fromBigInt(3n))` is 1/3.
 */
export interface Field<C> {
  readonly name: string;
  /** 0n for Q, p for Z/p. */
  readonly characteristic: bigint;
  readonly zero: C;
  readonly one: C;
  isZero(a: C): boolean;
  isOne(a: C): boolean;
  eq(a: C, b: C): boolean;
  add(a: C, b: C): C;
  sub(a: C, b: C): C;
  mul(a: C, b: C): C;
  neg(a: C): C;
  /** Multiplicative inverse; throws AlgebraError('domain') on zero. */
  inv(a: C): C;
  div(a: C, b: C): C;
  fromBigInt(n: bigint): C;
  /** Throws AlgebraError('domain') if the denominator is not invertible (Z/p with p | den). */
  fromRational(r: Rational): C;
  /** Q: the value itself; Z/p: the symmetric representative in (-p/2, p/2]. */
  toRational(a: C): Rational;
  /** True when the canonical printed form starts with a minus sign. */
  isNegative(a: C): boolean;
  format(a: C): string;
}

/**
 * Is this the field of rationals? The engine picks its coefficient strategy (fraction-free over
 * Z, modular images, rational reconstruction) from this property of the field, not from identity.
 */
export function isRationalField(F: Field<unknown>): F is Field<Rational> {
  return F.characteristic === 0n;
}

/** The rationals with normalised bigint numerator/denominator (see rational.ts). */
export const QQ: Field<Rational> = {
  name: "QQ",
  characteristic: 0n,
  zero: Q.ZERO,
  one: Q.ONE,
  isZero: Q.isZero,
  isOne: (a) => a.num === 1n && a.den === 1n,
  eq: Q.eq,
  add: Q.add,
  sub: Q.sub,
  mul: Q.mul,
  neg: Q.neg,
  inv(a) {
    if (a.num === 0n) throw new AlgebraError("domain", "division by zero in QQ");
    return Q.inv(a);
  },
  div(a, b) {
    if (b.num === 0n) throw new AlgebraError("domain", "division by zero in QQ");
    return Q.div(a, b);
  },
  fromBigInt: (n) => ({ num: n, den: 1n }),
  fromRational: (r) => r,
  toRational: (a) => a,
  isNegative: (a) => a.num < 0n,
  format: Q.formatRational,
};

/** Largest prime modulus accepted: products are formed exactly by splitting (see mulMod). */
export const MAX_PRIME = 2 ** 31 - 1;

/**
 * Exact a·b mod p for 0 ≤ a, b < p < 2^31 using only doubles (no bigint, no Math.imul wrap).
 * Split a = ah·2^16 + al: ah·b < 2^46 and (ah·b mod p)·2^16 + al·b < 2^48, so every
 * intermediate is an exact double (< 2^53). Common practice (limb splitting).
 */
export function mulMod(a: number, b: number, p: number): number {
  const ah = Math.floor(a / 65536);
  const al = a - ah * 65536;
  return (((ah * b) % p) * 65536 + al * b) % p;
}

/** Inverse modulo p by the extended Euclidean algorithm on doubles (all values < 2^31). */
export function invMod(a: number, p: number): number {
  let r0 = p, r1 = a % p;
  let t0 = 0, t1 = 1;
  while (r1 !== 0) {
    const q = Math.floor(r0 / r1);
    [r0, r1] = [r1, r0 - q * r1];
    [t0, t1] = [t1, t0 - q * t1];
  }
  if (r0 !== 1) throw new AlgebraError("domain", `${a} is not invertible modulo ${p}`);
  return t0 < 0 ? t0 + p : t0;
}

export function isPrime(n: number): boolean {
  if (!Number.isInteger(n) || n < 2) return false;
  if (n % 2 === 0) return n === 2;
  for (let d = 3; d * d <= n; d += 2) if (n % d === 0) return false;
  return true;
}

/** A prime field's extra surface: the modulus as a number and a raw multiply. */
export interface PrimeField extends Field<number> {
  readonly p: number;
}

const primeFieldCache = new Map<number, PrimeField>();

/**
 * Z/p for a prime 2 ≤ p < 2^31, elements are numbers in [0, p).
 * For p < 2^26 products are below 2^52 and a plain `a*b % p` is exact; above that the split
 * multiplication `mulMod` is used. The choice is made once here.
 *
 * Example: `primeField(2147483647).mul(2147483646, 2147483646)` is 1.
 */
export function primeField(p: number): PrimeField {
  const cached = primeFieldCache.get(p);
  if (cached) return cached;
  if (!Number.isSafeInteger(p) || p > MAX_PRIME || !isPrime(p)) {
    throw new AlgebraError("ring", `field: ${p} is not a prime below 2^31`);
  }
  const P = BigInt(p);
  const small = p < 2 ** 26;
  const mul = small ? (a: number, b: number) => (a * b) % p : (a: number, b: number) => mulMod(a, b, p);
  const inv = (a: number) => {
    if (a === 0) throw new AlgebraError("domain", `division by zero in GF(${p})`);
    return invMod(a, p);
  };
  const fromBigInt = (n: bigint) => {
    let r = n % P;
    if (r < 0n) r += P;
    return Number(r);
  };
  const field: PrimeField = {
    name: `GF(${p})`,
    characteristic: P,
    p,
    zero: 0,
    one: 1,
    isZero: (a) => a === 0,
    isOne: (a) => a === 1,
    eq: (a, b) => a === b,
    add: (a, b) => (a + b >= p ? a + b - p : a + b),
    sub: (a, b) => (a - b < 0 ? a - b + p : a - b),
    mul,
    neg: (a) => (a === 0 ? 0 : p - a),
    inv,
    div: (a, b) => mul(a, inv(b)),
    fromBigInt,
    fromRational(r) {
      const d = fromBigInt(r.den);
      if (d === 0) throw new AlgebraError("domain", `denominator ${r.den} is not invertible modulo ${p}`);
      return mul(fromBigInt(r.num), invMod(d, p));
    },
    toRational: (a) => ({ num: BigInt(a > p / 2 ? a - p : a), den: 1n }),
    isNegative: (a) => a > p / 2,
    format: (a) => String(a > p / 2 ? a - p : a),
  };
  primeFieldCache.set(p, field);
  return field;
}

export const isPrimeField = (f: Field<unknown>): f is PrimeField => f.characteristic !== 0n;
