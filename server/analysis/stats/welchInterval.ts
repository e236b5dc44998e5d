import { welchTTest } from "./welchTTest.ts";
import { studentTQuantile } from "./studentT.ts";

/**
 * Welch's confidence interval for mean(a) − mean(b): d ± t_{1−α/2, ν}·SE with
 * SE = √(s²a/na + s²b/nb) and ν the Welch–Satterthwaite degrees of freedom.
 * Source: Welch 1947, Biometrika 34:28–35. It is the interval that inverts
 * Welch's test, so it excludes 0 exactly when Welch's p is below 1 − level;
 * matches scipy.stats.ttest_ind(a, b, equal_var=False).confidence_interval().
 */
export function welchInterval(a: ArrayLike<number>, b: ArrayLike<number>, level: number): [number, number] {
  const w = welchTTest(a, b);
  if (w.se === 0) return [w.difference, w.difference];
  const q = studentTQuantile(0.5 + level / 2, w.df);
  return [w.difference - q * w.se, w.difference + q * w.se];
}
