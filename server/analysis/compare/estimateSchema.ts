import { z } from "zod";

/** Validation schema for an {@link Estimate} handed in by a caller (value, SE, 95% CI). */
export const EstimateSchema = z.object({
  value: z.number(),
  se: z.number().nonnegative().nullable(),
  ci95: z.tuple([z.number(), z.number()]).nullable(),
});
