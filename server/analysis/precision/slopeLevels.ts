import { applySavitzkyGolay, savitzkyGolayOperator } from "../stats/savitzkyGolay.ts";
import { ensembleMoments } from "./ensembleMoments.ts";

/** Per-embryo Savitzky–Golay slopes at one smoothing window. */
export interface SlopeLevel {
  windowPoints: number;
  /** One slope profile per embryo; their mean is the slope of the smoothed mean (the filter is linear). */
  embryoSlopes: Float64Array[];
}

/** Wider windows tried, as multiples of the base window, for positions whose slope the base window cannot resolve. */
export const WIDER_WINDOW_FACTORS = [2.5, 6] as const;

/**
 * The base window and up to two wider ones (2.5× and 6× the base, odd, at most a third of the
 * grid). Where the base window's slope is lost in the noise, a wider window averages more points
 * and can still resolve it; a truly flat stretch stays unresolved at every width. The wider slopes
 * are used only for the region's summaries, never for the σ_x(x) curve (common practice, no source:
 * adaptive smoothing of a derivative).
 */
export function slopeLevels(gridPoints: number, spacing: number, values: readonly ArrayLike<number>[], base: SlopeLevel, polynomialOrder: number): SlopeLevel[] {
  const levels = [base];
  const largest = oddAtMost(Math.floor(gridPoints / 3));
  for (const factor of WIDER_WINDOW_FACTORS) {
    const w = Math.min(largest, oddAtMost(Math.round(factor * base.windowPoints)));
    if (w <= levels[levels.length - 1].windowPoints || w <= polynomialOrder + 1) continue;
    const operator = savitzkyGolayOperator(gridPoints, { windowPoints: w, polynomialOrder, derivative: 1, spacing });
    levels.push({ windowPoints: w, embryoSlopes: values.map((v) => applySavitzkyGolay(operator, v)) });
  }
  return levels;
}

const oddAtMost = (v: number) => (v % 2 === 1 ? v : v - 1);

/** The mean slope over the listed embryos (a bootstrap resample may repeat them) and its standard error, SD/√n. */
export function levelEstimate(level: SlopeLevel, indices?: ArrayLike<number>): { slope: Float64Array; slopeSe: Float64Array } {
  const n = indices ? indices.length : level.embryoSlopes.length;
  const moments = ensembleMoments(level.embryoSlopes, indices);
  return { slope: moments.mean, slopeSe: Float64Array.from(moments.sd, (s) => s / Math.sqrt(n)) };
}
