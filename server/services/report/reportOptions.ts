import { z } from "zod";

/** What a report covers and how missing analyses are run; every default lives here. */
export const ReportOptions = z.object({
  /** Genotypes to report; every stored genotype by default. */
  genotypes: z.array(z.string().min(1)).min(1).optional(),
  /** Channels to report; every stored channel by default. */
  channels: z.array(z.string().min(1)).min(1).optional(),
  /** Fit setting whose fits, comparisons, tracking analyses and plans are reported; all by default, each naming its own. */
  fits: z.string().trim().min(1).optional(),
  /** Bootstrap resamples of a precision analysis the report has to run itself (fewer than the analysis default of 1000, to stay quick). */
  bootstrap: z.number().int().min(0).max(100_000).default(200),
});
export type ReportOptions = z.output<typeof ReportOptions>;
