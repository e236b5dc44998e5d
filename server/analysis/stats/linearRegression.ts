import { mean } from "./descriptive.ts";
import { studentTQuantile } from "./studentT.ts";
import type { Estimate } from "../estimate.ts";

export interface LinearRegression {
  slope: Estimate;
  intercept: Estimate;
  /** Coefficient of determination. */
  r2: number;
  /** Residual degrees of freedom, n − 2. */
  df: number;
  n: number;
  /** Residual standard deviation. */
  residualSd: number;
}

/**
 * Ordinary least-squares line y = a + b·x with standard errors and t-based 95% CIs.
 * Source: any regression text, e.g. Draper & Smith, Applied Regression Analysis, ch. 1;
 * matches scipy.stats.linregress.
 */
export function linearRegression(x: ArrayLike<number>, y: ArrayLike<number>): LinearRegression {
  const n = x.length;
  if (n !== y.length) throw new RangeError(`linearRegression: x has ${n} values but y has ${y.length}`);
  if (n < 3) throw new RangeError(`linearRegression: needs at least 3 points, got ${n}`);
  const mx = mean(x);
  const my = mean(y);
  let sxx = 0, sxy = 0, syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  if (sxx === 0) throw new RangeError("linearRegression: all x values are equal; the slope is undefined");
  const b = sxy / sxx;
  const a = my - b * mx;
  const df = n - 2;
  const rss = Math.max(0, syy - b * sxy);
  const s2 = rss / df;
  const seB = Math.sqrt(s2 / sxx);
  const seA = Math.sqrt(s2 * (1 / n + (mx * mx) / sxx));
  const t = studentTQuantile(0.975, df);
  return {
    slope: { value: b, se: seB, ci95: [b - t * seB, b + t * seB] },
    intercept: { value: a, se: seA, ci95: [a - t * seA, a + t * seA] },
    r2: syy === 0 ? 1 : 1 - rss / syy,
    df,
    n,
    residualSd: Math.sqrt(s2),
  };
}
