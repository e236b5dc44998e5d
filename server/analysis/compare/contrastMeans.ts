import { createRandom } from "../random/seededRandom.ts";
import { bootstrapInterval, type BootstrapMethod } from "../stats/bootstrapInterval.ts";
import { mean } from "../stats/descriptive.ts";
import { hedgesG, type HedgesG } from "../stats/hedgesG.ts";
import { permutationTest } from "../stats/permutationTest.ts";
import { welchTTest } from "../stats/welchTTest.ts";

/** A value with its bootstrap confidence interval at the run's level. */
export interface IntervalValue {
  value: number;
  ci95: [number, number] | null;
}

/** Comparison of the mean of one per-embryo metric between groups a and b. */
export interface MeanContrast {
  /** mean(a) − mean(b), with a bootstrap CI resampling embryos within each group. */
  difference: IntervalValue;
  /** mean(a)/mean(b), with a bootstrap CI; null when mean(b) is 0. */
  ratio: IntervalValue | null;
  t_welch: number;
  df_welch: number;
  p_welch: number;
  /** Two-sided permutation p, (b + 1)/(m + 1). */
  p_permutation: number;
  /** Hedges' g for a − b with its approximate SE and normal-theory CI. */
  effect_size: HedgesG;
}

export interface ContrastMeansOptions {
  bootstrap: number;
  permutations: number;
  level: number;
  interval: BootstrapMethod;
  /** Seeds for the three independent random streams. */
  seeds: { difference: number; ratio: number; permutation: number };
}

/**
 * Every comparison the tool reports between two groups' means: bootstrap CIs
 * of the difference and the ratio (units resampled within each group;
 * Efron & Tibshirani 1993), Welch's t (Welch 1947, Biometrika), a permutation
 * test of the difference in means, and Hedges' g (Hedges 1981, J Educ Stat).
 * Both groups need at least 2 embryos.
 */
export function contrastMeans(a: readonly number[], b: readonly number[], options: ContrastMeansOptions): MeanContrast {
  if (a.length < 2 || b.length < 2) throw new RangeError(`contrastMeans: each group needs at least 2 embryos, got ${a.length} and ${b.length}`);
  const common = { resamples: options.bootstrap, level: options.level, method: options.interval };
  const diff = bootstrapInterval([a, b], ([x, y]) => mean(x) - mean(y), { ...common, random: createRandom(options.seeds.difference) });
  const meanB = mean(b);
  const ratio = meanB === 0
    ? null
    : bootstrapInterval([a, b], ([x, y]) => mean(x) / mean(y), { ...common, random: createRandom(options.seeds.ratio) });
  const welch = welchTTest(a, b);
  const perm = permutationTest(a, b, { permutations: options.permutations, random: createRandom(options.seeds.permutation) });
  return {
    difference: { value: diff.value, ci95: diff.interval },
    ratio: ratio === null ? null : { value: ratio.value, ci95: ratio.interval },
    t_welch: welch.t,
    df_welch: welch.df,
    p_welch: welch.p,
    p_permutation: perm.p,
    effect_size: hedgesG(a, b, options.level),
  };
}
