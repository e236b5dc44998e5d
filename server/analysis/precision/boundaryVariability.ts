import type { Estimate } from "../estimate.ts";
import { chiSquareQuantile } from "../stats/chiSquare.ts";

/**
 * Position where a profile first crosses the threshold, walking from the
 * source end, by linear interpolation between grid points; null if it never does.
 */
export function firstCrossing(gridX: ArrayLike<number>, values: ArrayLike<number>, threshold: number): number | null {
  const g = gridX.length;
  if (values[0] === threshold) return gridX[0];
  for (let k = 0; k + 1 < g; k++) {
    const a = values[k] - threshold;
    const b = values[k + 1] - threshold;
    if (b === 0) return gridX[k + 1];
    if (a * b < 0) return gridX[k] + (a / (a - b)) * (gridX[k + 1] - gridX[k]);
  }
  return null;
}

/**
 * SD with a chi-square confidence interval, assuming normally distributed
 * positions: [s·√((n−1)/χ²_{0.975,n−1}), s·√((n−1)/χ²_{0.025,n−1})]; standard error
 * s/√(2(n−1)). Source: any statistics text, e.g. Sokal & Rohlf, Biometry, §7.7.
 */
export function standardDeviationEstimate(values: ArrayLike<number>): Estimate | null {
  const n = values.length;
  if (n < 2) return null;
  let m = 0;
  for (let i = 0; i < n; i++) m += values[i];
  m /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - m) ** 2;
  const s = Math.sqrt(ss / (n - 1));
  const df = n - 1;
  return {
    value: s,
    se: s / Math.sqrt(2 * df),
    ci95: [s * Math.sqrt(df / chiSquareQuantile(0.975, df)), s * Math.sqrt(df / chiSquareQuantile(0.025, df))],
  };
}

/** Where each embryo crosses one threshold, and how much those positions vary. */
export interface BoundaryCrossings {
  threshold: number;
  positions: { embryo: string; position: number | null }[];
  /** Embryos whose profile never reaches the threshold on the grid. */
  neverCross: string[];
  meanPosition: number | null;
  /** SD across embryos of the crossing positions, chi-square 95% CI (grid units). */
  sd: Estimate | null;
}

/**
 * Boundary variability: the SD across embryos of the position where each
 * profile crosses a fixed threshold. For small noise it equals σ_x at that
 * position (Gregor et al. 2007, Cell; Tkačik et al. 2015, Genetics).
 */
export function boundaryCrossings(gridX: ArrayLike<number>, embryos: readonly string[], values: readonly ArrayLike<number>[], threshold: number): BoundaryCrossings {
  const positions = embryos.map((embryo, i) => ({ embryo, position: firstCrossing(gridX, values[i], threshold) }));
  const crossed = positions.filter((p) => p.position !== null).map((p) => p.position as number);
  return {
    threshold,
    positions,
    neverCross: positions.filter((p) => p.position === null).map((p) => p.embryo),
    meanPosition: crossed.length > 0 ? crossed.reduce((a, b) => a + b, 0) / crossed.length : null,
    sd: standardDeviationEstimate(crossed),
  };
}
