import { type IntPoly, type UPoly, content, degree, toIntegerPrimitive } from "./dense";
import { type RunLimits, checkLimits } from "./budget";
import { pseudoRemainder } from "./division";

/**
 * Greatest common divisor over Q, returned in integer primitive form with a positive leading
 * coefficient (so it is unique); gcd(0, 0) is 0 (`[]`).
 * Example: gcd(x^2 - 1, 2x^2 + 4x + 2) is x + 1.
 * Follows the primitive polynomial remainder sequence over Z (Collins 1967, "Subresultants and
 * reduced polynomial remainder sequences"; Knuth, TAOCP vol. 2, Algorithm E, recalled from
 * memory): pseudo-remainders with the content removed at every step keep coefficients small.
 */
export function gcd(a: UPoly, b: UPoly, limits?: RunLimits): IntPoly {
  let p = toIntegerPrimitive(a);
  let q = toIntegerPrimitive(b);
  if (p.length === 0) return q;
  if (q.length === 0) return p;
  if (degree(p) < degree(q)) [p, q] = [q, p];
  for (;;) {
    checkLimits(limits, "polynomial gcd");
    if (degree(q) === 0) return [1n];
    const r = pseudoRemainder(p, q);
    if (r.length === 0) return q;
    p = q;
    q = primitivePart(r);
  }
}

/**
 * The polynomial divided by its content, leading coefficient made positive.
 * Example: primitivePart([-4n, -6n]) (-6x - 4) is 3x + 2.
 */
export function primitivePart(p: IntPoly): IntPoly {
  if (p.length === 0) return p;
  let g = content(p);
  if (p[p.length - 1] < 0n) g = -g;
  return g === 1n ? p : p.map((c) => c / g);
}
