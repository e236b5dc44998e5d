import type { Estimate } from "../estimate.ts";
import type { Random } from "../random/seededRandom.ts";
import { bootstrapInterval, type BootstrapMethod } from "../stats/bootstrapInterval.ts";
import { percentileInterval } from "../stats/bootstrap.ts";
import { standardDeviation } from "../stats/descriptive.ts";
import { normalCdf, normalQuantile } from "../stats/normal.ts";
import type { IntervalValue } from "./contrastMeans.ts";

/** Comparison of two spreads (boundary SDs or minimal positional errors σ_x). */
export interface SpreadRatio {
  /** 'embryos': SDs of per-embryo boundaries, resampled by embryo; 'supplied': σ_x or SD estimates handed in. */
  source: "embryos" | "supplied";
  value_a: number;
  value_b: number;
  /** spread(a)/spread(b) with its CI; 1 means equal spread. */
  ratio: IntervalValue;
  /** spread(a) − spread(b) with its CI. */
  difference: IntervalValue;
  /** SE of ln(ratio), from the bootstrap replicates or the delta method; null when unknown. */
  se_log_ratio: number | null;
  /** Approximate two-sided p for equal spread, 2Φ(−|ln r|/SE(ln r)); null when the SE is unknown. */
  p_spread: number | null;
  /** Whether the CI of the ratio contains 1; null without a CI. */
  equal_spread_plausible: boolean | null;
  /** How the interval was formed. */
  method: string;
}

export interface SpreadRatioOptions {
  bootstrap: number;
  level: number;
  interval: BootstrapMethod;
  random: Random;
}

/**
 * Ratio of the embryo-to-embryo SDs of boundary positions between two groups,
 * with a bootstrap CI that resamples embryos within each group (Efron &
 * Tibshirani 1993). For small noise the boundary SD equals σ_x at the
 * boundary (Gregor et al. 2007, Cell). Each group needs at least 3 embryos.
 */
export function boundarySpreadRatio(a: readonly number[], b: readonly number[], options: SpreadRatioOptions): SpreadRatio {
  if (a.length < 3 || b.length < 3) throw new RangeError(`boundarySpreadRatio: each group needs at least 3 boundaries, got ${a.length} and ${b.length}`);
  const common = { resamples: options.bootstrap, level: options.level, method: options.interval, random: options.random };
  const ratio = bootstrapInterval([a, b], ([x, y]) => standardDeviation(x) / standardDeviation(y), common);
  const difference = bootstrapInterval([a, b], ([x, y]) => standardDeviation(x) - standardDeviation(y), common);
  const logs = Array.from(ratio.replicates).filter((r) => r > 0 && Number.isFinite(r)).map(Math.log);
  const seLog = logs.length >= 2 ? standardDeviation(logs) : null;
  return finish("embryos", standardDeviation(a), standardDeviation(b), ratio.interval, difference.interval, seLog,
    `${options.interval === "bca" ? "BCa" : "percentile"} bootstrap, ${options.bootstrap} resamples of embryos within each group`);
}

/** A spread estimate handed in by a caller, with its bootstrap replicates where available. */
export interface SuppliedSpread {
  estimate: Estimate;
  replicates?: readonly number[];
}

/**
 * Ratio of two supplied spreads (e.g. each group's minimal σ_x). With
 * bootstrap replicates for both groups, replicates are paired at random
 * (the groups were resampled independently) and the percentile interval of
 * the paired ratios is reported. Otherwise the delta method on the log scale:
 * SE(ln r)² = (SE_a/a)² + (SE_b/b)², CI r·exp(±z·SE). A missing SE is taken
 * from the 95% CI as (high − low)/(2·1.96).
 */
export function suppliedSpreadRatio(a: SuppliedSpread, b: SuppliedSpread, options: SpreadRatioOptions): SpreadRatio {
  const va = a.estimate.value;
  const vb = b.estimate.value;
  if (!(va > 0 && vb > 0)) throw new RangeError(`suppliedSpreadRatio: spreads must be positive, got ${va} and ${vb}`);
  const ra = (a.replicates ?? []).filter((v) => Number.isFinite(v) && v > 0);
  const rb = (b.replicates ?? []).filter((v) => Number.isFinite(v) && v > 0);
  if (ra.length >= 20 && rb.length >= 20) {
    const pairs = Math.max(ra.length, rb.length, options.bootstrap);
    const ratios = new Float64Array(pairs);
    const diffs = new Float64Array(pairs);
    for (let k = 0; k < pairs; k++) {
      const x = ra[options.random.int(ra.length)];
      const y = rb[options.random.int(rb.length)];
      ratios[k] = x / y;
      diffs[k] = x - y;
    }
    const seLog = standardDeviation(Array.from(ratios, Math.log));
    return finish("supplied", va, vb, percentileInterval(ratios, options.level).interval, percentileInterval(diffs, options.level).interval, seLog,
      `percentile interval of ${pairs} randomly paired bootstrap replicates`);
  }
  const sa = seOf(a);
  const sb = seOf(b);
  if (sa === null || sb === null) {
    return finish("supplied", va, vb, null, null, null, "no standard errors supplied; no interval");
  }
  const z = normalQuantile(0.5 + options.level / 2);
  const seLog = Math.hypot(sa / va, sb / vb);
  const r = va / vb;
  const seDiff = Math.hypot(sa, sb);
  return finish("supplied", va, vb, [r * Math.exp(-z * seLog), r * Math.exp(z * seLog)], [va - vb - z * seDiff, va - vb + z * seDiff], seLog,
    "delta method on the log scale from the supplied standard errors");
}

function seOf(s: SuppliedSpread): number | null {
  if (s.estimate.se !== null && s.estimate.se > 0) return s.estimate.se;
  const rep = (s.replicates ?? []).filter(Number.isFinite);
  if (rep.length >= 2) return standardDeviation(rep);
  if (s.estimate.ci95) return (s.estimate.ci95[1] - s.estimate.ci95[0]) / (2 * 1.959963984540054);
  return null;
}

function finish(
  source: SpreadRatio["source"], va: number, vb: number,
  ratioCi: [number, number] | null, diffCi: [number, number] | null, seLog: number | null, method: string,
): SpreadRatio {
  const r = va / vb;
  const p = seLog !== null && seLog > 0 ? 2 * normalCdf(-Math.abs(Math.log(r)) / seLog) : null;
  return {
    source,
    value_a: va,
    value_b: vb,
    ratio: { value: r, ci95: ratioCi, interval_method: method },
    difference: { value: va - vb, ci95: diffCi, interval_method: method },
    se_log_ratio: seLog,
    p_spread: p,
    equal_spread_plausible: ratioCi === null ? null : ratioCi[0] <= 1 && ratioCi[1] >= 1,
    method,
  };
}
