/**
 * Packed monomials. A monomial in n variables is n+1 consecutive Int32 slots
 * `[totalDegree, e_1, ..., e_n]` inside some Int32Array (a polynomial keeps all its monomials in
 * one flat array, stride n+1). The cached total degree makes graded comparisons and sugar cheap;
 * `divMask` gives a 32-bit quick cannot-divide test (msolve-style divisibility bitmask).
 *
 * Example (n = 2): x^2*y is `[3, 2, 1]`; lcm(x^2*y, x*y^3) is `[5, 2, 3]`.
 */
export type Exponents = Int32Array;

/** Build a packed monomial from a plain exponent vector. */
export function packMonomial(exps: readonly number[]): Exponents {
  const m = new Int32Array(exps.length + 1);
  let d = 0;
  for (let i = 0; i < exps.length; i++) {
    const e = exps[i];
    if (!Number.isInteger(e) || e < 0) throw new RangeError(`monomial: bad exponent ${e}`);
    m[i + 1] = e;
    d += e;
  }
  m[0] = d;
  return m;
}

/** The plain exponent vector of the monomial stored at `a[ia..ia+n]`. */
export const unpackMonomial = (a: Exponents, ia: number, n: number): number[] =>
  Array.from(a.subarray(ia + 1, ia + 1 + n));

/** Does the monomial at a[ia] divide the one at b[ib]? */
export function divides(a: Exponents, ia: number, b: Exponents, ib: number, n: number): boolean {
  if (a[ia] > b[ib]) return false;
  for (let k = 1; k <= n; k++) if (a[ia + k] > b[ib + k]) return false;
  return true;
}

/** out[io..] = a[ia..] * b[ib..]. */
export function mulInto(out: Exponents, io: number, a: Exponents, ia: number, b: Exponents, ib: number, n: number): void {
  for (let k = 0; k <= n; k++) out[io + k] = a[ia + k] + b[ib + k];
}

/** out[io..] = a[ia..] / b[ib..] (caller guarantees divisibility). */
export function divInto(out: Exponents, io: number, a: Exponents, ia: number, b: Exponents, ib: number, n: number): void {
  for (let k = 0; k <= n; k++) out[io + k] = a[ia + k] - b[ib + k];
}

export function lcm(a: Exponents, ia: number, b: Exponents, ib: number, n: number): Exponents {
  const m = new Int32Array(n + 1);
  let d = 0;
  for (let k = 1; k <= n; k++) {
    const e = Math.max(a[ia + k], b[ib + k]);
    m[k] = e;
    d += e;
  }
  m[0] = d;
  return m;
}

export function isCoprime(a: Exponents, ia: number, b: Exponents, ib: number, n: number): boolean {
  for (let k = 1; k <= n; k++) if (a[ia + k] !== 0 && b[ib + k] !== 0) return false;
  return true;
}

export function monomialEquals(a: Exponents, ia: number, b: Exponents, ib: number, n: number): boolean {
  for (let k = 0; k <= n; k++) if (a[ia + k] !== b[ib + k]) return false;
  return true;
}

/**
 * Bit (k mod 32) is set when variable k occurs. If divMask(a) has a bit that divMask(b) lacks,
 * a cannot divide b — a one-instruction rejection before the full exponent test.
 */
export function divMask(a: Exponents, ia: number, n: number): number {
  let mask = 0;
  for (let k = 1; k <= n; k++) if (a[ia + k] !== 0) mask |= 1 << ((k - 1) & 31);
  return mask;
}

/** Cheap string key for hashing a monomial (used outside hot loops). */
export function monomialKey(a: Exponents, ia: number, n: number): string {
  let s = "";
  for (let k = 1; k <= n; k++) s += a[ia + k] + ",";
  return s;
}
