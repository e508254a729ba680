import { type Rational, div as divQ, mul as mulQ, sub as subQ, ZERO } from "../rational";
import type { IntPoly, RatPoly } from "./dense";
import { UnivariateError } from "./errors";

/**
 * Euclidean division over Q: a = quotient·b + remainder with deg remainder < deg b.
 * Example: divRem(x^3 - 1, x - 1) gives quotient x^2 + x + 1 and remainder 0.
 * Follows the schoolbook long division (Knuth, TAOCP vol. 2, Algorithm D for polynomials,
 * recalled from memory).
 */
export function divRem(a: RatPoly, b: RatPoly): { quotient: RatPoly; remainder: RatPoly } {
  if (b.length === 0) throw new UnivariateError("division-by-zero", "divRem: divisor is the zero polynomial");
  const r: Rational[] = [...a];
  const db = b.length - 1;
  const lead = b[db];
  if (r.length - 1 < db) return { quotient: [], remainder: trim(r) };
  const q: Rational[] = new Array(r.length - db).fill(ZERO);
  for (let k = r.length - 1 - db; k >= 0; k--) {
    const c = r[k + db];
    if (c.num === 0n) continue;
    const t = divQ(c, lead);
    q[k] = t;
    for (let j = 0; j <= db; j++) r[k + j] = subQ(r[k + j], mulQ(t, b[j]));
  }
  r.length = db;
  return { quotient: trim(q), remainder: trim(r) };
}

function trim<T extends { num: bigint }>(c: T[]): T[] {
  let n = c.length;
  while (n > 0 && c[n - 1].num === 0n) n--;
  c.length = n;
  return c;
}

function trimInt(c: bigint[]): bigint[] {
  let n = c.length;
  while (n > 0 && c[n - 1] === 0n) n--;
  c.length = n;
  return c;
}

/**
 * Pseudo-remainder over Z: prem(a, b) = remainder of lc(b)^(deg a - deg b + 1)·a by b, an integer
 * polynomial. Example: prem(x^2 + 1, 2x + 1) is 5 (4x^2 + 4 = (2x - 1)(2x + 1) + 5).
 * Follows Knuth, TAOCP vol. 2, Algorithm R (recalled from memory).
 */
export function pseudoRemainder(a: IntPoly, b: IntPoly): IntPoly {
  if (b.length === 0) throw new UnivariateError("division-by-zero", "pseudoRemainder: divisor is the zero polynomial");
  const db = b.length - 1;
  const lead = b[db];
  const r = [...a];
  let steps = r.length - 1 - db + 1;
  if (steps <= 0) return trimInt(r);
  while (r.length - 1 >= db && r.length > 0) {
    const shift = r.length - 1 - db;
    const c = r[r.length - 1];
    for (let i = 0; i < r.length; i++) r[i] *= lead;
    for (let j = 0; j <= db; j++) r[shift + j] -= c * b[j];
    trimInt(r);
    steps--;
  }
  if (steps > 0) {
    const f = lead ** BigInt(steps);
    for (let i = 0; i < r.length; i++) r[i] *= f;
  }
  return r;
}

/**
 * Exact quotient a / b of integer polynomials when b divides a and the quotient is integral
 * (always so when b is primitive, by Gauss's lemma); throws "not-exact" otherwise.
 * Example: divExactInt(x^2 - 1, x + 1) is x - 1.
 */
export function divExactInt(a: IntPoly, b: IntPoly): IntPoly {
  if (b.length === 0) throw new UnivariateError("division-by-zero", "divExactInt: divisor is the zero polynomial");
  if (a.length === 0) return [];
  const db = b.length - 1;
  const lead = b[db];
  const r = [...a];
  if (r.length - 1 < db) throw new UnivariateError("not-exact", "divExactInt: divisor has higher degree");
  const q: bigint[] = new Array(r.length - db).fill(0n);
  for (let k = r.length - 1 - db; k >= 0; k--) {
    const c = r[k + db];
    if (c === 0n) continue;
    if (c % lead !== 0n) throw new UnivariateError("not-exact", "divExactInt: quotient is not integral");
    const t = c / lead;
    q[k] = t;
    for (let j = 0; j <= db; j++) r[k + j] -= t * b[j];
  }
  for (let i = 0; i < db; i++) {
    if (r[i] !== 0n) throw new UnivariateError("not-exact", "divExactInt: nonzero remainder");
  }
  return trimInt(q);
}
