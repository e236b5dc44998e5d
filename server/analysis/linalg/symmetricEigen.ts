import { identity, type Matrix } from "./matrix.ts";

export interface SymmetricEigen {
  /** Eigenvalues, ascending. */
  values: number[];
  /** Eigenvectors as columns: vectors[i][k] is component i of eigenvector k. */
  vectors: Matrix;
}

/**
 * Eigen-decomposition of a small symmetric matrix by the cyclic Jacobi method.
 * Source: Golub & Van Loan, Matrix Computations, §8.5 (Jacobi methods).
 */
export function symmetricEigen(a: Matrix): SymmetricEigen {
  const n = a.length;
  const m = a.map((r) => r.slice());
  const v = identity(n);
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) off += m[i][j] * m[i][j];
    if (off < 1e-30) break;
    for (let p = 0; p < n; p++)
      for (let q = p + 1; q < n; q++) {
        if (m[p][q] === 0) continue;
        const theta = (m[q][q] - m[p][p]) / (2 * m[p][q]);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const mkp = m[k][p];
          const mkq = m[k][q];
          m[k][p] = c * mkp - s * mkq;
          m[k][q] = s * mkp + c * mkq;
        }
        for (let k = 0; k < n; k++) {
          const mpk = m[p][k];
          const mqk = m[q][k];
          m[p][k] = c * mpk - s * mqk;
          m[q][k] = s * mpk + c * mqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = v[k][p];
          const vkq = v[k][q];
          v[k][p] = c * vkp - s * vkq;
          v[k][q] = s * vkp + c * vkq;
        }
      }
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => m[i][i] - m[j][j]);
  return {
    values: order.map((i) => m[i][i]),
    vectors: v.map((row) => order.map((i) => row[i])),
  };
}
