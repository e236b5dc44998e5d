import type { Estimate } from "../estimate.ts";
import { linearRegression } from "../stats/linearRegression.ts";

/** Power-law dependence of a per-embryo length (decay length, boundary position) on embryo length. */
export interface LengthScaling {
  quantity: string;
  /** Embryos with a positive value and length. */
  n: number;
  /** Exponent β in value ∝ length^β (slope of the log–log regression), t-based 95% CI. 1 = perfect scaling. */
  exponent: Estimate;
  /** Prefactor's natural log (intercept of the log–log regression). */
  logPrefactor: Estimate;
  r2: number;
  /** The exponent's CI contains 1 (consistent with proportional scaling). */
  consistentWithScaling: boolean;
  /** The exponent's CI contains 0 (consistent with no dependence on length). */
  consistentWithNoScaling: boolean;
}

/**
 * Log–log least-squares regression of a per-embryo length on embryo length:
 * ln(value) = ln(A) + β·ln(L). β = 1 means the quantity scales in proportion
 * to the embryo (common practice, no source; the regression is ordinary least squares,
 * scipy.stats.linregress on the logs). Needs at least 3 embryos with positive
 * values; returns null otherwise.
 */
export function lengthScaling(quantity: string, lengthsUm: readonly (number | null)[], valuesUm: readonly (number | null)[]): LengthScaling | null {
  if (lengthsUm.length !== valuesUm.length)
    throw new RangeError(`lengthScaling: ${lengthsUm.length} lengths but ${valuesUm.length} values of ${quantity}`);
  const x: number[] = [];
  const y: number[] = [];
  for (let i = 0; i < lengthsUm.length; i++) {
    const l = lengthsUm[i];
    const v = valuesUm[i];
    if (l !== null && v !== null && l > 0 && v > 0 && Number.isFinite(l) && Number.isFinite(v)) {
      x.push(Math.log(l));
      y.push(Math.log(v));
    }
  }
  if (x.length < 3) return null;
  if (x.every((v) => v === x[0])) return null;
  const fit = linearRegression(x, y);
  const ci = fit.slope.ci95 as [number, number];
  return {
    quantity,
    n: x.length,
    exponent: fit.slope,
    logPrefactor: fit.intercept,
    r2: fit.r2,
    consistentWithScaling: ci[0] <= 1 && 1 <= ci[1],
    consistentWithNoScaling: ci[0] <= 0 && 0 <= ci[1],
  };
}
