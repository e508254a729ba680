import { invMod } from "../field";
import type { Field } from "../field";
import { isHuge, lehmerGcd } from "../lehmer-gcd";
import { gcdBig } from "../rational";

/**
 * Coefficient arithmetic as the Gröbner engine sees it. A reduction step is
 * p := a·p − b·m·g with a·lc(p) = b·lc(g): over a field a = 1 (g is monic), over Z
 * (fraction-free, used for Q) a = lc(g)/d, b = lc(p)/d with d = gcd — common practice that avoids
 * rational arithmetic and its gcds in the inner loop.
 */
export interface EngineCoefficients<C> {
  readonly zero: C;
  readonly one: C;
  isZero(a: C): boolean;
  isOne(a: C): boolean;
  mul(a: C, b: C): C;
  /** x − b·y */
  mulSub(x: C, b: C, y: C): C;
  /** −b·y */
  negMul(b: C, y: C): C;
  /** [a, b] with a·lcp = b·lcg and a as small as possible; `tick` as for normalize. */
  reductionFactors(lcp: C, lcg: C, tick?: () => void): [C, C];
  /**
   * In place: monic (field) or primitive with positive leading coefficient (Z). `tick` is called
   * between coefficients where one call can be slow (a content gcd of huge integers).
   */
  normalize(coeffs: C[], tick?: () => void): void;
  /**
   * Terms merged per reduction step between two deadline checks of the kernel: large for Z/p,
   * where a term costs nanoseconds; small for bigints, where a term (and each step's gcd) can cost
   * microseconds to milliseconds as coefficients grow.
   */
  readonly termsPerTick: number;
}

/** Fields whose elements are JavaScript numbers (Z/p) do cheap arithmetic per term. */
const isNumberField = <C>(F: Field<C>): boolean => typeof F.zero === "number";

/** A field used directly (Z/p with numbers, or Q with Rationals). */
export function fieldCoefficients<C>(F: Field<C>): EngineCoefficients<C> {
  return {
    zero: F.zero,
    one: F.one,
    isZero: F.isZero,
    isOne: F.isOne,
    mul: F.mul,
    mulSub: (x, b, y) => F.sub(x, F.mul(b, y)),
    negMul: (b, y) => F.neg(F.mul(b, y)),
    reductionFactors: (lcp, lcg) => [F.one, F.isOne(lcg) ? lcp : F.div(lcp, lcg)],
    termsPerTick: isNumberField(F) ? 1 << 16 : 64,
    normalize(coeffs) {
      if (coeffs.length === 0 || F.isOne(coeffs[0])) return;
      const inv = F.inv(coeffs[0]);
      for (let i = 0; i < coeffs.length; i++) coeffs[i] = F.mul(coeffs[i], inv);
    },
  };
}

/** Z/p specialised on numbers: the inner loop inlines to a few float operations. */
export function primeCoefficients(p: number): EngineCoefficients<number> {
  const small = p < 2 ** 26;
  const mulMod = (a: number, b: number) => {
    if (small) return (a * b) % p;
    const ah = Math.floor(a / 65536);
    return (((ah * b) % p) * 65536 + (a - ah * 65536) * b) % p;
  };
  const inv = (a: number) => invMod(a, p);
  return {
    zero: 0,
    one: 1,
    isZero: (a) => a === 0,
    isOne: (a) => a === 1,
    mul: mulMod,
    mulSub(x, b, y) {
      const r = x - mulMod(b, y);
      return r < 0 ? r + p : r;
    },
    negMul(b, y) {
      const r = mulMod(b, y);
      return r === 0 ? 0 : p - r;
    },
    reductionFactors: (lcp, lcg) => [1, lcg === 1 ? lcp : mulMod(lcp, inv(lcg))],
    termsPerTick: 1 << 16,
    normalize(coeffs) {
      if (coeffs.length === 0 || coeffs[0] === 1) return;
      const c = inv(coeffs[0]);
      for (let i = 0; i < coeffs.length; i++) coeffs[i] = mulMod(coeffs[i], c);
    },
  };
}

/** gcd that, on huge operands, lets `tick` interrupt it between Lehmer rounds (seconds at 10^5 digits). */
function gcdTicking(a: bigint, b: bigint, tick: (() => void) | undefined): bigint {
  if (tick === undefined || !isHuge(a) || !isHuge(b)) return gcdBig(a, b);
  return lehmerGcd(a, b, gcdBig, tick);
}

/** Z with bigints, fraction-free; polynomials are kept primitive. */
export const integerCoefficients: EngineCoefficients<bigint> = {
  zero: 0n,
  one: 1n,
  isZero: (a) => a === 0n,
  isOne: (a) => a === 1n,
  mul: (a, b) => a * b,
  mulSub: (x, b, y) => x - b * y,
  negMul: (b, y) => -(b * y),
  reductionFactors(lcp, lcg, tick) {
    if (lcg === 1n) return [1n, lcp];
    if (lcp % lcg === 0n) return [1n, lcp / lcg];
    const d = gcdTicking(lcp, lcg, tick);
    let a = lcg / d, b = lcp / d;
    if (a < 0n) { a = -a; b = -b; }
    return [a, b];
  },
  termsPerTick: 64,
  normalize(coeffs, tick) {
    if (coeffs.length === 0) return;
    let g = 0n;
    for (let i = 0; i < coeffs.length; i++) {
      g = gcdTicking(g, coeffs[i], tick);
      if (g === 1n) break;
    }
    if (coeffs[0] < 0n) g = -g;
    if (g === 1n) return;
    for (let i = 0; i < coeffs.length; i++) coeffs[i] /= g;
  },
};
