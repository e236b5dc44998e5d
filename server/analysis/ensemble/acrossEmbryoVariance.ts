/**
 * How much embryos differ from one another, in a form comparable across
 * normalisations: the across-embryo variance averaged over grid positions,
 * and that variance relative to the variance of the mean profile along the
 * axis (a scale-free noise-to-signal ratio).
 */
export interface AcrossEmbryoVariance {
  /** Mean over grid positions of the across-embryo sample variance (ddof 1), in intensity units². */
  meanVariance: number;
  /** Variance of the mean profile along the axis, in intensity units². */
  profileVariance: number;
  /** meanVariance / profileVariance; null when the mean profile is flat. */
  relative: number | null;
}

/** The effect of one preparation step on the across-embryo variance. */
export interface VarianceStep {
  step: "orientation" | "normalisation";
  before: AcrossEmbryoVariance;
  after: AcrossEmbryoVariance;
  /** 1 − relative(after)/relative(before): the share of scale-free variance the step removed (negative if it added). */
  fractionRemoved: number | null;
}

export function acrossEmbryoVariance(values: readonly ArrayLike<number>[]): AcrossEmbryoVariance {
  const n = values.length;
  if (n < 2) throw new RangeError(`acrossEmbryoVariance: needs at least 2 embryos, got ${n}`);
  const g = values[0].length;
  const meanProfile = new Float64Array(g);
  let varianceSum = 0;
  for (let k = 0; k < g; k++) {
    let m = 0;
    for (let i = 0; i < n; i++) m += values[i][k];
    m /= n;
    let ss = 0;
    for (let i = 0; i < n; i++) ss += (values[i][k] - m) ** 2;
    varianceSum += ss / (n - 1);
    meanProfile[k] = m;
  }
  let grand = 0;
  for (let k = 0; k < g; k++) grand += meanProfile[k];
  grand /= g;
  let profileVariance = 0;
  for (let k = 0; k < g; k++) profileVariance += (meanProfile[k] - grand) ** 2;
  profileVariance /= g;
  const meanVariance = varianceSum / g;
  return { meanVariance, profileVariance, relative: profileVariance > 0 ? meanVariance / profileVariance : null };
}

export function varianceStep(step: VarianceStep["step"], before: AcrossEmbryoVariance, after: AcrossEmbryoVariance): VarianceStep {
  const fractionRemoved =
    before.relative !== null && after.relative !== null && before.relative > 0 ? 1 - after.relative / before.relative : null;
  return { step, before, after, fractionRemoved };
}
