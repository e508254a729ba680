import type { Rational } from "@domain/algebra/rational";

/** |r| as a float, for coarse test checks only. */
export const abs = (r: Rational): number => Math.abs(Number(r.num) / Number(r.den));
