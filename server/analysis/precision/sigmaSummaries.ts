/*
 * Summary numbers of a σ_x curve in which masked positions are NaN. Each
 * returns NaN when undefined, so a bootstrap replicate can be dropped by the
 * bootstrap interval rather than stopping the run.
 */

/** Smallest σ_x between two grid indices (inclusive) and its index. */
export function minimumSigma(sigmaX: ArrayLike<number>, startIndex: number, endIndex: number): { value: number; index: number } {
  let value = NaN;
  let index = -1;
  for (let k = startIndex; k <= endIndex; k++) if (sigmaX[k] < value || (index < 0 && sigmaX[k] >= 0)) [value, index] = [sigmaX[k], k];
  return { value, index };
}

/** σ_x at a position by linear interpolation between its grid neighbours; NaN outside the grid or next to a masked point. */
export function sigmaAt(gridX: ArrayLike<number>, sigmaX: ArrayLike<number>, position: number): number {
  const g = gridX.length;
  const tolerance = 1e-9 * (gridX[g - 1] - gridX[0]);
  if (position < gridX[0] - tolerance || position > gridX[g - 1] + tolerance) return NaN;
  let k = 0;
  while (k < g - 2 && gridX[k + 1] <= position) k++;
  const t = Math.min(1, Math.max(0, (position - gridX[k]) / (gridX[k + 1] - gridX[k])));
  if (t === 0) return sigmaX[k];
  if (t === 1) return sigmaX[k + 1];
  return sigmaX[k] + t * (sigmaX[k + 1] - sigmaX[k]);
}

/** Mean of σ_x over the grid indices [start, end], (1/L)∫σ_x dx by the trapezoid rule. */
export function meanSigma(gridX: ArrayLike<number>, sigmaX: ArrayLike<number>, startIndex: number, endIndex: number): number {
  const length = gridX[endIndex] - gridX[startIndex];
  let s = 0;
  for (let k = startIndex; k < endIndex; k++) s += 0.5 * (gridX[k + 1] - gridX[k]) * (sigmaX[k] + sigmaX[k + 1]);
  return s / length;
}
