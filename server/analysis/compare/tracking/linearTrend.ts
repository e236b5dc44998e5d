import type { Estimate } from "../../estimate.ts";
import { linearRegression } from "../../stats/linearRegression.ts";
import { studentTQuantile, studentTTwoSidedP } from "../../stats/studentT.ts";

/** Straight-line trend y = intercept + slope·t, with t-based CIs at `level`. */
export interface LinearTrend {
  kind: "linear";
  slope: Estimate;
  intercept: Estimate;
  /** Two-sided p for slope = 0. */
  pSlope: number;
  r2: number;
  n: number;
  df: number;
  residualSd: number;
  level: number;
}

/**
 * Ordinary least-squares trend with standard errors and CIs
 * value ± t_{(1+level)/2, n−2}·SE (Draper & Smith, Applied Regression
 * Analysis, ch. 1; matches scipy.stats.linregress). The `ci95` key holds the
 * interval at `level` (0.95 by default). Needs 3 points and 2 distinct t.
 */
export function fitLinearTrend(t: ArrayLike<number>, y: ArrayLike<number>, level = 0.95): LinearTrend {
  const fit = linearRegression(t, y);
  const q = studentTQuantile(0.5 + level / 2, fit.df);
  const at = (e: Estimate): Estimate => ({ value: e.value, se: e.se, ci95: e.se === null ? null : [e.value - q * e.se, e.value + q * e.se] });
  const se = fit.slope.se ?? 0;
  // A perfect fit has SE 0: the slope is then exactly known.
  const tStat = se > 0 ? fit.slope.value / se : fit.slope.value === 0 ? 0 : Infinity;
  return {
    kind: "linear",
    slope: at(fit.slope),
    intercept: at(fit.intercept),
    pSlope: studentTTwoSidedP(tStat, fit.df),
    r2: fit.r2,
    n: fit.n,
    df: fit.df,
    residualSd: fit.residualSd,
    level,
  };
}
