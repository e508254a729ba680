/**
 * Public surface of the univariate tools over Q: dense polynomials, exact division, gcd,
 * square-free factorisation, Sturm counting, and exact real-root isolation and refinement.
 * Each function's docblock (at its definition) carries a worked example and its source.
 *
 * Example: the positive root of x^2 - 2, to float precision:
 *   const p = fromIntegerCoefficients([-2, 0, 1]);
 *   const [root] = isolateRealRoots(p, { positiveOnly: true }); // (1, 2), multiplicity 1
 *   approximateRoot(p, root); // 1.4142135623730951
 */
export type { IntPoly, RatPoly, UPoly } from "./dense";
export {
  fromIntegerCoefficients,
  fromRationalCoefficients,
  toRationalCoefficients,
  toIntegerPrimitive,
  content,
  degree,
  isZeroPoly,
  fromRoots,
  addInt,
  subInt,
  mulInt,
  scaleInt,
  addRat,
  subRat,
  mulRat,
  derivative,
  evaluate,
  signAt,
  reflect,
  formatPoly,
} from "./dense";
export { divRem, pseudoRemainder, divExactInt } from "./division";
export { gcd, primitivePart } from "./gcd";
export { type SquareFreeFactor, squareFreePart, squareFreeFactorization } from "./squarefree";
export { sturmSequence, countRealRootsSturm } from "./sturm";
export { signVariations, descartesCountUnitInterval, rootBoundExponent } from "./descartes";
export { type RootInterval, type IsolationOptions, isolateRealRoots, isExactRoot } from "./isolate";
export {
  type RefineOptions,
  refineRootInterval,
  approximateRoot,
  compareRootWithRational,
  floatToRational,
  rationalIntervalToFloat,
} from "./refine";
export { type RunLimits } from "./budget";
export { UnivariateError, type UnivariateReason } from "./errors";
