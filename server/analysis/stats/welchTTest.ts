import { mean, variance } from "./descriptive.ts";
import { studentTTwoSidedP } from "./studentT.ts";

export interface WelchTTest {
  /** mean(a) − mean(b). */
  difference: number;
  /** Standard error of the difference, √(s²a/na + s²b/nb). */
  se: number;
  /** t = difference / se. */
  t: number;
  /** Welch–Satterthwaite degrees of freedom (fractional). */
  df: number;
  /** Two-sided p-value P(|T_df| ≥ |t|). */
  p: number;
}

/**
 * Welch's unequal-variance two-sample t-test.
 * Source: Welch 1947, Biometrika 34:28–35; Satterthwaite 1946, Biometrics Bull 2:110–114.
 * Matches scipy.stats.ttest_ind(a, b, equal_var=False).
 *
 * When both samples have zero variance the statistic is undefined; the result
 * then says what the data show without producing NaN: t = 0, p = 1 for equal
 * means, t = ±Infinity, p = 0 otherwise, with df = na + nb − 2.
 */
export function welchTTest(a: ArrayLike<number>, b: ArrayLike<number>): WelchTTest {
  const na = a.length;
  const nb = b.length;
  if (na < 2 || nb < 2) throw new RangeError(`welchTTest: each sample needs at least 2 values, got ${na} and ${nb}`);
  const difference = mean(a) - mean(b);
  const wa = variance(a) / na;
  const wb = variance(b) / nb;
  const se = Math.sqrt(wa + wb);
  if (se === 0) {
    const t = difference === 0 ? 0 : difference > 0 ? Infinity : -Infinity;
    return { difference, se, t, df: na + nb - 2, p: difference === 0 ? 1 : 0 };
  }
  const df = (wa + wb) ** 2 / ((wa * wa) / (na - 1) + (wb * wb) / (nb - 1));
  const t = difference / se;
  return { difference, se, t, df, p: studentTTwoSidedP(t, df) };
}
