import { z } from "zod";
import { EstimateSchema } from "../estimateSchema.ts";

/** Every setting of a dosage-series analysis, with its default. */
export const DosageOptions = z.object({
  /**
   * λ from profile fits to set beside the λ from the boundary shift, in µm
   * (e.g. a global fit). Without it, the mean of the series' per-embryo λ is used.
   */
  lambdaFitUm: EstimateSchema.optional(),
  /** Bootstrap resamples for the per-dosage CIs of the mean boundary. */
  bootstrap: z.number().int().min(100).max(1_000_000).default(2000),
  interval: z.enum(["bca", "percentile"]).default("bca"),
  level: z.number().gt(0.5).lt(1).default(0.95),
  seed: z.number().int().default(1),
  excludeStatuses: z.array(z.string()).default(["excluded", "rejected", "failed"]),
  /**
   * Largest fraction of one dosage's embryos that may have no threshold
   * crossing (0.5 by default). Up to it, those embryos enter the shift as
   * censored values; beyond it the shift estimate is refused, because the
   * dosage's mean boundary would then rest on the assumed normal tail alone.
   */
  maxUncrossedFraction: z.number().min(0).max(0.9).default(0.5),
});

export type DosageOptionsInput = z.input<typeof DosageOptions>;
export type ResolvedDosageOptions = z.output<typeof DosageOptions>;
