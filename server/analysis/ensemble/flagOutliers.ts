import { robustZScores } from "../stats/robustZScore.ts";

/** Robust z-scores of per-embryo summaries and the embryos beyond the threshold. Outliers are flagged, never dropped. */
export interface OutlierReport {
  /** |robust z| above which an embryo is flagged. */
  threshold: number;
  metrics: {
    metric: string;
    /** Scale the z-scores were computed on; median and scaledMad are on this scale. */
    scale: "linear" | "log";
    median: number;
    scaledMad: number;
    /** null z when the embryo has no value for this metric or the MAD is zero. */
    scores: { embryo: string; value: number | null; z: number | null }[];
  }[];
  flagged: { embryo: string; metric: string; value: number; z: number }[];
  /** Metrics that could not be scored, with the reason. */
  skipped: { metric: string; reason: string }[];
}

/**
 * Flag embryos whose summary (decay length, fitted scale, residual, boundary
 * position, …) lies more than `threshold` robust standard deviations from the
 * group median. Source: Iglewicz & Hoaglin 1993 (modified z-score, 3.5 suggested).
 */
export interface OutlierOptions {
  /**
   * Metrics scored on the log scale (positive, multiplicative quantities such as a scale factor
   * or a residual size, whose spread grows with their value).
   */
  logScale?: readonly string[];
  /** Metrics flagged only when too large (e.g. a residual: small is never suspicious). */
  upperOnly?: readonly string[];
}

export function flagOutliers(
  embryos: readonly string[],
  metrics: Readonly<Record<string, ArrayLike<number | null>>>,
  threshold = 3.5,
  options: OutlierOptions = {},
): OutlierReport {
  if (!(threshold > 0)) throw new RangeError(`flagOutliers: threshold must be > 0, got ${threshold}`);
  const report: OutlierReport = { threshold, metrics: [], flagged: [], skipped: [] };
  for (const [metric, raw] of Object.entries(metrics)) {
    if (raw.length !== embryos.length)
      throw new RangeError(`flagOutliers: metric "${metric}" has ${raw.length} values for ${embryos.length} embryos`);
    const log = options.logScale?.includes(metric) ?? false;
    const upperOnly = options.upperOnly?.includes(metric) ?? false;
    const present: number[] = [];
    const values: (number | null)[] = [];
    const scored: (number | null)[] = [];
    for (let i = 0; i < raw.length; i++) {
      const v = raw[i];
      const ok = v !== null && Number.isFinite(v) && (!log || v > 0);
      values.push(v !== null && Number.isFinite(v) ? v : null);
      scored.push(ok ? (log ? Math.log(v) : v) : null);
      if (ok) present.push(log ? Math.log(v) : v);
    }
    if (present.length < 3) {
      report.skipped.push({ metric, reason: `only ${present.length} embryos have a value; at least 3 are needed` });
      continue;
    }
    const robust = robustZScores(present);
    if (robust.scores === null) {
      report.skipped.push({ metric, reason: "more than half the embryos share one value (MAD is zero)" });
      continue;
    }
    const scores = embryos.map((embryo, i) => {
      const v = scored[i];
      return { embryo, value: values[i], z: v === null ? null : (v - robust.median) / robust.scaledMad };
    });
    report.metrics.push({ metric, scale: log ? "log" : "linear", median: robust.median, scaledMad: robust.scaledMad, scores });
    for (const s of scores)
      if (s.z !== null && s.value !== null && (upperOnly ? s.z : Math.abs(s.z)) > threshold)
        report.flagged.push({ embryo: s.embryo, metric, value: s.value, z: s.z });
  }
  return report;
}
