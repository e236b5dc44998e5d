import { applySavitzkyGolay, savitzkyGolayOperator } from "../stats/savitzkyGolay.ts";
import { ensembleMoments, rowMean } from "./ensembleMoments.ts";
import type { SlopeModel } from "./precisionOptions.ts";

/** The slope dc̄/dx of the mean profile and how it was obtained. */
export interface MeanSlope {
  method: "savitzky-golay" | "model";
  /** dc̄/dx at each grid position, per grid unit. */
  slope: Float64Array;
  /**
   * Each embryo's Savitzky–Golay slope. The filter is linear, so their mean is the slope of
   * the smoothed mean, and a bootstrap can resample them instead of re-filtering.
   */
  embryoSlopes: Float64Array[];
  /** Standard error of the data's slope: SD across embryos of their slopes / √n (correlations along x included). */
  slopeSe: Float64Array;
  windowPoints: number;
  polynomialOrder: number;
  /** Model method only: the model's value at the grid positions. */
  modelValue: Float64Array | null;
}

/**
 * Default Savitzky–Golay window: the odd number nearest to 1/15 of the grid,
 * at least polynomialOrder + 2 and at most the grid (common practice, no source:
 * wide enough to average pixel noise, narrow compared with a decay length
 * spanning a sizeable part of the axis).
 */
export function resolveWindowPoints(gridPoints: number, requested: number | null, polynomialOrder: number): number {
  const largestOdd = gridPoints % 2 === 1 ? gridPoints : gridPoints - 1;
  let w = requested ?? 2 * Math.round((gridPoints / 15 - 1) / 2) + 1;
  const smallest = polynomialOrder + 2 + (polynomialOrder % 2 === 0 ? 1 : 0);
  w = Math.max(w, smallest);
  if (w > largestOdd)
    throw new RangeError(`Savitzky–Golay window of ${w} points (order ${polynomialOrder}) does not fit the ${gridPoints}-point grid; use a finer grid or a smaller window`);
  return w;
}

export interface MeanSlopeRequest {
  method: "savitzky-golay" | "model";
  windowPoints: number | null;
  polynomialOrder: number;
  slopeModel?: SlopeModel;
}

/**
 * dc̄/dx from the Savitzky–Golay derivative of the mean profile, or from a
 * model curve supplied by the caller. Raw differences of noisy means are never
 * used (Gregor et al. 2007, Cell).
 */
export function meanSlope(gridX: ArrayLike<number>, spacing: number, values: readonly Float64Array[], request: MeanSlopeRequest): MeanSlope {
  const g = gridX.length;
  const windowPoints = resolveWindowPoints(g, request.windowPoints, request.polynomialOrder);
  const operator = savitzkyGolayOperator(g, { windowPoints, polynomialOrder: request.polynomialOrder, derivative: 1, spacing });
  const embryoSlopes = values.map((v) => applySavitzkyGolay(operator, v));
  const moments = ensembleMoments(embryoSlopes);
  const slopeSe = Float64Array.from(moments.sd, (s) => s / Math.sqrt(values.length));
  let slope = rowMean(embryoSlopes);
  let modelValue: Float64Array | null = null;
  if (request.method === "model") {
    if (!request.slopeModel) throw new RangeError('meanSlope: method "model" needs a slopeModel');
    const out = request.slopeModel(Array.from(gridX));
    if (!out || out.slope?.length !== g || out.value?.length !== g)
      throw new RangeError(`slopeModel must return { value, slope } with ${g} values each (one per grid position)`);
    for (let k = 0; k < g; k++)
      if (!Number.isFinite(out.slope[k]) || !Number.isFinite(out.value[k]))
        throw new RangeError(`slopeModel returned a non-finite value or slope at position ${gridX[k]}`);
    slope = Float64Array.from(out.slope);
    modelValue = Float64Array.from(out.value);
  }
  return { method: request.method, slope, embryoSlopes, slopeSe, windowPoints, polynomialOrder: request.polynomialOrder, modelValue };
}
