import type { Estimate } from "../estimate.ts";

/** A fitted (or fixed) quantity with its uncertainty and unit. */
export interface ParameterEstimate extends Estimate {
  /** Unit of value, se and ci95: "µm", "a.u.", "" for dimensionless. */
  unit: string;
  /** Held at a given value rather than fitted (se and ci95 are then null). */
  fixed: boolean;
}

/**
 * Estimate with a symmetric t-interval value ± t·se. A variance that is
 * missing, negative or not finite gives se = ci95 = null rather than NaN.
 */
export function parameterEstimate(value: number, variance: number | null, t: number, unit: string, fixed = false): ParameterEstimate {
  if (fixed || variance === null || !(variance >= 0) || !Number.isFinite(variance) || !Number.isFinite(t))
    return { value, se: null, ci95: null, unit, fixed };
  const se = Math.sqrt(variance);
  return { value, se, ci95: [value - t * se, value + t * se], unit, fixed };
}
