import { zeros, type Matrix } from "./matrix.ts";

/**
 * Lower-triangular L with A = L Lᵀ for a symmetric positive-definite A, or
 * null when A is not positive definite (a non-positive pivot).
 * Source: Golub & Van Loan, Matrix Computations, §4.2.
 */
export function cholesky(a: Matrix): Matrix | null {
  const n = a.length;
  const l = zeros(n, n);
  for (let j = 0; j < n; j++) {
    let d = a[j][j];
    for (let k = 0; k < j; k++) d -= l[j][k] * l[j][k];
    if (!(d > 0)) return null;
    l[j][j] = Math.sqrt(d);
    for (let i = j + 1; i < n; i++) {
      let s = a[i][j];
      for (let k = 0; k < j; k++) s -= l[i][k] * l[j][k];
      l[i][j] = s / l[j][j];
    }
  }
  return l;
}
