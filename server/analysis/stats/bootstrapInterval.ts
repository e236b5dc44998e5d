import type { Random } from "../random/seededRandom.ts";
import { resampleIndices, percentileInterval } from "./bootstrap.ts";
import { quantileSorted, standardDeviation } from "./descriptive.ts";
import { normalCdf, normalQuantile } from "./normal.ts";

export type BootstrapMethod = "percentile" | "bca";

/** A statistic of one or more samples, each passed as its own array. */
export type SampleStatistic = (samples: Float64Array[]) => number;

export interface BootstrapIntervalOptions {
  /** Bootstrap resamples B (e.g. 2000). */
  resamples: number;
  /** Confidence level in (0, 1), e.g. 0.95. */
  level: number;
  method: BootstrapMethod;
  /** Seeded stream; its seed is recorded in the result. */
  random: Random;
}

export interface BootstrapInterval {
  /** The statistic on the original samples. */
  value: number;
  /** Bootstrap standard error: SD of the finite replicates (null with fewer than 2). */
  se: number | null;
  /** Two-sided interval at `level`, or null when it cannot be formed (see `reason`). */
  interval: [number, number] | null;
  level: number;
  method: BootstrapMethod;
  /** BCa bias correction ẑ0 (0 for the percentile method). */
  biasCorrection: number;
  /** BCa acceleration â from the jackknife (0 for the percentile method). */
  acceleration: number;
  /** Finite replicates used, and non-finite replicates dropped. */
  used: number;
  dropped: number;
  /** Why `interval` is null, e.g. every replicate on one side of the estimate. */
  reason: string | null;
  /** The bootstrap replicates in draw order (non-finite ones included). */
  replicates: Float64Array;
  seed: number;
}

/**
 * Bootstrap confidence interval for a statistic of one or more independent
 * samples: each sample is resampled with replacement within itself (e.g.
 * embryos within a genotype), never across samples.
 *
 * Percentile: the (1−level)/2 and (1+level)/2 quantiles of the replicates.
 * BCa: the quantiles at α' = Φ(ẑ0 + (ẑ0 + z_α)/(1 − â(ẑ0 + z_α))), with
 * ẑ0 = Φ⁻¹(fraction of replicates below θ̂, ties counted half) and â from the
 * jackknife, leaving out one unit of one sample at a time and summing the
 * cubed and squared influence terms over samples.
 * Source: Efron & Tibshirani 1993, An Introduction to the Bootstrap, ch. 13,
 * 14.3 and eq. 14.15; multi-sample jackknife as in scipy.stats.bootstrap.
 * Quantiles by linear interpolation (numpy's default), as scipy does.
 */
export function bootstrapInterval(
  samples: ArrayLike<number>[],
  statistic: SampleStatistic,
  options: BootstrapIntervalOptions,
): BootstrapInterval {
  const { resamples, level, method, random } = options;
  if (samples.length === 0) throw new RangeError("bootstrapInterval: needs at least one sample");
  samples.forEach((s, k) => {
    if (s.length < 1) throw new RangeError(`bootstrapInterval: sample ${k} is empty`);
  });
  if (!Number.isInteger(resamples) || resamples < 1) throw new RangeError(`bootstrapInterval: resamples must be a positive integer, got ${resamples}`);
  if (!(level > 0 && level < 1)) throw new RangeError(`bootstrapInterval: level must be in (0, 1), got ${level}`);

  const data = samples.map((s) => Float64Array.from(s));
  const value = statistic(data);
  const buffers = data.map((s) => new Float64Array(s.length));
  const replicates = new Float64Array(resamples);
  for (let r = 0; r < resamples; r++) {
    for (let k = 0; k < data.length; k++) {
      const idx = resampleIndices(data[k].length, random);
      const src = data[k];
      const dst = buffers[k];
      for (let i = 0; i < idx.length; i++) dst[i] = src[idx[i]];
    }
    replicates[r] = statistic(buffers);
  }

  const finite = Float64Array.from(Array.from(replicates).filter(Number.isFinite)).sort();
  const used = finite.length;
  const dropped = resamples - used;
  const base = {
    value, level, method, used, dropped, replicates, seed: random.seed,
    se: used >= 2 ? standardDeviation(finite) : null,
  };
  if (used === 0 || !Number.isFinite(value)) {
    return { ...base, interval: null, biasCorrection: 0, acceleration: 0, reason: "no finite estimate or bootstrap replicates" };
  }
  if (method === "percentile") {
    const { interval } = percentileInterval(finite, level);
    return { ...base, interval, biasCorrection: 0, acceleration: 0, reason: null };
  }

  let below = 0;
  let atOrBelow = 0;
  for (let i = 0; i < used; i++) {
    if (finite[i] < value) below++;
    if (finite[i] <= value) atOrBelow++;
  }
  const z0 = normalQuantile((below + atOrBelow) / (2 * used));
  if (!Number.isFinite(z0)) {
    return { ...base, interval: null, biasCorrection: z0, acceleration: 0, reason: "every bootstrap replicate lies on one side of the estimate; BCa is undefined" };
  }
  const acceleration = jackknifeAcceleration(data, statistic);
  const zAlpha = normalQuantile((1 - level) / 2);
  const adjusted = (z: number): number => {
    const num = z0 + z;
    return normalCdf(z0 + num / (1 - acceleration * num));
  };
  const lower = adjusted(zAlpha);
  const upper = adjusted(-zAlpha);
  if (!(lower >= 0 && lower <= 1 && upper >= 0 && upper <= 1)) {
    return { ...base, interval: null, biasCorrection: z0, acceleration, reason: "BCa percentiles fall outside [0, 1]; the acceleration estimate is unusable" };
  }
  return {
    ...base,
    interval: [quantileSorted(finite, lower), quantileSorted(finite, upper)],
    biasCorrection: z0,
    acceleration,
    reason: null,
  };
}

/**
 * Jackknife acceleration â = Σ_k Σ_i U³/n_k³ / (6 (Σ_k Σ_i U²/n_k²)^{3/2}), with
 * U_i = (n_k − 1)(θ̄_(·) − θ_(i)) for leave-one-out estimates within sample k.
 * Source: Efron & Tibshirani 1993, eq. 14.15. Returns 0 when the jackknife
 * values do not vary (constant data), where no skewness correction is needed.
 */
function jackknifeAcceleration(data: Float64Array[], statistic: SampleStatistic): number {
  let num = 0;
  let den = 0;
  for (let k = 0; k < data.length; k++) {
    const n = data[k].length;
    if (n < 2) continue;
    const leaveOut = new Float64Array(n - 1);
    const args = data.slice();
    args[k] = leaveOut;
    const theta = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      let w = 0;
      for (let j = 0; j < n; j++) if (j !== i) leaveOut[w++] = data[k][j];
      theta[i] = statistic(args);
    }
    let thetaDot = 0;
    for (let i = 0; i < n; i++) thetaDot += theta[i];
    thetaDot /= n;
    let s3 = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const u = (n - 1) * (thetaDot - theta[i]);
      s3 += u * u * u;
      s2 += u * u;
    }
    num += s3 / n ** 3;
    den += s2 / n ** 2;
  }
  const a = den > 0 ? num / (6 * den ** 1.5) : 0;
  return Number.isFinite(a) ? a : 0;
}
