import { invMod } from "../field";
import { bitLength, isHuge, lehmerCofactors } from "../lehmer-gcd";
import { gcdBig } from "../rational";
import type { Rational } from "../rational";

/**
 * x with x ≡ a (mod M) and x ≡ b (mod p), 0 ≤ x < M·p, given mInvP = M^{-1} mod p (Chinese
 * remainder theorem, Garner's form). Example: crtStep(2n, 3n, 1, 5, 2) is 11n (11 ≡ 2 mod 3, ≡ 1 mod 5).
 */
export function crtStep(a: bigint, M: bigint, b: number, p: number, mInvP: number, P: bigint = BigInt(p)): bigint {
  const ap = Number(a % P);
  let d = b - ap;
  if (d < 0) d += p;
  if (d === 0) return a;
  // t = d·M^{-1} mod p; both factors < 2^26, so the product is exact in a double.
  const t = (d * mInvP) % p;
  return a + M * BigInt(t);
}

/** Bit length of a positive bigint (the integer layer's one, lehmer-gcd.ts). */
export { bitLength };

/**
 * Maximal-quotient rational reconstruction (Monagan, "Maximal quotient rational reconstruction:
 * an almost optimal algorithm for rational reconstruction", ISSAC 2004): runs the extended
 * Euclidean algorithm on (m, u) and returns the n/d ≡ u (mod m) found just before the largest
 * quotient, provided that quotient exceeds T = 2^20·log2(m) (so a wrong answer is unlikely; the
 * caller checks the result on a fresh prime and proves it anyway). null when no such fraction.
 *
 * Example: mqrr(5n * inverse(7) mod 10^9+7, 10^9+7) is 5/7.
 */
export function mqrr(u: bigint, m: bigint, logm = bitLength(m)): Rational | null {
  let T = (1n << 20n) * BigInt(logm);
  if (u === 0n) return m > T ? { num: 0n, den: 1n } : null;
  let n = 0n, d = 0n;
  let r0 = m, r1 = u, t0 = 0n, t1 = 1n;
  // Lehmer's method while the remainders are long (lehmer-gcd.ts): the rounds take only quotients
  // up to 2^20, below T (T ≥ 2^20·log2(m) and r0 > 2^LEHMER_MIN_BITS here), so every quotient that
  // could be the maximal one comes from an ordinary division step, where it is compared. The
  // quotient sequence, hence the result, is the plain loop's (tested against it).
  while (r1 !== 0n && isHuge(r1)) {
    const { A, B, C, D } = lehmerCofactors(r0, r1, bitLength(r0), SMALL_QUOTIENT);
    if (B === 0) {
      const q = r0 / r1;
      if (q > T) { n = r1; d = t1; T = q; }
      const r2 = r0 - q * r1; r0 = r1; r1 = r2;
      const t2 = t0 - q * t1; t0 = t1; t1 = t2;
    } else {
      const a = BigInt(A), b = BigInt(B), c = BigInt(C), e = BigInt(D);
      const nr0 = a * r0 + b * r1, nr1 = c * r0 + e * r1;
      const nt0 = a * t0 + b * t1, nt1 = c * t0 + e * t1;
      r0 = nr0; r1 = nr1; t0 = nt0; t1 = nt1;
    }
  }
  while (r1 !== 0n && r0 > T) {
    const q = r0 / r1;
    if (q > T) { n = r1; d = t1; T = q; }
    const r2 = r0 - q * r1; r0 = r1; r1 = r2;
    const t2 = t0 - q * t1; t0 = t1; t1 = t2;
  }
  if (d === 0n || gcdBig(n, d) !== 1n) return null;
  return d < 0n ? { num: -n, den: -d } : { num: n, den: d };
}

/** Largest quotient a Lehmer round of mqrr may take (see there). */
const SMALL_QUOTIENT = 2 ** 20;

/** Rational r modulo a prime p (null when p divides the denominator). */
export function rationalModP(r: Rational, p: number, P: bigint = BigInt(p)): number | null {
  let den = Number(r.den % P);
  if (den === 0) return null;
  let num = Number(r.num % P);
  if (num < 0) num += p;
  if (den < 0) den += p;
  return (num * invMod(den, p)) % p;
}


/**
 * Rational reconstruction that first tries what the lift already knows, before the Euclidean
 * algorithm of mqrr (which is most of a lift's time: katsura-8, 28 primes, 2.8 s of 3.7 s):
 *  - `previous`, the fraction this coefficient reconstructed to at a smaller modulus, if it is
 *    still ≡ u (mod m): one multiplication instead of a Euclidean run on every later prime;
 *  - `den`, a denominator shared by the element's other coefficients (reduced bases usually have
 *    few distinct denominators): a = u·den mod m, taken symmetric, gives a/den when
 *    |a|·den·T < m with mqrr's T = 2^20·log2(m), the same margin mqrr asks of its quotient.
 * Two fractions n/d ≡ n'/d' (mod m) with |n|·d', |n'|·d < m/2 are equal, so when both mqrr and a
 * guess are within that bound they agree; either way the caller checks the lift on a fresh prime
 * and proves it exactly. Otherwise (and for u = 0) it is mqrr.
 *
 * Example: with m = 10^9+7, u = 5·7^{-1} mod m and den = 7n, the guess gives 5/7 without mqrr.
 */
export function guidedReconstruction(u: bigint, m: bigint, logm: number, previous: Rational | undefined, den: bigint): Rational | null {
  if (previous !== undefined && previous.num !== 0n && (previous.num - u * previous.den) % m === 0n) return previous;
  if (u !== 0n && den > 0n) {
    let a = (u * den) % m;
    if (a > m >> 1n) a -= m;
    const abs = a < 0n ? -a : a;
    if (abs * den * (1n << 20n) * BigInt(logm) < m) {
      const g = gcdBig(abs, den);
      return g === 1n ? { num: a, den } : { num: a / g, den: den / g };
    }
  }
  return mqrr(u, m, logm);
}
