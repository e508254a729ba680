import { fromTerms } from "../algebra/index";
import type { QPoly, QRing } from "./kinetics";

/**
 * Saturation I : f^∞ (Cox, Little & O'Shea, ch. 4 §4, Theorem 14) and moving polynomials between
 * rings by variable name come from the algebra engine; re-exported here under the names this layer uses.
 * With f the product of the species, saturation removes every boundary component: positive steady states only.
 */
export { saturate, moveToRing as mapToRing } from "../algebra/index";

/** Product of the given variables (by 0-based index) as a polynomial. Example: [0, 2] in Q[x, y, z] is x*z. */
export function monomialOf(ring: QRing, indices: readonly number[]): QPoly {
  const e = new Array<number>(ring.n).fill(0);
  for (const i of indices) e[i] += 1;
  return fromTerms(ring, [{ coeff: ring.field.one, exponents: e }]);
}
