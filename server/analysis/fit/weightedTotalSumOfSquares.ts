/**
 * Σw(y − ȳ_w)² about the weighted mean: the residual sum of squares of a
 * flat line, used for R² and to test a fit against "no decay".
 */
export function weightedTotalSumOfSquares(y: ArrayLike<number>, w: ArrayLike<number>): number {
  let sw = 0;
  let swy = 0;
  for (let i = 0; i < y.length; i++) {
    sw += w[i];
    swy += w[i] * y[i];
  }
  const mean = swy / sw;
  let tss = 0;
  for (let i = 0; i < y.length; i++) tss += w[i] * (y[i] - mean) ** 2;
  return tss;
}
