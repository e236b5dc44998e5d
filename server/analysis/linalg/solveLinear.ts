import type { Matrix } from "./matrix.ts";

/**
 * Solve A x = b by Gaussian elimination with partial pivoting.
 * Returns null when A is singular to working precision (a pivot below
 * 1e-14 × the largest entry), so callers can report "ill-conditioned".
 */
export function solveLinear(a: Matrix, b: ArrayLike<number>): number[] | null {
  const n = a.length;
  const m = a.map((row) => row.slice());
  const x = Array.from(b);
  let scale = 0;
  for (const row of m) for (const v of row) scale = Math.max(scale, Math.abs(v));
  if (scale === 0 || !Number.isFinite(scale)) return null;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[pivot][col])) pivot = r;
    if (Math.abs(m[pivot][col]) <= 1e-14 * scale) return null;
    if (pivot !== col) {
      [m[pivot], m[col]] = [m[col], m[pivot]];
      [x[pivot], x[col]] = [x[col], x[pivot]];
    }
    for (let r = col + 1; r < n; r++) {
      const f = m[r][col] / m[col][col];
      if (f === 0) continue;
      for (let c = col; c < n; c++) m[r][c] -= f * m[col][c];
      x[r] -= f * x[col];
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    let s = x[r];
    for (let c = r + 1; c < n; c++) s -= m[r][c] * x[c];
    x[r] = s / m[r][r];
  }
  return x;
}
