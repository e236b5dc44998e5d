import { z } from "zod";
import { modelNames } from "../../analysis/models/steadyStateModel.ts";
import { Selection } from "../selection.ts";

/** How per-embryo values are gathered for comparisons, tracking and planning. */
export const RecordsRequest = z.object({
  selection: Selection.omit({ channel: true }).default({}),
  /** Channel whose gradients are compared; the only stored channel by default. */
  channel: z.string().min(1).optional(),
  /**
   * Named fit setting whose fits every group uses (see `morphogauge fits settings`); a
   * model name means that model's default fit. By default the one setting that covers
   * every selected profile; the analysis refuses rather than mix settings.
   */
  fits: z.string().trim().min(1).optional(),
  /** Only fit settings of this model; "best": the model with the smallest AICc summed over all groups, one model for every group. */
  fitModel: z.enum([...modelNames, "best"]).optional(),
  /** Exactly these stored fits (one per profile, one setting), e.g. the fit_ids of a stored analysis, to re-run it on the same inputs. */
  fitIds: z.array(z.number().int().positive()).min(1).max(100_000).optional(),
  /** Also use embryos and profiles that are excluded (they are left out by default and listed). */
  includeExcluded: z.boolean().default(false),
  /** Boundary threshold in a.u.; by default a quarter of the way from the reference group's far-end to its source-end level. */
  threshold: z.number().optional(),
});
export type RecordsRequest = z.output<typeof RecordsRequest>;
