/**
 * Small dense float matrices as plain `number[][]` (row-major). Floats are for numerics only
 * (eigenvalues, Newton, trajectories); exact algebra lives in domain/algebra.
 */
export type Matrix = number[][];
export type Vector = number[];

export const zeros = (rows: number, cols: number): Matrix =>
  Array.from({ length: rows }, () => new Array<number>(cols).fill(0));

export const identity = (n: number): Matrix => {
  const m = zeros(n, n);
  for (let i = 0; i < n; i++) m[i][i] = 1;
  return m;
};

export const transpose = (a: Matrix): Matrix =>
  a.length === 0 ? [] : a[0].map((_, j) => a.map((row) => row[j]));

export function matMul(a: Matrix, b: Matrix): Matrix {
  const n = a.length;
  const k = b.length;
  const m = k === 0 ? 0 : b[0].length;
  const c = zeros(n, m);
  for (let i = 0; i < n; i++)
    for (let l = 0; l < k; l++) {
      const ail = a[i][l];
      if (ail === 0) continue;
      for (let j = 0; j < m; j++) c[i][j] += ail * b[l][j];
    }
  return c;
}

export const matVec = (a: Matrix, x: Vector): Vector =>
  a.map((row) => row.reduce((s, v, j) => s + v * x[j], 0));

export const norm2 = (x: Vector): number => Math.sqrt(x.reduce((s, v) => s + v * v, 0));
export const normInf = (x: Vector): number => x.reduce((s, v) => Math.max(s, Math.abs(v)), 0);

/**
 * Solves A x = b by LU with partial pivoting; null when A is numerically singular.
 * Example: solveLinear([[2,0],[0,4]], [2,2]) is [1, 0.5]. (Golub & Van Loan, Matrix Computations, §3.4.)
 */
export function solveLinear(a: Matrix, b: Vector): Vector | null {
  const n = a.length;
  const m = a.map((row, i) => [...row, b[i]]);
  const scale = Math.max(1e-300, ...a.map((row) => normInf(row)));
  for (let col = 0; col < n; col++) {
    let piv = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[piv][col])) piv = r;
    if (Math.abs(m[piv][col]) <= 1e-14 * scale) return null;
    if (piv !== col) [m[piv], m[col]] = [m[col], m[piv]];
    for (let r = col + 1; r < n; r++) {
      const f = m[r][col] / m[col][col];
      if (f === 0) continue;
      for (let c = col; c <= n; c++) m[r][c] -= f * m[col][c];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let c = r + 1; c < n; c++) s -= m[r][c] * x[c];
    x[r] = s / m[r][r];
  }
  return x;
}

/**
 * An orthonormal basis (as columns of an n×r matrix) of the column space of `a`, by modified
 * Gram–Schmidt with re-orthogonalisation; columns whose residual is below `tol`·‖a‖ are dropped.
 * Example: orthonormalColumnBasis([[1,2],[1,2]]) has one column (1/√2, 1/√2).
 * (Golub & Van Loan, Matrix Computations, §5.2.8.)
 */
export function orthonormalColumnBasis(a: Matrix, tol = 1e-10): Matrix {
  const n = a.length;
  if (n === 0) return [];
  const cols = transpose(a);
  const scale = Math.max(1e-300, ...cols.map(norm2));
  const basis: Vector[] = [];
  for (const col of cols) {
    let v = [...col];
    for (let pass = 0; pass < 2; pass++)
      for (const q of basis) {
        const d = q.reduce((s, qi, i) => s + qi * v[i], 0);
        v = v.map((vi, i) => vi - d * q[i]);
      }
    const len = norm2(v);
    if (len > tol * scale) basis.push(v.map((vi) => vi / len));
  }
  return Array.from({ length: n }, (_, i) => basis.map((q) => q[i]));
}
