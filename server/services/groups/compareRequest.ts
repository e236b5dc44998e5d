import { z } from "zod";
import { RecordsRequest } from "./recordsRequest.ts";

/** A comparison of groups of embryos: which groups, which metric, how many resamples. */
export const CompareRequest = RecordsRequest.extend({
  /** Field that defines the groups: genotype (default), channel, stage, session, dosage or any metadata key. */
  by: z.string().min(1).default("genotype"),
  /** Compare every group with this one; every pair when absent. */
  reference: z.string().min(1).optional(),
  /** Quantity compared. */
  metric: z.enum(["lambda", "amplitude", "boundary", "sigma_x"]).default("lambda"),
  /** Relabellings per permutation test (at least 10,000 by default). */
  permutations: z.number().int().min(99).max(1_000_000).default(10_000),
  /** Bootstrap resamples per interval. */
  bootstrap: z.number().int().min(100).max(1_000_000).default(2000),
  seed: z.number().int().default(1),
});
export type CompareRequest = z.output<typeof CompareRequest>;
