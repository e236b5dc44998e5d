import type { Random } from "../random/seededRandom.ts";
import { bootstrapInterval, type BootstrapMethod } from "../stats/bootstrapInterval.ts";
import { mean, median, standardDeviation } from "../stats/descriptive.ts";

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
   * Bootstrap CI of the mean, resampling embryos, at the run's confidence
   * level (0.95 by default; the key keeps the Estimate name). Null with fewer
   * than 3 embryos, where a resample can take only a handful of values.
   */
  ci95: [number, number] | null;
}

export interface SummarizeMetricOptions {
  bootstrap: number;
  level: number;
  interval: BootstrapMethod;
  random: Random;
}

/** Summary of the finite values of one metric, or null when there are none. */
export function summarizeMetric(values: readonly number[], options: SummarizeMetricOptions): MetricSummary | null {
  const x = values.filter(Number.isFinite);
  const n = x.length;
  if (n === 0) return null;
  const m = mean(x);
  const sd = n >= 2 ? standardDeviation(x) : null;
  let ci95: [number, number] | null = null;
  if (n >= 3) {
    const boot = bootstrapInterval([x], ([s]) => mean(s), {
      resamples: options.bootstrap, level: options.level, method: options.interval, random: options.random,
    });
    ci95 = boot.interval;
  }
  return {
    n,
    mean: m,
    sd,
    sem: sd === null ? null : sd / Math.sqrt(n),
    median: median(x),
    cv: sd === null || m === 0 ? null : sd / Math.abs(m),
    ci95,
  };
}
