import type { Random } from "../random/seededRandom.ts";
import { bootstrapInterval, type BootstrapMethod } from "../stats/bootstrapInterval.ts";
import { mean, median, standardDeviation } from "../stats/descriptive.ts";
import { studentTQuantile } from "../stats/studentT.ts";

/** How the headline interval of a group mean is formed. */
export const MEAN_INTERVAL_METHOD = "t interval, mean ± t(n − 1)·SEM";

/** Descriptive summary of one metric across the embryos of a group. */
export interface MetricSummary {
  /** Embryos with a finite value of this metric. */
  n: number;
  mean: number;
  /** Embryo-to-embryo SD (n − 1 denominator); null for one embryo. */
  sd: number | null;
  /** Standard error of the mean, sd/√n; null for one embryo. */
  sem: number | null;
  median: number;
  /** Coefficient of variation sd/|mean|; null when undefined. */
  cv: number | null;
  /**
   * CI of the mean at the run's confidence level (0.95 by default; the key
   * keeps the Estimate name): Student's t interval, mean ± t_{1−α/2, n−1}·SEM,
   * which holds its level at small n for roughly normal values. Null with
   * fewer than 3 embryos (an interval from 2 spans ±12.7 SEM and says little).
   */
  ci95: [number, number] | null;
  /** How ci95 was formed. */
  ci_method: string;
  /**
   * Second opinion: bootstrap CI of the mean, resampling embryos (BCa or
   * percentile). It under-covers with few embryos, so it is never the
   * headline. Null with fewer than 3 embryos.
   */
  bootstrap_ci95: [number, number] | null;
}

export interface SummarizeMetricOptions {
  bootstrap: number;
  level: number;
  interval: BootstrapMethod;
  random: Random;
}

/**
 * Summary of the finite values of one metric, or null when there are none.
 * The interval of the mean is Student's t (Student 1908, Biometrika); the
 * bootstrap (Efron & Tibshirani 1993) is reported beside it.
 */
export function summarizeMetric(values: readonly number[], options: SummarizeMetricOptions): MetricSummary | null {
  const x = values.filter(Number.isFinite);
  const n = x.length;
  if (n === 0) return null;
  const m = mean(x);
  const sd = n >= 2 ? standardDeviation(x) : null;
  const sem = sd === null ? null : sd / Math.sqrt(n);
  let ci95: [number, number] | null = null;
  if (sem !== null && n >= 3) {
    const q = studentTQuantile(0.5 + options.level / 2, n - 1);
    ci95 = [m - q * sem, m + q * sem];
  }
  let bootstrap: [number, number] | null = null;
  if (n >= 3) {
    bootstrap = bootstrapInterval([x], ([s]) => mean(s), {
      resamples: options.bootstrap, level: options.level, method: options.interval, random: options.random,
    }).interval;
  }
  return {
    n,
    mean: m,
    sd,
    sem,
    median: median(x),
    cv: sd === null || m === 0 ? null : sd / Math.abs(m),
    ci95,
    ci_method: MEAN_INTERVAL_METHOD,
    bootstrap_ci95: bootstrap,
  };
}
