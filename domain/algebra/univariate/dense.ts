import {
  type Rational,
  add as addQ,
  fromInt,
  gcdBig,
  isZero as isZeroQ,
  mul as mulQ,
  neg as negQ,
  rational,
  sub as subQ,
  ZERO,
} from "../rational";
import { UnivariateError } from "./errors";

/**
 * Dense univariate polynomials, coefficients listed from the constant term upwards.
 * Normalised: no trailing (highest-degree) zeros, so the zero polynomial is `[]` and
 * `p.length - 1` is the degree. Two flavours share the layout:
 * - `IntPoly`: integer coefficients (bigint), the working form of gcd, Sturm and root isolation;
 * - `RatPoly`: rational coefficients, the form of exact division over Q.
 */
export type IntPoly = readonly bigint[];
export type RatPoly = readonly Rational[];
/** Either flavour; functions taking it tell them apart by the coefficient type. */
export type UPoly = IntPoly | RatPoly;

const isIntPoly = (p: UPoly): p is IntPoly => p.length === 0 || typeof p[0] === "bigint";

function trimInt(c: bigint[]): bigint[] {
  let n = c.length;
  while (n > 0 && c[n - 1] === 0n) n--;
  c.length = n;
  return c;
}

function trimRat(c: Rational[]): Rational[] {
  let n = c.length;
  while (n > 0 && c[n - 1].num === 0n) n--;
  c.length = n;
  return c;
}

/**
 * Integer polynomial from coefficients, constant term first; trailing zeros dropped.
 * Example: fromIntegerCoefficients([-2, 0, 1]) is x^2 - 2.
 */
export function fromIntegerCoefficients(coeffs: readonly (bigint | number)[]): IntPoly {
  return trimInt(
    coeffs.map((c) => {
      if (typeof c === "number" && !Number.isSafeInteger(c)) {
        throw new UnivariateError("invalid-argument", `coefficient ${c} is not a safe integer`);
      }
      return BigInt(c);
    }),
  );
}

/**
 * Rational polynomial from coefficients, constant term first; trailing zeros dropped.
 * Example: fromRationalCoefficients([1/2, 0, 1, 0]) is x^2 + 1/2 (degree 2).
 */
export function fromRationalCoefficients(coeffs: readonly Rational[]): RatPoly {
  return trimRat(coeffs.map((c) => rational(c.num, c.den)));
}

/** Rational copy of a polynomial. Example: toRationalCoefficients([1n, 2n]) is [1, 2] as rationals. */
export function toRationalCoefficients(p: UPoly): RatPoly {
  return isIntPoly(p) ? p.map((c) => fromInt(c)) : p;
}

/** Gcd of the coefficients, nonnegative (0 for the zero polynomial). Example: content([4n, 6n]) is 2n. */
export function content(p: IntPoly): bigint {
  let g = 0n;
  for (const c of p) {
    g = gcdBig(g, c);
    if (g === 1n) break;
  }
  return g;
}

/**
 * Integer primitive form of a polynomial over Q: denominators cleared, divided by the content,
 * leading coefficient positive; it has the same roots and differs by a nonzero rational factor.
 * The zero polynomial stays `[]`.
 * Example: toIntegerPrimitive([-1/2, 0, -3/4]) (that is -3/4 x^2 - 1/2) is 3x^2 + 2.
 */
export function toIntegerPrimitive(p: UPoly): IntPoly {
  let ints: bigint[];
  if (isIntPoly(p)) {
    ints = trimInt([...p]);
  } else {
    let l = 1n;
    for (const c of p) l = (l / gcdBig(l, c.den)) * c.den;
    ints = trimInt(p.map((c) => c.num * (l / c.den)));
  }
  if (ints.length === 0) return ints;
  let g = content(ints);
  if (ints[ints.length - 1] < 0n) g = -g;
  return g === 1n ? ints : ints.map((c) => c / g);
}

/** Degree, -1 for the zero polynomial. Example: degree([1n, 0n, 3n]) is 2. */
export const degree = (p: UPoly): number => p.length - 1;

/** True for the zero polynomial `[]`. Example: isZeroPoly(fromIntegerCoefficients([0])) is true. */
export const isZeroPoly = (p: UPoly): boolean => p.length === 0;

/**
 * The polynomial with the given roots, repeated as listed, in integer primitive form:
 * Π (den_i x - num_i). Example: fromRoots([1/2, 3]) is 2x^2 - 7x + 3.
 */
export function fromRoots(roots: readonly Rational[]): IntPoly {
  let p: IntPoly = [1n];
  for (const r of roots) p = mulInt(p, [-r.num, r.den]);
  return toIntegerPrimitive(p);
}

/** Sum of integer polynomials. Example: addInt([1n], [0n, 1n]) is x + 1. */
export function addInt(a: IntPoly, b: IntPoly): IntPoly {
  const out: bigint[] = [];
  for (let i = 0; i < Math.max(a.length, b.length); i++) out.push((a[i] ?? 0n) + (b[i] ?? 0n));
  return trimInt(out);
}

/** Difference of integer polynomials. Example: subInt([0n, 1n], [1n]) is x - 1. */
export function subInt(a: IntPoly, b: IntPoly): IntPoly {
  const out: bigint[] = [];
  for (let i = 0; i < Math.max(a.length, b.length); i++) out.push((a[i] ?? 0n) - (b[i] ?? 0n));
  return trimInt(out);
}

