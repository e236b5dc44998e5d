import { zeros, type Matrix } from "./matrix.ts";
import { symmetricEigen } from "./symmetricEigen.ts";

export interface SymmetricInverse {
  inverse: Matrix;
  /** Ratio of largest to smallest eigenvalue magnitude (Infinity when singular). */
  conditionNumber: number;
}

/**
 * Inverse of a symmetric positive semi-definite matrix (e.g. JᵀJ or a
 * covariance) through its eigen-decomposition. Returns null when the matrix
 * is singular or its condition number exceeds `maxCondition`, so callers can
 * report "ill-conditioned" instead of printing meaningless standard errors.
 */
export function invertSymmetric(a: Matrix, maxCondition = 1e14): SymmetricInverse | null {
  const n = a.length;
  if (n === 0) return { inverse: [], conditionNumber: 1 };
  // Scale to unit diagonal first: parameters in µm and a.u. differ by orders of magnitude.
  const d = a.map((row, i) => (row[i] > 0 ? 1 / Math.sqrt(row[i]) : NaN));
  if (d.some((v) => !Number.isFinite(v))) return null;
  const scaled = a.map((row, i) => row.map((v, j) => v * d[i] * d[j]));
  const { values, vectors } = symmetricEigen(scaled);
  const largest = Math.max(...values.map(Math.abs));
  const smallest = values[0];
  if (!(smallest > 0)) return null;
  const conditionNumber = largest / smallest;
  if (conditionNumber > maxCondition) return null;
  const inv = zeros(n, n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += (vectors[i][k] * vectors[j][k]) / values[k];
      inv[i][j] = s * d[i] * d[j];
    }
  return { inverse: inv, conditionNumber };
}
