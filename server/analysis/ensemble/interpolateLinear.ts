/**
 * Piecewise-linear interpolation of (xs, ys), xs strictly ascending, at
 * ascending query points `at`. Queries outside [xs₀, xs_last] beyond a
 * rounding tolerance are a programmer error (the common grid lies inside every
 * profile) and throw.
 */
export function interpolateLinear(xs: ArrayLike<number>, ys: ArrayLike<number>, at: ArrayLike<number>): Float64Array {
  const n = xs.length;
  const out = new Float64Array(at.length);
  const tolerance = 1e-9 * Math.max(Math.abs(xs[0]), Math.abs(xs[n - 1]), xs[n - 1] - xs[0]);
  let j = 0;
  for (let k = 0; k < at.length; k++) {
    const x = at[k];
    if (x < xs[0] - tolerance || x > xs[n - 1] + tolerance)
      throw new RangeError(`interpolateLinear: position ${x} lies outside the sampled range [${xs[0]}, ${xs[n - 1]}]`);
    if (x <= xs[0]) {
      out[k] = ys[0];
      continue;
    }
    if (x >= xs[n - 1]) {
      out[k] = ys[n - 1];
      continue;
    }
    if (k > 0 && x < at[k - 1]) j = 0;
    while (j < n - 2 && xs[j + 1] < x) j++;
    const t = (x - xs[j]) / (xs[j + 1] - xs[j]);
    out[k] = ys[j] + t * (ys[j + 1] - ys[j]);
  }
  return out;
}
