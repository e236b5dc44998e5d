import type { Estimate } from "../estimate.ts";
import type { Random } from "../random/seededRandom.ts";
import { linearRegression } from "../stats/linearRegression.ts";

export interface SampleSizeExtrapolation {
  /** Information estimated from random subsets of each size (bits). */
  points: { embryos: number; estimate: number }[];
  /**
   * Intercept of estimate against 1/embryos: the estimate for infinitely many embryos. Its
   * t-based 95% CI treats the overlapping subsamples as independent, so it is indicative only.
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
 */
export function sampleSizeExtrapolation(
  n: number,
  estimator: (indices: Int32Array) => number,
  repeats: number,
  random: Random,
): SampleSizeExtrapolation {
  const points: { embryos: number; estimate: number }[] = [];
  for (const fraction of EXTRAPOLATION_FRACTIONS) {
    const size = Math.round(fraction * n);
    if (size < MIN_SUBSAMPLE) continue;
    const times = size === n ? 1 : repeats;
    for (let r = 0; r < times; r++) {
      const estimate = estimator(subsetWithoutReplacement(n, size, random));
      if (Number.isFinite(estimate)) points.push({ embryos: size, estimate });
    }
  }
  const sizes = new Set(points.map((p) => p.embryos));
  if (sizes.size < 3) return { points, extrapolated: null, biasSlope: null };
  const fit = linearRegression(points.map((p) => 1 / p.embryos), points.map((p) => p.estimate));
  return { points, extrapolated: fit.intercept, biasSlope: fit.slope.value };
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
