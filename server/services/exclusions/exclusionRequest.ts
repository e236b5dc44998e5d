import { z } from "zod";

/** Which embryo, or which of its profiles, to exclude or include again. */
const Target = z.object({
  /** The embryo's label, e.g. "wt-03". */
  embryo: z.string().trim().min(1),
  /** Only this channel's profile(s) of the embryo; the whole embryo when absent. */
  channel: z.string().min(1).optional(),
  /** With channel: only the profile at this time point (s) of a time course. */
  timeS: z.number().optional(),
});

/** Exclude an embryo (or one of its profiles) from group analyses, with the reason. */
export const ExcludeRequest = Target.extend({
  /** Why, in the lab's words (e.g. "out of focus"); kept in the history and listed by every analysis that leaves it out. */
  reason: z.string().trim().min(1, "give a reason, e.g. \"out of focus\"").max(500),
});
export type ExcludeRequest = z.output<typeof ExcludeRequest>;

/** Include an excluded embryo (or profile) again; the reason is optional. */
export const IncludeRequest = Target.extend({
  reason: z.string().trim().max(500).default(""),
});
export type IncludeRequest = z.output<typeof IncludeRequest>;
