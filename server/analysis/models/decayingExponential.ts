/**
 * Fill out[i] = e^(−x[i]/λ) for ascending or arbitrary x, and return out;
 * with `derivative` given, also ∂/∂λ e^(−x/λ) = (x/λ²)·e^(−x/λ) in the same pass.
 *
 * Profiles are usually sampled on a uniform pixel grid, so the ratio
 * e^(−Δx/λ) between neighbours repeats: it is computed once and the values
 * follow by multiplication, with an exact exponential every 32 points (and
 * whenever the spacing changes) to keep the rounding error below ~32 ulp.
 * This makes the model's basis several times cheaper than one Math.exp per
 * point, which matters in the fitter's inner loop.
 */
export function decayingExponential(
  x: ArrayLike<number>,
  lambdaUm: number,
  out: Float64Array,
  derivative: Float64Array | null = null,
): Float64Array {
  const n = x.length;
  if (n === 0) return out;
  const inv = 1 / lambdaUm;
  const inv2 = inv * inv;
  let value = Math.exp(-x[0] * inv);
  out[0] = value;
  if (derivative !== null) derivative[0] = x[0] * inv2 * value;
  let lastStep = NaN;
  let ratio = 1;
  let ratioStale = true;
  for (let i = 1; i < n; i++) {
    const step = x[i] - x[i - 1];
    if (step === lastStep && (i & 31) !== 0) {
      // The ratio is computed only once a spacing repeats, so an irregular grid costs one exp per point.
      if (ratioStale) {
        ratio = Math.exp(-step * inv);
        ratioStale = false;
      }
      value *= ratio;
    } else {
      value = Math.exp(-x[i] * inv);
      if (step !== lastStep) {
        lastStep = step;
        ratioStale = true;
      }
    }
    out[i] = value;
    if (derivative !== null) derivative[i] = x[i] * inv2 * value;
  }
  return out;
}
