import { z } from "zod";

/** A model curve for the group mean, e.g. the group's exponential fit: value and slope at each grid position. */
export type SlopeModel = (xs: number[]) => { value: number[]; slope: number[] };

/** Refits the model to a mean profile (one per bootstrap resample): the slope at each grid position, or null when the fit fails. */
export type SlopeRefit = (xs: number[], mean: number[]) => ArrayLike<number> | null;

/** Called during long computations with the fraction done (0 … 1) and the stage name. */
export type ProgressCallback = (fraction: number, stage: string) => void;

const Interval = z
  .tuple([z.number(), z.number()])
  .refine(([from, to]) => to > from, { message: "interval must have from < to" });

/**
 * Every option of the precision analysis and its default; the numeric code
 * receives `PrecisionSettings` (the parsed output) and never checks for
 * undefined again. Positions and lengths are in grid units: µm for absolute
 * coordinates, fraction of embryo length for relative ones.
 */
export const PrecisionOptions = z.object({
  /** Grid coordinates: "absolute" (µm from the source end) or "relative" (x/L, needs lengthUm); "absolute" by default. */
  coords: z.enum(["absolute", "relative"]).default("absolute"),
  grid: z
    .object({
      /** Grid spacing in grid units; null (default) for the median native spacing of the profiles. */
      spacing: z.number().positive().nullable().default(null),
      /** [from, to] of the grid; null (default) for the range covered by every profile. */
      range: Interval.nullable().default(null),
    })
    .prefault({}),
  /** Per-embryo normalisation: "none" (default), "minmax" or "scale-offset". */
  normalisation: z.enum(["none", "minmax", "scale-offset"]).default("none"),
  /** "none" (default) only flags embryos that run against the group; "auto" flips them. */
  flip: z.enum(["none", "auto"]).default("none"),
  derivative: z
    .object({
      /** Slope of the mean: "savitzky-golay" (default) on the mean profile, or "model" from `slopeModel`. */
      method: z.enum(["savitzky-golay", "model"]).default("savitzky-golay"),
      /**
       * Odd Savitzky–Golay window in grid points; null (default) for the odd number nearest
       * to 1/15 of the grid, at least polynomialOrder + 2. Also used for the slope's standard
       * error in the masking rule when the model supplies the slope.
       */
      windowPoints: z.int().min(3).nullable().default(null).refine((w) => w === null || w % 2 === 1, { message: "windowPoints must be odd" }),
      /** Savitzky–Golay polynomial order, 1–6; 3 by default. */
      polynomialOrder: z.int().min(1).max(6).default(3),
      /** Required when method is "model": (xs) => { value, slope } at the grid positions. */
      slopeModel: z.custom<SlopeModel>((v) => typeof v === "function", { message: "slopeModel must be a function (xs) => { value, slope }" }).optional(),
      /**
       * Model only: refits the model to each bootstrap resample's mean, so the intervals include
       * the model's own uncertainty; without it the model slope is held fixed in the resamples.
       */
      refit: z.custom<SlopeRefit>((v) => typeof v === "function", { message: "refit must be a function (xs, mean) => slope" }).optional(),
    })
    .refine((d) => d.method !== "model" || d.slopeModel !== undefined, {
      message: 'slopeModel is required when method is "model"',
      path: ["slopeModel"],
    })
    .refine((d) => d.windowPoints === null || d.windowPoints > d.polynomialOrder, {
      message: "windowPoints must exceed polynomialOrder",
      path: ["windowPoints"],
    })
    .prefault({}),
  mask: z
    .object({
      /**
       * A position is masked when |dc̄/dx| is below this many standard errors of the data's
       * slope there (the data cannot resolve a slope); 3 by default, 0 disables the rule.
       */
      minSlopeSnr: z.number().min(0).default(3),
      /** A position is masked when σ_x exceeds this fraction of the grid's span; 0.25 by default. */
      maxSigmaFraction: z.number().positive().default(0.25),
    })
    .prefault({}),
  /**
   * Region for positional information, the headline σ_x and decoding: [from, to] in grid units,
   * inside the grid; null (default) for the default region below. The region never shrinks:
   * positions inside it whose slope is not resolved count as carrying no information.
   */
  region: Interval.nullable().default(null),
  regionDefault: z
    .object({
      /**
       * Span the default region is cut from: null (default) for the range covered by every
       * profile of this group; a caller analysing several groups passes the span covered by all of them.
       */
      span: Interval.nullable().default(null),
      /** Fraction of the span cut from each end; 0.1 by default (see analysisRegion.ts). */
      trimFraction: z.number().min(0).max(0.45).default(0.1),
    })
    .prefault({}),
  /** Positions at which σ_x is reported; none by default. */
  positions: z.array(z.number()).default([]),
  boundary: z
    .object({
      /** Threshold intensity (after normalisation); null (default) to take the mean's level at `atPosition`. */
      threshold: z.number().nullable().default(null),
      /** Position whose mean level becomes the threshold; null (default) for the middle of the region. */
      atPosition: z.number().nullable().default(null),
    })
    .prefault({}),
  information: z
    .object({
      /** Gauss–Hermite nodes for the direct estimate's concentration integral (with K channels ⌈n/K⌉ per axis, at least 4); 12 by default (error below 1e-3 bits in tests). */
      hermiteNodes: z.int().min(4).max(64).default(12),
      /** Also estimate the direct information with kernel densities for P(c|x) (slow: ~n²·grid per resample); false by default. */
      kernelDensity: z.boolean().default(false),
      /** Extrapolate the direct estimate to infinitely many embryos from subsamples; true by default. */
      extrapolate: z.boolean().default(true),
      /** Random subsamples per size for the extrapolation and its interval; 10 by default. */
      extrapolationRepeats: z.int().min(2).max(100).default(10),
    })
    .prefault({}),
  bootstrap: z
    .object({
      /** Resamples of whole embryos for confidence intervals; 1000 by default, 0 for none. */
      resamples: z.int().min(0).max(100000).default(1000),
      /** Seed of the random stream used for resampling and subsampling; 1 by default. */
      seed: z.int().default(1),
      /**
       * Resamples (the first ones, at most `resamples`) that also compute the slow estimates —
       * the raw direct, kernel-density and multi-channel direct information; 200 by default.
       */
      slowResamples: z.int().min(0).max(100000).default(200),
    })
    .prefault({}),
  decoding: z
    .object({
      /** Compute the maximum-likelihood decoding map; true by default. */
      enabled: z.boolean().default(true),
      /** Decode each embryo with statistics from the others; true by default. */
      leaveOneOut: z.boolean().default(true),
      /**
       * Odd number of neighbouring grid positions over which the decoder's covariance is pooled;
       * null (default) for the slope's smoothing window; 1 for none.
       */
      poolPoints: z.int().min(1).nullable().default(null).refine((w) => w === null || w % 2 === 1, { message: "poolPoints must be odd" }),
    })
    .prefault({}),
  /** Per-embryo summaries supplied by the caller, e.g. { "e1": { lambdaUm: 82.1 } }; screened for outliers. */
  embryoSummaries: z.record(z.string(), z.record(z.string(), z.number())).default({}),
  /** |robust z| above which an embryo's summary is flagged; 3.5 by default (Iglewicz & Hoaglin 1993). */
  outlierThreshold: z.number().positive().default(3.5),
  /** Summaries (in µm) regressed log–log on embryo length; ["lambdaUm"] by default. */
  scalingMetrics: z.array(z.string()).default(["lambdaUm"]),
  /** Progress reports during long computations; none by default. */
  onProgress: z.custom<ProgressCallback>((v) => typeof v === "function", { message: "onProgress must be a function" }).optional(),
});

export type PrecisionOptionsInput = z.input<typeof PrecisionOptions>;
export type PrecisionSettings = z.output<typeof PrecisionOptions>;
