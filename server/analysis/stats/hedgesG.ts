import type { Estimate } from "../estimate.ts";
import { logGamma } from "../special/logGamma.ts";
import { mean, standardDeviation } from "./descriptive.ts";
import { normalQuantile } from "./normal.ts";

/** Summary statistics of one group, enough for a standardized difference. */
export interface GroupMoments {
  mean: number;
  /** Sample SD (n − 1 denominator). */
  sd: number;
  n: number;
}

export interface HedgesG extends Estimate {
  /** Cohen's d with the pooled SD, before the small-sample correction. */
  cohensD: number;
  /** Small-sample correction factor J (g = J·d). */
  correction: number;
  /** Degrees of freedom of the pooled SD, na + nb − 2. */
  df: number;
}

/**
 * Hedges' g for mean(a) − mean(b): Cohen's d with the pooled SD times the
 * exact correction J(ν) = Γ(ν/2) / (√(ν/2)·Γ((ν−1)/2)), ν = na + nb − 2, which
 * makes g unbiased for normal data (Hedges 1981, J Educ Stat 6:107–128).
 * SE(g) = J·√((na + nb)/(na·nb) + d²/(2(na + nb))) and a normal-theory CI
 * g ± z·SE (Hedges & Olkin 1985, Statistical Methods for Meta-Analysis;
 * Borenstein et al. 2009, Introduction to Meta-Analysis, ch. 4).
 * `level` sets the interval (0.95 by default); the key stays `ci95` as in {@link Estimate}.
 */
export function hedgesGFromMoments(a: GroupMoments, b: GroupMoments, level = 0.95): HedgesG {
  if (a.n < 2 || b.n < 2) throw new RangeError(`hedgesG: each group needs at least 2 values, got ${a.n} and ${b.n}`);
  const df = a.n + b.n - 2;
  const pooledSd = Math.sqrt(((a.n - 1) * a.sd * a.sd + (b.n - 1) * b.sd * b.sd) / df);
  const difference = a.mean - b.mean;
  // Zero spread in both groups: the standardized difference is 0 for equal means, else unbounded.
  const d = pooledSd === 0 ? (difference === 0 ? 0 : Math.sign(difference) * Infinity) : difference / pooledSd;
  const correction = Math.exp(logGamma(df / 2) - logGamma((df - 1) / 2)) / Math.sqrt(df / 2);
  const g = correction * d;
  const seD = Math.sqrt((a.n + b.n) / (a.n * b.n) + (d * d) / (2 * (a.n + b.n)));
  const se = correction * seD;
  const z = normalQuantile(0.5 + level / 2);
  const finite = Number.isFinite(se);
  return {
    value: g,
    se: finite ? se : null,
    ci95: finite ? [g - z * se, g + z * se] : null,
    cohensD: d,
    correction,
    df,
  };
}

/** Hedges' g for mean(a) − mean(b) from raw samples; see {@link hedgesGFromMoments}. */
export function hedgesG(a: ArrayLike<number>, b: ArrayLike<number>, level = 0.95): HedgesG {
  if (a.length < 2 || b.length < 2) throw new RangeError(`hedgesG: each group needs at least 2 values, got ${a.length} and ${b.length}`);
  return hedgesGFromMoments(
    { mean: mean(a), sd: standardDeviation(a), n: a.length },
    { mean: mean(b), sd: standardDeviation(b), n: b.length },
    level,
  );
}
