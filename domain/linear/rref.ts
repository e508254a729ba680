import { ZERO, div, isZero, mul, neg, sub, type Rational } from "../algebra/rational";
import { createMatrix, transpose, type Matrix } from "./matrix";

export interface RowEchelonForm {
  /** The reduced row echelon form: pivots are 1, zero above and below each pivot. */
  readonly matrix: Matrix;
  /** Column index of the pivot of each non-zero row, increasing. */
  readonly pivots: readonly number[];
}

/**
 * Reduced row echelon form by Gauss–Jordan elimination over ℚ (exact, no pivoting strategy needed).
 * Follows Strang, "Linear Algebra and Its Applications", 4th ed. (2006), §2.2.
 *
 * Example: rref([[2, 4], [1, 3]]) is the identity with pivots [0, 1]; rref([[1, 2], [2, 4]]) is [[1, 2], [0, 0]].
 */
export function rref(a: Matrix): RowEchelonForm {
  const m: Rational[][] = a.entries.map((r) => r.slice());
  const pivots: number[] = [];
  let r = 0;
  for (let c = 0; c < a.cols && r < a.rows; c++) {
    let p = r;
    while (p < a.rows && isZero(m[p][c])) p++;
    if (p === a.rows) continue;
    [m[r], m[p]] = [m[p], m[r]];
    const pivot = m[r][c];
    m[r] = m[r].map((x) => (isZero(x) ? x : div(x, pivot)));
    for (let i = 0; i < a.rows; i++) {
      if (i === r || isZero(m[i][c])) continue;
      const f = m[i][c];
      m[i] = m[i].map((x, j) => (isZero(m[r][j]) ? x : sub(x, mul(f, m[r][j]))));
    }
    pivots.push(c);
    r++;
  }
  return { matrix: createMatrix(a.rows, a.cols, (i, j) => m[i][j]), pivots };
}

/** Rank = number of pivots of the RREF. Example: rank([[1, 2], [2, 4]]) = 1. */
export const rank = (a: Matrix): number => rref(a).pivots.length;

/**
 * A basis of the (right) null space {v : Av = 0}, one vector per free column, read off the RREF
 * (Strang 2006, §2.2 "special solutions"). Each basis vector has a 1 at its free column.
 *
 * Example: nullspace([[1, 1]]) is [(-1, 1)].
 */
export function nullspace(a: Matrix): Rational[][] {
  const { matrix, pivots } = rref(a);
  const isPivot = new Set(pivots);
  const basis: Rational[][] = [];
  for (let free = 0; free < a.cols; free++) {
    if (isPivot.has(free)) continue;
    const v: Rational[] = new Array(a.cols).fill(ZERO);
    v[free] = { num: 1n, den: 1n };
    pivots.forEach((pc, row) => {
      const x = matrix.entries[row][free];
      if (!isZero(x)) v[pc] = neg(x);
    });
    basis.push(v);
  }
  return basis;
}

/**
 * A basis of the left kernel {y : yᵀA = 0}, i.e. the null space of Aᵀ. For a stoichiometric
 * matrix these are the conservation laws (Feinberg, Chem. Eng. Sci. 42 (1987), §2).
 *
 * Example: leftKernel([[-1], [1]]) is [(1, 1)].
 */
export const leftKernel = (a: Matrix): Rational[][] => nullspace(transpose(a));
