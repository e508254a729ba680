import { ONE, ZERO, add, fromInt, isZero, mul, formatRational, type Rational } from "../algebra/rational";

/**
 * A dense matrix of exact rationals, stored row by row. `rows`/`cols` are kept explicitly so
 * that empty shapes (0 × n, m × 0) keep their other dimension.
 *
 * Example: matrixFromIntegers([[1, -1], [0, 2]]) is the 2 × 2 matrix with rows (1, -1), (0, 2).
 */
export interface Matrix {
  readonly rows: number;
  readonly cols: number;
  readonly entries: readonly (readonly Rational[])[];
}

/** Builds a rows × cols matrix from an entry function. Example: createMatrix(2, 2, (i, j) => i === j ? ONE : ZERO) is I₂. */
export function createMatrix(rows: number, cols: number, entry: (i: number, j: number) => Rational): Matrix {
  const entries: Rational[][] = [];
  for (let i = 0; i < rows; i++) {
    const row: Rational[] = [];
    for (let j = 0; j < cols; j++) row.push(entry(i, j));
    entries.push(row);
  }
  return { rows, cols, entries };
}

/** Matrix from integer rows; `cols` is needed only when there are no rows. Example: matrixFromIntegers([[1, 2]]) is 1 × 2. */
export function matrixFromIntegers(data: readonly (readonly (number | bigint)[])[], cols?: number): Matrix {
  const c = cols ?? (data.length > 0 ? data[0].length : 0);
  data.forEach((row, i) => {
    if (row.length !== c) throw new RangeError(`matrixFromIntegers: row ${i + 1} has ${row.length} entries, expected ${c}`);
  });
  return createMatrix(data.length, c, (i, j) => fromInt(data[i][j]));
}

/** Matrix from rational rows. Example: matrixFromRationals([[ONE]]) is 1 × 1. */
export function matrixFromRationals(data: readonly (readonly Rational[])[], cols?: number): Matrix {
  const c = cols ?? (data.length > 0 ? data[0].length : 0);
  return createMatrix(data.length, c, (i, j) => data[i][j]);
}

/** The rows × cols zero matrix. Example: zeroMatrix(0, 3) is an empty matrix that still has 3 columns. */
export const zeroMatrix = (rows: number, cols: number): Matrix => createMatrix(rows, cols, () => ZERO);
/** The n × n identity. Example: identityMatrix(2) is [[1, 0], [0, 1]]. */
export const identityMatrix = (n: number): Matrix => createMatrix(n, n, (i, j) => (i === j ? ONE : ZERO));

/** Transpose. Example: transpose of the 1 × 2 matrix (1 2) is the 2 × 1 column (1; 2). */
export function transpose(a: Matrix): Matrix {
  return createMatrix(a.cols, a.rows, (i, j) => a.entries[j][i]);
}

/** Matrix product A·B. Example: (1 2)·(3; 4) = (11). */
export function multiply(a: Matrix, b: Matrix): Matrix {
  if (a.cols !== b.rows) throw new RangeError(`multiply: ${a.rows}×${a.cols} times ${b.rows}×${b.cols}`);
  return createMatrix(a.rows, b.cols, (i, j) => {
    let s = ZERO;
    for (let k = 0; k < a.cols; k++) {
      const x = a.entries[i][k];
      const y = b.entries[k][j];
      if (!isZero(x) && !isZero(y)) s = add(s, mul(x, y));
    }
    return s;
  });
}

/** Row vector times matrix, yᵀA. Example: (1 1)·[[1,-1],[0,1]] = (1 0). */
export function vectorTimesMatrix(y: readonly Rational[], a: Matrix): Rational[] {
  if (y.length !== a.rows) throw new RangeError(`vectorTimesMatrix: vector of ${y.length} against ${a.rows} rows`);
  const out: Rational[] = [];
  for (let j = 0; j < a.cols; j++) {
    let s = ZERO;
    for (let i = 0; i < a.rows; i++) if (!isZero(y[i]) && !isZero(a.entries[i][j])) s = add(s, mul(y[i], a.entries[i][j]));
    out.push(s);
  }
  return out;
}

/** Matrix times column vector, Av. Example: [[1,1]]·(2; -2) = (0). */
export function matrixTimesVector(a: Matrix, v: readonly Rational[]): Rational[] {
  return vectorTimesMatrix(v, transpose(a));
}

/** Whether every entry is 0. Example: isZeroVector([0, 0]) is true. */
export const isZeroVector = (v: readonly Rational[]): boolean => v.every(isZero);
/** Whether every entry is 0. Example: isZeroMatrix(zeroMatrix(2, 2)) is true. */
export const isZeroMatrix = (a: Matrix): boolean => a.entries.every((r) => r.every(isZero));

/** Entries as canonical strings, for JSON output. Example: [[1/2, -3]] → [["1/2", "-3"]]. */
export const matrixToStrings = (a: Matrix): string[][] => a.entries.map((r) => r.map(formatRational));
