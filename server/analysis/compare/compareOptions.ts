import { z } from "zod";
import { EstimateSchema } from "./estimateSchema.ts";

/** Called as work proceeds: fraction done in [0, 1] and the current stage. */
export type ProgressCallback = (fraction: number, stage: string) => void;

/** Per-group results computed elsewhere (profile-level fits), keyed by group label. */
export const GroupExtras = z.object({
  /** λ from a global fit of all the group's profiles together, in µm. */
  lambdaGlobalUm: EstimateSchema.optional(),
  /** The group's minimal positional error σ_x in µm. */
  sigmaXMinUm: EstimateSchema.optional(),
  /** Bootstrap replicates of the minimal σ_x (resampled embryos), in µm. */
  sigmaXReplicatesUm: z.array(z.number()).optional(),
  /** Boundary SD in µm, for groups whose records carry no per-embryo boundary. */
  boundarySdUm: EstimateSchema.optional(),
  /** Bootstrap replicates of that boundary SD, in µm. */
  boundarySdReplicatesUm: z.array(z.number()).optional(),
});
export type GroupExtras = z.output<typeof GroupExtras>;

/** Every setting of a group comparison and its default, in one place. */
export const CompareOptions = z.object({
  /**
   * Field to group embryos by: a record field (group, genotype, channel,
   * session, stage, ageS, dosage) or a metadata key. 'group' by default.
   */
  by: z.string().trim().min(1).default("group"),
  /** Window width for grouping by a numeric field (e.g. 600 for 10-min age windows); none by default. */
  window: z.number().positive().optional(),
  /** Compare each group against this one; all pairs when absent. */
  reference: z.string().optional(),
  /** Quantity contrasted between groups. 'sigma_x' compares spreads (supplied σ_x, else boundary SDs). */
  metric: z.enum(["lambda", "amplitude", "boundary", "sigma_x"]).default("lambda"),
  /** Random relabellings per permutation test; 10,000 by default. */
  permutations: z.number().int().min(99).max(1_000_000).default(10_000),
  /** Bootstrap resamples per interval; 2000 by default. */
  bootstrap: z.number().int().min(100).max(1_000_000).default(2000),
  /** Type of the bootstrap intervals kept as a second opinion beside the t-based headline: bias-corrected and accelerated, or plain percentile. */
  interval: z.enum(["bca", "percentile"]).default("bca"),
  /**
   * Which p-value of each mean contrast Holm's adjustment is applied to; Welch's
   * by default, the test the headline intervals invert, so adjusted and
   * unadjusted results tell one story.
   */
  holmOn: z.enum(["permutation", "welch"]).default("welch"),
  /** Seed of every bootstrap and permutation stream; recorded in the result. */
  seed: z.number().int().default(1),
  /** Confidence level of every interval, in (0.5, 1); 0.95 by default. */
  level: z.number().gt(0.5).lt(1).default(0.95),
  /** Curation statuses whose embryos are left out (case-insensitive). */
  excludeStatuses: z.array(z.string()).default(["excluded", "rejected", "failed"]),
  /** Per-group results from profile-level fits, keyed by group label. */
  extras: z.record(z.string(), GroupExtras).default({}),
  /** Progress callback `(fraction, stage) => void`; not recorded in the settings. */
  progress: z.custom<ProgressCallback>((v) => typeof v === "function", { message: "progress must be a function" }).optional(),
});

export type CompareOptionsInput = z.input<typeof CompareOptions>;
export type ResolvedCompareOptions = z.output<typeof CompareOptions>;
