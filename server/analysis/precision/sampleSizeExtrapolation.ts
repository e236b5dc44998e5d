import type { Estimate } from "../estimate.ts";
import type { Random } from "../random/seededRandom.ts";
import { variance } from "../stats/descriptive.ts";
import { linearRegression } from "../stats/linearRegression.ts";
import { studentTQuantile } from "../stats/studentT.ts";

export interface SampleSizeExtrapolation {
  /** Information estimated from random subsets of each size (bits). */
  points: { embryos: number; estimate: number }[];
  /** Spread of the estimates at each subsample size below the full set: their SD and the standard error of the full-data estimate it implies. */
  spread: { embryos: number; sd: number; impliedSe: number }[];
  /**
   * Intercept of estimate against 1/embryos: the estimate for infinitely many embryos, with a
   * standard error combining the resampling spread at each subsample size and the uncertainty of
   * the fitted line, and a t interval (n − 1 degrees of freedom) centred on the value.
   */
  extrapolated: Estimate | null;
  /** Slope against 1/embryos (bits × embryos): the size of the small-sample bias. */
  biasSlope: number | null;
}

/** Fractions of the embryos used for the subsamples. */
export const EXTRAPOLATION_FRACTIONS = [0.5, 0.6, 0.7, 0.8, 0.9, 1] as const;
/**
 * Smallest subsample: below about ten embryos the bias is no longer linear in 1/N and the
 * extrapolation overshoots (seen in simulations; common practice, no source).
 */
export const MIN_SUBSAMPLE = 10;

/**
 * Correct an information estimate for its small-sample bias by computing it on
 * random subsets of the embryos (drawn without replacement) and extrapolating
 * linearly in 1/N to N → ∞, the leading order of the bias. Needs three subsample
 * sizes of at least MIN_SUBSAMPLE embryos (12 embryos in all); null otherwise.
 * Source: Strong, Koberle, de Ruyter van Steveninck, Bialek 1998, Phys Rev Lett;
 * applied to positional information by Tkačik, Dubuis, Petkova, Gregor 2015, Genetics.
 *
 * Its error comes from the same resampling: subsets of r of the n embryos scatter around the
 * full-data value with variance (1/r − 1/n)·V for an estimator of variance V/N, so their SD at
 * each size, times √(r/(n − r)), estimates the standard error of the full-data estimate
 * (the delete-d jackknife, Shao & Wu 1989, Ann Stat). The mean of these variances over the sizes,
 * plus the squared standard error of the fitted intercept, gives the extrapolated value's SE.
 */
export function sampleSizeExtrapolation(
  n: number,
  estimator: (indices: Int32Array) => number,
  repeats: number,
  random: Random,
): SampleSizeExtrapolation {
  const points: { embryos: number; estimate: number }[] = [];
  const spread: SampleSizeExtrapolation["spread"] = [];
  for (const fraction of EXTRAPOLATION_FRACTIONS) {
    const size = Math.round(fraction * n);
    if (size < MIN_SUBSAMPLE) continue;
    const times = size === n ? 1 : repeats;
    const estimates: number[] = [];
    for (let r = 0; r < times; r++) {
      const estimate = estimator(subsetWithoutReplacement(n, size, random));
      if (Number.isFinite(estimate)) estimates.push(estimate);
    }
    points.push(...estimates.map((estimate) => ({ embryos: size, estimate })));
    if (size < n && estimates.length >= 2) {
      const sd = Math.sqrt(variance(estimates));
      spread.push({ embryos: size, sd, impliedSe: sd * Math.sqrt(size / (n - size)) });
    }
  }
  const sizes = new Set(points.map((p) => p.embryos));
  if (sizes.size < 3) return { points, spread, extrapolated: null, biasSlope: null };
  const fit = linearRegression(points.map((p) => 1 / p.embryos), points.map((p) => p.estimate));
  const value = fit.intercept.value;
  const resamplingVariance = spread.length > 0 ? spread.reduce((s, p) => s + p.impliedSe ** 2, 0) / spread.length : null;
  const fitVariance = fit.intercept.se === null ? 0 : fit.intercept.se ** 2;
  const se = resamplingVariance === null ? null : Math.sqrt(resamplingVariance + fitVariance);
  const t = studentTQuantile(0.975, n - 1);
  return {
    points,
    spread,
    extrapolated: { value, se, ci95: se === null ? null : [value - t * se, value + t * se] },
    biasSlope: fit.slope.value,
  };
}

/** A sorted random subset of {0, …, n−1} of the given size (partial Fisher–Yates shuffle). */
function subsetWithoutReplacement(n: number, size: number, random: Random): Int32Array {
  const all = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = 0; i < size; i++) {
    const j = i + random.int(n - i);
    [all[i], all[j]] = [all[j], all[i]];
  }
  return all.slice(0, size).sort();
}
