/**
 * Exact linear algebra over ℚ (bigint rationals from domain/algebra/rational): dense matrices,
 * reduced row echelon form, rank, kernels, primitive integer vectors, and the extreme rays of
 * the non-negative left kernel (minimal semi-positive conservation laws).
 */
export {
  type Matrix,
  createMatrix,
  matrixFromIntegers,
  matrixFromRationals,
  zeroMatrix,
  identityMatrix,
  transpose,
  multiply,
  vectorTimesMatrix,
  matrixTimesVector,
  isZeroVector,
  isZeroMatrix,
  matrixToStrings,
} from "./matrix";
export { type RowEchelonForm, rref, rank, nullspace, leftKernel } from "./rref";
export { primitiveIntegerVector, primitiveOfIntegers } from "./primitive";
export { type ExtremeRayOptions, nonNegativeLeftKernelRays } from "./extreme-rays";
export { LinearBudgetError } from "./errors";
