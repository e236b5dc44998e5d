import { z } from "zod";
import { Selection } from "../selection.ts";

/** What a caller asks of a precision analysis; serialisable, so it can travel to a worker thread. */
export const PrecisionRequest = z.object({
  /** Profiles to use; without a genotype, each genotype is analysed as its own group. */
  selection: Selection.omit({ channel: true }).default({}),
  /** One channel, or several measured in the same embryos for the joint positional error; the only stored channel by default. */
  channels: z.array(z.string().min(1)).min(1).max(8).optional(),
  /** Coordinates: µm from the source ("absolute") or fraction of embryo length ("relative"). */
  coords: z.enum(["absolute", "relative"]).default("absolute"),
  /** Per-embryo normalisation before computing spreads. */
  normalisation: z.enum(["none", "minmax", "scale-offset"]).default("none"),
  /** "auto" flips embryos that run against their group; "none" only flags them. */
  flip: z.enum(["none", "auto"]).default("none"),
  /** Grid spacing in grid units (µm or fraction); the profiles' median spacing by default. */
  spacing: z.number().positive().optional(),
  /** Grid range [from, to] in grid units; where every profile has data by default. */
  range: z.tuple([z.number(), z.number()]).optional(),
  /** Slope of the mean: Savitzky–Golay smoothing of the mean, or an exponential fitted to the mean ("model"). */
  derivative: z.enum(["savitzky-golay", "model"]).default("savitzky-golay"),
  /**
   * Fit window of the "model" derivative in grid units (µm, or fraction with relative coords), either
   * end optional as with fit's window; by default the information region, so the model is never
   * fitted through a source plateau or the far-end background.
   */
  modelWindow: z
    .object({ from: z.number().optional(), to: z.number().optional() })
    .refine((w) => w.from === undefined || w.to === undefined || w.from < w.to, { message: "the window's start must be below its end" })
    .optional(),
  /** Boundary threshold intensity (after normalisation). */
  threshold: z.number().optional(),
  /** Or: the threshold is the mean's level at this position. */
  atPosition: z.number().optional(),
  /** Positions at which to report σ_x. */
  positions: z.array(z.number()).max(100).default([]),
  /**
   * Region [from, to] (grid units) for positional information and the headline σ_x, the same for every
   * group; by default the span covered by every profile of every selected group, trimmed by 10% at each end.
   */
  region: z.tuple([z.number(), z.number()]).refine(([a, b]) => a < b, { message: "the region's start must be below its end" }).optional(),
  /** Bootstrap resamples of whole embryos; 1000 by default. */
  bootstrap: z.number().int().min(0).max(100_000).default(1000),
  /** Seed of the bootstrap. */
  seed: z.number().int().default(1),
  /** When a position's σ_x is left out: slope below `minSlopeSnr` standard errors, or σ_x above `maxSigmaFraction` of the grid span. */
  mask: z.object({ minSlopeSnr: z.number().min(0).default(3), maxSigmaFraction: z.number().positive().default(0.25) }).prefault({}),
  /** Also use embryos and profiles that are excluded (they are left out by default and listed in the result). */
  includeExcluded: z.boolean().default(false),
  /** Also estimate positional information with kernel densities (slow). */
  kernelDensity: z.boolean().default(false),
});
export type PrecisionRequest = z.output<typeof PrecisionRequest>;