/** Product of integer polynomials (schoolbook). Example: mulInt([-1n, 1n], [1n, 1n]) is x^2 - 1. */
export function mulInt(a: IntPoly, b: IntPoly): IntPoly {
  if (a.length === 0 || b.length === 0) return [];
  const out: bigint[] = new Array(a.length + b.length - 1).fill(0n);
  for (let i = 0; i < a.length; i++) {
    if (a[i] === 0n) continue;
    for (let j = 0; j < b.length; j++) out[i + j] += a[i] * b[j];
  }
  return trimInt(out);
}

/** Integer polynomial times an integer. Example: scaleInt([1n, 2n], -3n) is -6x - 3. */
export function scaleInt(p: IntPoly, k: bigint): IntPoly {
  return k === 0n ? [] : p.map((c) => c * k);
}

/** Sum of rational polynomials. Example: addRat([1/2], [1/2, 1]) is x + 1. */
export function addRat(a: RatPoly, b: RatPoly): RatPoly {
  const out: Rational[] = [];
  for (let i = 0; i < Math.max(a.length, b.length); i++) out.push(addQ(a[i] ?? ZERO, b[i] ?? ZERO));
  return trimRat(out);
}

/** Difference of rational polynomials. Example: subRat([1], [1, 1]) is -x. */
export function subRat(a: RatPoly, b: RatPoly): RatPoly {
  const out: Rational[] = [];
  for (let i = 0; i < Math.max(a.length, b.length); i++) out.push(subQ(a[i] ?? ZERO, b[i] ?? ZERO));
  return trimRat(out);
}

/** Product of rational polynomials. Example: mulRat([1/2, 1], [-1/2, 1]) is x^2 - 1/4. */
export function mulRat(a: RatPoly, b: RatPoly): RatPoly {
  if (a.length === 0 || b.length === 0) return [];
  const out: Rational[] = new Array(a.length + b.length - 1).fill(ZERO);
  for (let i = 0; i < a.length; i++) {
    if (isZeroQ(a[i])) continue;
    for (let j = 0; j < b.length; j++) out[i + j] = addQ(out[i + j], mulQ(a[i], b[j]));
  }
  return trimRat(out);
}

/**
 * Formal derivative, in the flavour it was given.
 * Example: derivative([1n, 0n, 0n, 2n]) (2x^3 + 1) is [0n, 0n, 6n] (6x^2).
 */
export function derivative(p: IntPoly): IntPoly;
export function derivative(p: RatPoly): RatPoly;
export function derivative(p: UPoly): UPoly;
export function derivative(p: UPoly): UPoly {
  if (isIntPoly(p)) return trimInt(p.slice(1).map((c, i) => c * BigInt(i + 1)));
  return trimRat(p.slice(1).map((c, i) => mulQ(c, fromInt(i + 1))));
}

/**
 * Homogenised Horner value b^n·p(a/b) for an integer polynomial of degree n, b > 0: an integer
 * with the sign of p(a/b), computed without any division (common practice).
 * Example: homogeneousValue(x^2 - 2, 3/2) is 1 (= 2^2·(9/4 - 2)).
 */
export function homogeneousValue(p: IntPoly, x: Rational): bigint {
  const n = p.length - 1;
  if (n < 0) return 0n;
  let v = p[n];
  let bPow = 1n;
  for (let i = n - 1; i >= 0; i--) {
    bPow *= x.den;
    v = v * x.num + p[i] * bPow;
  }
  return v;
}

/**
 * Exact value at a rational point. Example: evaluate([-2n, 0n, 1n], 3/2) is 1/4.
 */
export function evaluate(p: UPoly, x: Rational): Rational {
  if (isIntPoly(p)) {
    return rational(homogeneousValue(p, x), x.den ** BigInt(Math.max(p.length - 1, 0)));
  }
  let v: Rational = ZERO;
  for (let i = p.length - 1; i >= 0; i--) v = addQ(mulQ(v, x), p[i]);
  return v;
}

/**
 * Sign of the value at a rational point, exactly. Example: signAt([-2n, 0n, 1n], 7/5) is -1
 * (49/25 < 2).
 */
export function signAt(p: UPoly, x: Rational): -1 | 0 | 1 {
  const v = isIntPoly(p) ? homogeneousValue(p, x) : evaluate(p, x).num;
  return v > 0n ? 1 : v < 0n ? -1 : 0;
}

/** Negated polynomial, p(x) -> -p(x). Example: negateRat([1, -1/2]) is [-1, 1/2]. */
export function negateRat(p: RatPoly): RatPoly {
  return p.map(negQ);
}

/** p(-x) for an integer polynomial. Example: reflect([1n, 2n, 3n]) is 3x^2 - 2x + 1. */
export function reflect(p: IntPoly): IntPoly {
  return p.map((c, i) => (i % 2 === 1 ? -c : c));
}

/** Readable text, highest term first, for messages and test names. Example: "x^2 - 2". */
export function formatPoly(p: UPoly, variable = "x"): string {
  const q = toRationalCoefficients(p);
  if (q.length === 0) return "0";
  const parts: string[] = [];
  for (let i = q.length - 1; i >= 0; i--) {
    const c = q[i];
    if (c.num === 0n) continue;
    const negative = c.num < 0n;
    const absText = c.den === 1n ? `${negative ? -c.num : c.num}` : `${negative ? -c.num : c.num}/${c.den}`;
    const mono = i === 0 ? "" : i === 1 ? variable : `${variable}^${i}`;
    const body = mono === "" ? absText : absText === "1" ? mono : `${absText}*${mono}`;
    parts.push(parts.length === 0 ? (negative ? `-${body}` : body) : `${negative ? "- " : "+ "}${body}`);
  }
  return parts.join(" ");
}
