import { z } from "zod";

/** Every setting of a sample-size plan, with its default. */
export const PlanOptions = z.object({
  /** 'mean': detect a change in the mean (e.g. of λ); 'spread': a change in an SD (e.g. σ_x or boundary SD). */
  quantity: z.enum(["mean", "spread"]).default("mean"),
  /** Relative change to detect, e.g. 0.2 for +20% (negative for a decrease; must exceed −1). */
  effect: z.number().gt(-1).refine((v) => v !== 0, "effect must not be 0"),
  /** Observed embryo-to-embryo coefficient of variation (SD/mean) of the metric. */
  cv: z.number().positive().optional(),
  /** Observed SD of the metric, with `mean`, as an alternative to `cv`. */
  sd: z.number().positive().optional(),
  mean: z.number().positive().optional(),
  /** Observed per-embryo values (e.g. λ of a pilot group) from which the CV is computed. */
  observed: z.array(z.number()).min(2).optional(),
  /** Target power; 0.8 by default. */
  power: z.number().gt(0).lt(1).default(0.8),
  /** Two-sided significance level; 0.05 by default. */
  alpha: z.number().gt(0).lt(0.5).default(0.05),
  /** Simulated experiments per n for Welch's t (or the F-test for spread). */
  simulations: z.number().int().min(100).max(1_000_000).default(2000),
  /** Simulated experiments per n for the permutation test (slower; 0 to skip). */
  permutationSimulations: z.number().int().min(0).max(100_000).default(400),
  /** Relabellings per simulated permutation test. */
  permutations: z.number().int().min(99).max(100_000).default(999),
  /** Group sizes for the power table; around the proposed n when absent. */
  nValues: z.array(z.number().int().min(2).max(100_000)).min(1).optional(),
  /** Largest n searched. */
  maxN: z.number().int().min(2).max(1_000_000).default(10_000),
  seed: z.number().int().default(1),
}).refine((o) => o.quantity === "spread" || o.cv !== undefined || (o.sd !== undefined && o.mean !== undefined) || o.observed !== undefined, {
  message: "a mean plan needs the embryo-to-embryo variability: give cv, or sd with mean, or observed values",
  path: ["cv"],
});

export type PlanOptionsInput = z.input<typeof PlanOptions>;
export type ResolvedPlanOptions = z.output<typeof PlanOptions>;
