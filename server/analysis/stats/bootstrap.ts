import type { Random } from "../random/seededRandom.ts";
import { quantileSorted } from "./descriptive.ts";

/** Indices of one bootstrap resample of n units (drawn with replacement). */
export function resampleIndices(n: number, random: Random): Int32Array {
  const idx = new Int32Array(n);
  for (let i = 0; i < n; i++) idx[i] = random.int(n);
  return idx;
}

/**
 * Percentile bootstrap interval from the replicate statistics: the
 * (1−level)/2 and (1+level)/2 quantiles. Non-finite replicates are dropped
 * and counted, so a caller can warn when many resamples failed.
 * Source: Efron & Tibshirani 1993, An Introduction to the Bootstrap, ch. 13.
 */
export function percentileInterval(
  replicates: ArrayLike<number>,
  level = 0.95,
): { interval: [number, number]; used: number; dropped: number } {
  const finite = Float64Array.from(Array.from(replicates).filter(Number.isFinite)).sort();
  if (finite.length === 0) throw new RangeError("percentileInterval: no finite bootstrap replicates");
  const alpha = (1 - level) / 2;
  return {
    interval: [quantileSorted(finite, alpha), quantileSorted(finite, 1 - alpha)],
    used: finite.length,
    dropped: replicates.length - finite.length,
  };
}
