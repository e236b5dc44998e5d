import { z } from "zod";

/** Every setting of a size-scaling analysis, with its default. */
export const ScalingOptions = z.object({
  /** Field that splits embryos into the groups analysed separately. */
  by: z.string().trim().min(1).default("group"),
  level: z.number().gt(0.5).lt(1).default(0.95),
  excludeStatuses: z.array(z.string()).default(["excluded", "rejected", "failed"]),
});

export type ScalingOptionsInput = z.input<typeof ScalingOptions>;
export type ResolvedScalingOptions = z.output<typeof ScalingOptions>;
