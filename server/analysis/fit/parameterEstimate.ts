import type { Estimate } from "../estimate.ts";

/** A fitted (or fixed) quantity with its uncertainty and unit. */
export interface ParameterEstimate extends Estimate {
  /** Unit of value, se and ci95: "µm", "a.u.", "" for dimensionless. */
  unit: string;
  /** Held at a given value rather than fitted (se and ci95 are then null). */
  fixed: boolean;
  /** "log" when ci95 was computed on the log scale (a positive quantity: the interval never reaches 0). */
  ciScale?: "log";
}

/**
 * Estimate with a t-interval: value ± t·se, or, for a quantity that must be
 * positive (`positive`), value·exp(±t·se/value) — the interval on the log
 * scale, where the delta method gives SE(log v) = se/v, transformed back, so
 * it never crosses zero (science.md §8, bounded parameters). A variance that
 * is missing, negative or not finite gives se = ci95 = null rather than NaN.
 */
export function parameterEstimate(value: number, variance: number | null, t: number, unit: string, fixed = false, positive = false): ParameterEstimate {
  if (fixed || variance === null || !(variance >= 0) || !Number.isFinite(variance) || !Number.isFinite(t))
    return { value, se: null, ci95: null, unit, fixed };
  const se = Math.sqrt(variance);
  if (positive && value > 0) {
    const factor = Math.exp((t * se) / value);
    return { value, se, ci95: [value / factor, value * factor], unit, fixed, ciScale: "log" };
  }
  return { value, se, ci95: [value - t * se, value + t * se], unit, fixed };
}
