/** The stretch of grid over which positional information, mean σ_x and decoding are computed. */
export interface AnalysisRegion {
  /** First and last grid index, inclusive. */
  startIndex: number;
  endIndex: number;
  from: number;
  to: number;
  /** to − from, in grid units: the L of the uniform prior. */
  length: number;
  source: "requested" | "longest unmasked run" | "longest unmasked run inside the requested region";
}

/** Fewest grid points a region may have (an integral needs a few points to mean anything). */
export const MIN_REGION_POINTS = 3;

/**
 * The requested region if all of it is unmasked, otherwise the longest run of
 * consecutive unmasked grid positions inside it (or inside the whole grid).
 * Returns null when no run has at least MIN_REGION_POINTS points.
 */
export function chooseRegion(gridX: ArrayLike<number>, masked: readonly boolean[], requested: [number, number] | null): AnalysisRegion | null {
  const g = gridX.length;
  let lo = 0;
  let hi = g - 1;
  if (requested) {
    const tolerance = 1e-9 * (gridX[g - 1] - gridX[0]);
    while (lo < g && gridX[lo] < requested[0] - tolerance) lo++;
    while (hi >= 0 && gridX[hi] > requested[1] + tolerance) hi--;
    if (hi - lo + 1 < MIN_REGION_POINTS) return null;
  }
  let bestStart = -1;
  let bestLength = 0;
  let runStart = -1;
  for (let k = lo; k <= hi + 1; k++) {
    const open = k <= hi && !masked[k];
    if (open && runStart < 0) runStart = k;
    if (!open && runStart >= 0) {
      if (k - runStart > bestLength) [bestStart, bestLength] = [runStart, k - runStart];
      runStart = -1;
    }
  }
  if (bestLength < MIN_REGION_POINTS) return null;
  const startIndex = bestStart;
  const endIndex = bestStart + bestLength - 1;
  const whole = startIndex === lo && endIndex === hi;
  return {
    startIndex,
    endIndex,
    from: gridX[startIndex],
    to: gridX[endIndex],
    length: gridX[endIndex] - gridX[startIndex],
    source: requested ? (whole ? "requested" : "longest unmasked run inside the requested region") : "longest unmasked run",
  };
}
