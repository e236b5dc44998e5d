import { z } from "zod";

/** Every setting of tracking a metric over developmental time, with its default. */
export const TrackOptions = z.object({
  /** Per-embryo quantity followed over time. */
  metric: z.enum(["lambda", "amplitude", "boundary"]).default("lambda"),
  /** Time axis: age in s, or the stage field (numeric stages are treated as numbers, labels as categories). */
  time: z.enum(["ageS", "stage"]).default("ageS"),
  /** Field that splits embryos into separate series (e.g. genotype). */
  by: z.string().trim().min(1).default("group"),
  /** Equal-width bins over the observed numeric range, when `binEdges` is not given. */
  bins: z.number().int().min(1).max(200).default(6),
  /** Explicit ascending bin edges on the time axis (half-open bins, the last one closed). */
  binEdges: z.array(z.number()).min(2).optional(),
  /** Trend fitted to the per-embryo points. */
  trend: z.enum(["linear", "saturating", "none"]).default("linear"),
  /** Time at which the saturating fit's y0 is reported; 0 by default. */
  timeOrigin: z.number().default(0),
  /** Late part of the span used by the steady-state check (last third by default). */
  lateFraction: z.number().gt(0).max(1).default(1 / 3),
  /** Significance level of the steady-state tests. */
  alpha: z.number().gt(0).lt(1).default(0.05),
  /** Relative distance from the fitted plateau still called steady (5% by default). */
  steadyTolerance: z.number().gt(0).lt(1).default(0.05),
  /** Bootstrap resamples for the second-opinion CIs of each bin's mean (the headline CI is a t interval). */
  bootstrap: z.number().int().min(100).max(1_000_000).default(2000),
  interval: z.enum(["bca", "percentile"]).default("bca"),
  level: z.number().gt(0.5).lt(1).default(0.95),
  seed: z.number().int().default(1),
  excludeStatuses: z.array(z.string()).default(["excluded", "rejected", "failed"]),
}).refine((o) => !o.binEdges || o.binEdges.every((e, i, a) => i === 0 || e > a[i - 1]), {
  message: "binEdges must be strictly ascending",
  path: ["binEdges"],
});

export type TrackOptionsInput = z.input<typeof TrackOptions>;
export type ResolvedTrackOptions = z.output<typeof TrackOptions>;
