import { z } from "zod";
import { RecordsRequest } from "./recordsRequest.ts";

/** How a gradient is followed over development, gene dosage or embryo size. */
export const TrackRequest = RecordsRequest.extend({
  /** stage or age: metric over developmental time; dosage: boundary shift against ln(dosage); length: scaling with embryo length. */
  over: z.enum(["stage", "age", "dosage", "length"]),
  /** Quantity followed over stage or age. */
  metric: z.enum(["lambda", "amplitude", "boundary"]).default("lambda"),
  /** Trend fitted over stage or age. */
  trend: z.enum(["linear", "saturating", "none"]).default("linear"),
  /** Number of equal-width time bins. */
  bins: z.number().int().min(1).max(200).default(6),
  bootstrap: z.number().int().min(100).max(1_000_000).default(2000),
  seed: z.number().int().default(1),
});
export type TrackRequest = z.output<typeof TrackRequest>;

/** Sample-size planning from the observed embryo-to-embryo variability. */
export const PlanRequest = RecordsRequest.extend({
  /** Relative change to detect, e.g. 0.15 for 15%. */
  effect: z.number().gt(-1).refine((v) => v !== 0, "effect must not be 0"),
  power: z.number().gt(0).lt(1).default(0.8),
  alpha: z.number().gt(0).lt(0.5).default(0.05),
  /** lambda: a change in mean λ; sigma_x: a change in a spread (σ_x or boundary SD). */
  metric: z.enum(["lambda", "sigma_x"]).default("lambda"),
  /** Group whose variability is used (genotype); by default the most variable selected group (largest CV), which is conservative. */
  group: z.string().min(1).optional(),
  simulations: z.number().int().min(100).max(100_000).default(2000),
  permutationSimulations: z.number().int().min(0).max(10_000).default(400),
  seed: z.number().int().default(1),
});
export type PlanRequest = z.output<typeof PlanRequest>;
