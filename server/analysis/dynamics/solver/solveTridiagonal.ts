/**
 * Solve a tridiagonal system in place by the Thomas algorithm (Gaussian
 * elimination without pivoting; stable for the diagonally dominant matrices
 * of implicit diffusion steps). `lower[0]` and `upper[n-1]` are ignored.
 * `scratch` must hold n numbers; the answer is written to `out`.
 * Source: Press et al., Numerical Recipes, 3rd ed. 2007, §2.4.
 */
export function solveTridiagonal(
  lower: Float64Array,
  diagonal: Float64Array,
  upper: Float64Array,
  rhs: Float64Array,
  out: Float64Array,
  scratch: Float64Array,
): void {
  const n = diagonal.length;
  let beta = diagonal[0];
  if (beta === 0) throw new RangeError("solveTridiagonal: zero pivot in row 0");
  out[0] = rhs[0] / beta;
  for (let i = 1; i < n; i++) {
    scratch[i] = upper[i - 1] / beta;
    beta = diagonal[i] - lower[i] * scratch[i];
    if (beta === 0) throw new RangeError(`solveTridiagonal: zero pivot in row ${i}`);
    out[i] = (rhs[i] - lower[i] * out[i - 1]) / beta;
  }
  for (let i = n - 2; i >= 0; i--) out[i] -= scratch[i + 1] * out[i + 1];
}
