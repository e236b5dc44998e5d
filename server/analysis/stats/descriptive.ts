/**
 * Descriptive statistics on plain arrays. NaN is not skipped silently: callers
 * must remove missing values first, and these functions throw on empty input
 * where the answer would be undefined.
 */

export function sum(values: ArrayLike<number>): number {
  // Neumaier compensated summation: long profiles and bootstrap loops add many terms.
  let s = 0;
  let c = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    const t = s + v;
    c += Math.abs(s) >= Math.abs(v) ? s - t + v : v - t + s;
    s = t;
  }
  return s + c;
}

export function mean(values: ArrayLike<number>): number {
  if (values.length === 0) throw new RangeError("mean: no values");
  return sum(values) / values.length;
}

/** Sample variance with n − 1 in the denominator (ddof = 1). */
export function variance(values: ArrayLike<number>): number {
  const n = values.length;
  if (n < 2) throw new RangeError(`variance: needs at least 2 values, got ${n}`);
  const m = mean(values);
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - m) ** 2;
  return ss / (n - 1);
}

/** Sample standard deviation (ddof = 1). */
export function standardDeviation(values: ArrayLike<number>): number {
  return Math.sqrt(variance(values));
}

/** Standard error of the mean, sd / √n. */
export function standardError(values: ArrayLike<number>): number {
  return standardDeviation(values) / Math.sqrt(values.length);
}

/**
 * Quantile by linear interpolation between order statistics (Hyndman & Fan
 * 1996 type 7; numpy's default "linear" method).
 */
export function quantile(values: ArrayLike<number>, p: number): number {
  if (values.length === 0) throw new RangeError("quantile: no values");
  if (!(p >= 0 && p <= 1)) throw new RangeError(`quantile: p must be in [0, 1], got ${p}`);
  const sorted = Float64Array.from(values).sort();
  return quantileSorted(sorted, p);
}

/** Same as {@link quantile} for an already ascending-sorted array. */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

export function median(values: ArrayLike<number>): number {
  return quantile(values, 0.5);
}

/** Median absolute deviation scaled by 1.4826 to estimate σ for normal data. */
export function scaledMad(values: ArrayLike<number>): number {
  const m = median(values);
  const dev = Array.from(values, (v) => Math.abs(v - m));
  return 1.482602218505602 * median(dev);
}
