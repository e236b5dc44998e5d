import { z } from "zod";
import type { ProfileFilter } from "../../db/profiles.ts";

/** Which stored profiles an analysis uses; every field optional, combined with AND. */
export const Selection = z.object({
  genotype: z.string().min(1).optional(),
  /** Any of several genotypes (e.g. the lines of a dosage series). */
  genotypes: z.array(z.string().min(1)).min(1).max(1000).optional(),
  channel: z.string().min(1).optional(),
  embryo: z.string().min(1).optional(),
  profileIds: z.array(z.number().int().positive()).max(100_000).optional(),
  /** Any stored metadata: stage, session, or a side-file column. */
  metadata: z.record(z.string(), z.string()).optional(),
});
export type Selection = z.output<typeof Selection>;

export function selectionFilter(s: Selection): ProfileFilter {
  return { genotype: s.genotype, genotypes: s.genotypes, channel: s.channel, embryo: s.embryo, profileIds: s.profileIds, metadata: s.metadata };
}

/** Human description of a selection for messages: genotype "wt", channel "glm". */
export function describeSelection(s: Selection): string {
  const parts = [
    s.genotype && `genotype "${s.genotype}"`,
    s.genotypes && `genotypes ${s.genotypes.map((g) => `"${g}"`).join(", ")}`,
    s.channel && `channel "${s.channel}"`,
    s.embryo && `embryo "${s.embryo}"`,
    s.profileIds && `${s.profileIds.length} chosen profiles`,
    ...Object.entries(s.metadata ?? {}).map(([k, v]) => `${k} "${v}"`),
  ].filter(Boolean);
  return parts.length ? parts.join(", ") : "all stored profiles";
}
