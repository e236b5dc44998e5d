import { z } from "zod";
import { modelNames } from "../../analysis/models/steadyStateModel.ts";
import { Selection } from "../selection.ts";

/** How per-embryo values are gathered for comparisons, tracking and planning. */
export const RecordsRequest = z.object({
  selection: Selection.omit({ channel: true }).default({}),
  /** Channel whose gradients are compared; the only stored channel by default. */
  channel: z.string().min(1).optional(),
  /** Model whose fitted λ, amplitude and background are used (the newest fit of each profile). */
  fitModel: z.enum(modelNames).default("exponential"),
  /** Boundary threshold in a.u.; by default a quarter of the way from the reference group's far-end to its source-end level. */
  threshold: z.number().optional(),
});
export type RecordsRequest = z.output<typeof RecordsRequest>;
