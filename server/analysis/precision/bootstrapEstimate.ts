import type { Estimate } from "../estimate.ts";
import { percentileInterval } from "../stats/bootstrap.ts";
import { studentTQuantile } from "../stats/studentT.ts";

/** An estimate with its bootstrap bias: mean of the replicates minus the estimate. */
export interface BootstrapEstimate extends Estimate {
  /**
   * Bootstrap estimate of the bias, mean(θ*) − θ̂ (Efron & Tibshirani 1993, ch. 10); null without
   * replicates. When it is larger than `se`, the percentile interval may not contain the value:
   * the statistic is biased at this number of embryos.
   */
  bias: number | null;
}

/**
 * A length (σ_x, a boundary SD, …) in grid units, with the same in µm and as a fraction of
 * embryo length; conversions between the two use the mean embryo length of the group.
 */
export interface ScaledEstimate extends BootstrapEstimate {
  /** The value in µm; null when it cannot be converted (relative grid without lengths). */
  um: Estimate | null;
  /** The value as a fraction of the mean embryo length; null when lengths are unknown. */
  fractionOfLength: Estimate | null;
}

/** How many resamples gave a finite value. */
export interface ReplicateUse {
  used: number;
  dropped: number;
}

/**
 * Estimate from a point value and its bootstrap replicates: standard error = SD of the
 * finite replicates, 95% CI = percentile interval (Efron & Tibshirani 1993, ch. 13),
 * bias = mean of the replicates − estimate (ch. 10).
 * Returns null for a non-finite point value; se, ci95 and bias are null without replicates
 * or when fewer than half of them are finite.
 */
export function bootstrapEstimate(value: number, replicates: ArrayLike<number> | null, use?: ReplicateUse[]): BootstrapEstimate | null {
  if (!Number.isFinite(value)) return null;
  if (!replicates || replicates.length === 0) return { value, se: null, ci95: null, bias: null };
  const finite = Array.from(replicates).filter(Number.isFinite);
  if (finite.length < Math.max(2, replicates.length / 2)) {
    use?.push({ used: finite.length, dropped: replicates.length - finite.length });
    return { value, se: null, ci95: null, bias: null };
  }
  const mean = finite.reduce((a, b) => a + b, 0) / finite.length;
  const se = Math.sqrt(finite.reduce((a, b) => a + (b - mean) ** 2, 0) / (finite.length - 1));
  const bias = mean - value;
  use?.push({ used: finite.length, dropped: replicates.length - finite.length });
  return { value, se, ci95: percentileInterval(finite).interval, bias };
}

/**
 * Estimate with an interval centred on the value: value ± t(0.975, n − 1)·SE on the chosen scale,
 * SE the bootstrap SD of the replicates inflated by √(n/(n − 1)) (the bootstrap variance of a mean
 * is (n − 1)/n of the usual one; Efron & Tibshirani 1993, ch. 5 and 12). On the log scale the
 * interval is exp(ln v ± t·SE(ln v)): positive, and it always contains the value, unlike a
 * percentile interval of a statistic whose replicates are shifted. `se` is reported on the
 * original scale (v·SE(ln v) on the log scale).
 */
export function centredEstimate(value: number, replicates: ArrayLike<number> | null, embryos: number, scale: "linear" | "log", use?: ReplicateUse[]): BootstrapEstimate | null {
  if (!Number.isFinite(value) || (scale === "log" && !(value > 0))) return null;
  if (!replicates || replicates.length === 0) return { value, se: null, ci95: null, bias: null };
  const finite = Array.from(replicates).filter((v) => Number.isFinite(v) && (scale === "linear" || v > 0));
  use?.push({ used: finite.length, dropped: replicates.length - finite.length });
  if (finite.length < Math.max(2, replicates.length / 2)) return { value, se: null, ci95: null, bias: null };
  const f = scale === "log" ? Math.log : (v: number) => v;
  const onScale = finite.map(f);
  const mean = onScale.reduce((a, b) => a + b, 0) / onScale.length;
  const sd = Math.sqrt(onScale.reduce((a, b) => a + (b - mean) ** 2, 0) / (onScale.length - 1)) * Math.sqrt(embryos / (embryos - 1));
  const t = studentTQuantile(0.975, embryos - 1);
  const bias = finite.reduce((a, b) => a + b, 0) / finite.length - value;
  if (scale === "log") return { value, se: value * sd, ci95: [value * Math.exp(-t * sd), value * Math.exp(t * sd)], bias };
  return { value, se: sd, ci95: [value - t * sd, value + t * sd], bias };
}

/** Multiply an estimate (value, se, CI) by a positive factor, e.g. µm per grid unit. */
export function scaleEstimate(e: Estimate, factor: number): Estimate {
  return {
    value: e.value * factor,
    se: e.se === null ? null : e.se * factor,
    ci95: e.ci95 === null ? null : [e.ci95[0] * factor, e.ci95[1] * factor],
  };
}

/** Attach µm and fraction-of-length versions given the conversion factors (null when unknown). */
export function withLengthUnits(e: Estimate | BootstrapEstimate | null, umPerUnit: number | null, fractionPerUnit: number | null): ScaledEstimate | null {
  if (!e) return null;
  return {
    ...e,
    bias: "bias" in e ? e.bias : null,
    um: umPerUnit === null ? null : scaleEstimate(e, umPerUnit),
    fractionOfLength: fractionPerUnit === null ? null : scaleEstimate(e, fractionPerUnit),
  };
}
