import { quantile, standardDeviation } from "./descriptive.ts";

/**
 * Silverman's rule-of-thumb bandwidth for a Gaussian kernel:
 * h = 0.9 · min(s, IQR/1.34) · n^(−1/5). Falls back to s when the IQR is zero.
 * Source: Silverman 1986, Density Estimation for Statistics and Data Analysis, eq. 3.31.
 */
export function silvermanBandwidth(values: ArrayLike<number>): number {
  const n = values.length;
  if (n < 2) throw new RangeError(`silvermanBandwidth: needs at least 2 values, got ${n}`);
  const s = standardDeviation(values);
  const iqr = (quantile(values, 0.75) - quantile(values, 0.25)) / 1.34;
  const spread = iqr > 0 ? Math.min(s, iqr) : s;
  return 0.9 * spread * n ** -0.2;
}

/** Gaussian kernel density estimate (1/n) Σ φ((g − v_i)/h)/h evaluated at each point of `at`. */
export function gaussianKernelDensity(samples: ArrayLike<number>, bandwidth: number, at: ArrayLike<number>): Float64Array {
  if (!(bandwidth > 0)) throw new RangeError(`gaussianKernelDensity: bandwidth must be > 0, got ${bandwidth}`);
  if (samples.length === 0) throw new RangeError("gaussianKernelDensity: no samples");
  const norm = 1 / (samples.length * bandwidth * Math.sqrt(2 * Math.PI));
  const out = new Float64Array(at.length);
  for (let k = 0; k < at.length; k++) {
    let s = 0;
    for (let i = 0; i < samples.length; i++) {
      const z = (at[k] - samples[i]) / bandwidth;
      s += Math.exp(-0.5 * z * z);
    }
    out[k] = s * norm;
  }
  return out;
}
