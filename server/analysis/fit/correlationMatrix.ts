import type { Matrix } from "../linalg/matrix.ts";

/** A square matrix over named parameters (rows and columns in the order of `names`). */
export interface NamedMatrix {
  names: string[];
  matrix: Matrix;
}

/**
 * Correlation matrix ρ_ij = Σ_ij/√(Σ_ii Σ_jj) from a covariance; null when a
 * variance is not positive (e.g. a noise-free fit with RSS = 0).
 */
export function correlationMatrix(covariance: NamedMatrix): NamedMatrix | null {
  const m = covariance.matrix;
  const n = m.length;
  const sd: number[] = [];
  for (let i = 0; i < n; i++) {
    const v = Math.sqrt(m[i][i]);
    if (!(v > 0 && Number.isFinite(v))) return null;
    sd.push(v);
  }
  const matrix: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row: number[] = [];
    for (let j = 0; j < n; j++) row.push(i === j ? 1 : Math.max(-1, Math.min(1, m[i][j] / (sd[i] * sd[j]))));
    matrix.push(row);
  }
  return { names: covariance.names.slice(), matrix };
}
