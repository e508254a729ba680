import type { IntPoly } from "./dense";

/**
 * Number of sign changes in a coefficient list, zeros skipped; stops counting at `cap`.
 * Example: signVariations([1n, -3n, 0n, 2n]) is 2. Descartes' rule of signs (Descartes 1637):
 * the count bounds the number of positive roots and has its parity.
 */
export function signVariations(coeffs: readonly bigint[], cap = Infinity): number {
  let count = 0;
  let last = 0n;
  for (const c of coeffs) {
    if (c === 0n) continue;
    if ((c < 0n) !== (last < 0n) && last !== 0n) {
      count++;
      if (count >= cap) return count;
    }
    last = c;
  }
  return count;
}

/**
 * p(x + 1) by the O(n^2) Horner-style scheme, in place on a copy.
 * Example: taylorShiftByOne([0n, 0n, 1n]) (x^2) is x^2 + 2x + 1.
 */
export function taylorShiftByOne(p: IntPoly): bigint[] {
  const a = [...p];
  const n = a.length - 1;
  for (let i = 0; i < n; i++) {
    for (let j = n - 1; j >= i; j--) a[j] += a[j + 1];
  }
  return a;
}

/**
 * Upper bound on the Descartes count for roots of p in (0, 1): the sign variations of
 * (x + 1)^n p(1/(x + 1)), which maps (0, 1) onto (0, ∞). Roots at 0 or 1 are not counted.
 * Example: for p = (2x - 1)(3x - 1) the count is 2. Collins & Akritas 1976, "Polynomial real
 * root isolation using Descartes' rule of signs".
 */
export function descartesCountUnitInterval(p: IntPoly, cap = Infinity): number {
  const reversed = [...p].reverse();
  let n = reversed.length;
  while (n > 0 && reversed[n - 1] === 0n) n--;
  reversed.length = n;
  return signVariations(taylorShiftByOne(reversed), cap);
}

const bitLength = (v: bigint): number => (v === 0n ? 0 : (v < 0n ? -v : v).toString(2).length);

/**
 * An integer s >= 0 with every complex root z of p satisfying |z| < 2^s: a power-of-two form of
 * Fujiwara's bound 2·max_i |a_i / a_n|^(1/(n-i)) (Fujiwara 1916, "Über die obere Schranke des
 * absoluten Betrages der Wurzeln einer algebraischen Gleichung", recalled from memory).
 * Example: for x^2 - 2 it returns 2 (roots ±1.414 < 4).
 */
export function rootBoundExponent(p: IntPoly): number {
  const n = p.length - 1;
  if (n < 1) return 0;
  // |a_i| < 2^L_i and |a_n| >= 2^(L_n - 1), so |a_i/a_n|^(1/(n-i)) < 2^ceil((L_i - L_n + 1)/(n-i)).
  const ln = bitLength(p[n]);
  let best = -Infinity;
  for (let i = 0; i < n; i++) {
    if (p[i] === 0n) continue;
    best = Math.max(best, Math.ceil((bitLength(p[i]) - ln + 1) / (n - i)));
  }
  return best === -Infinity ? 0 : Math.max(0, best + 1);
}
