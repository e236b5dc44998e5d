import { createRandom } from "../random/seededRandom.ts";
import { bootstrapInterval, type BootstrapMethod } from "../stats/bootstrapInterval.ts";
import { fiellerInterval } from "../stats/fiellerInterval.ts";
import { mean } from "../stats/descriptive.ts";
import { hedgesG, type HedgesG } from "../stats/hedgesG.ts";
import { permutationTest } from "../stats/permutationTest.ts";
import { welchInterval } from "../stats/welchInterval.ts";
import { welchTTest } from "../stats/welchTTest.ts";

/**
 * A value with its confidence interval at the run's level (the key keeps the
 * 95% name). `interval_method` says how `ci95` was formed; `bootstrap_ci95`,
 * when present, is a bootstrap interval of the same quantity kept as a second
 * opinion, never the headline.
 */
export interface IntervalValue {
  value: number;
  ci95: [number, number] | null;
  /** How ci95 was formed, in words a reader can check (e.g. "Welch t interval"). */
  interval_method?: string;
  /** Second opinion: a bootstrap interval resampling embryos within each group; null when it could not be formed. */
  bootstrap_ci95?: [number, number] | null;
  /** How bootstrap_ci95 was formed. */
  bootstrap_method?: string;
}

/** Comparison of the mean of one per-embryo metric between groups a and b. */
export interface MeanContrast {
  /** mean(a) − mean(b) with Welch's t interval; the bootstrap interval as a second opinion. */
  difference: IntervalValue;
  /** mean(a)/mean(b) with Fieller's interval; null when mean(b) is 0. */
  ratio: IntervalValue | null;
  t_welch: number;
  df_welch: number;
  p_welch: number;
  /** Two-sided permutation p, (b + 1)/(m + 1). */
  p_permutation: number;
  /** Hedges' g for a − b with its approximate SE and normal-theory CI. */
  effect_size: HedgesG;
  /** Why an interval is missing, when one is. */
  note: string | null;
}

export interface ContrastMeansOptions {
  bootstrap: number;
  permutations: number;
  level: number;
  interval: BootstrapMethod;
  /** Seeds for the three independent random streams. */
  seeds: { difference: number; ratio: number; permutation: number };
}

export const DIFFERENCE_INTERVAL_METHOD = "Welch t interval (Welch–Satterthwaite df)";
export const RATIO_INTERVAL_METHOD = "Fieller interval with Welch–Satterthwaite df";

/**
 * Every comparison the tool reports between two groups' means. The headline
 * intervals are the ones calibrated at small n and dual to Welch's test
 * (Welch 1947, Biometrika): Welch's t interval for the difference, and
 * Fieller's interval for the ratio (Fieller 1954, J R Stat Soc B), so an
 * interval excludes 0 (difference) or 1 (ratio) exactly when Welch's p is
 * below 1 − level. Bootstrap intervals (BCa or percentile, resampling embryos
 * within each group; Efron & Tibshirani 1993) ride along as a second opinion:
 * with 6–15 embryos per group they under-cover (Carpenter & Bithell 2000,
 * Stat Med). Also a permutation test of the difference in means and Hedges' g
 * (Hedges 1981, J Educ Stat). Both groups need at least 2 embryos.
 */
export function contrastMeans(a: readonly number[], b: readonly number[], options: ContrastMeansOptions): MeanContrast {
  if (a.length < 2 || b.length < 2) throw new RangeError(`contrastMeans: each group needs at least 2 embryos, got ${a.length} and ${b.length}`);
  const common = { resamples: options.bootstrap, level: options.level, method: options.interval };
  const bootName = `${options.interval === "bca" ? "BCa" : "percentile"} bootstrap, ${options.bootstrap} resamples of embryos within each group (second opinion)`;
  const welch = welchTTest(a, b);
  const diffBoot = bootstrapInterval([a, b], ([x, y]) => mean(x) - mean(y), { ...common, random: createRandom(options.seeds.difference) });
  const difference: IntervalValue = {
    value: welch.difference,
    ci95: welchInterval(a, b, options.level),
    interval_method: DIFFERENCE_INTERVAL_METHOD,
    bootstrap_ci95: diffBoot.interval,
    bootstrap_method: bootName,
  };
  let ratio: IntervalValue | null = null;
  let note: string | null = null;
  if (mean(b) === 0) note = "the mean of the second group is 0; no ratio";
  else {
    const fieller = fiellerInterval(a, b, options.level);
    const ratioBoot = bootstrapInterval([a, b], ([x, y]) => mean(x) / mean(y), { ...common, random: createRandom(options.seeds.ratio) });
    ratio = { value: fieller.value, ci95: fieller.interval, interval_method: RATIO_INTERVAL_METHOD, bootstrap_ci95: ratioBoot.interval, bootstrap_method: bootName };
    if (fieller.reason) note = `${fieller.reason}; no ratio interval`;
  }
  const perm = permutationTest(a, b, { permutations: options.permutations, random: createRandom(options.seeds.permutation) });
  return {
    difference,
    ratio,
    t_welch: welch.t,
    df_welch: welch.df,
    p_welch: welch.p,
    p_permutation: perm.p,
    effect_size: hedgesG(a, b, options.level),
    note,
  };
}
