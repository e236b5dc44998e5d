import { z } from "zod";
import { countProfiles, distinctValues, listProfiles, loadProfiles, type ProfileFilter } from "../../../db/profiles.ts";
import { UserError } from "../../userError.ts";
import { defineRoute, IdParams } from "../route.ts";

/** Filters shared by profile listings; `meta.KEY=VALUE` filters on any stored metadata. */
export const ProfileQuery = z
  .object({
    genotype: z.string().optional(),
    channel: z.string().optional(),
    embryo: z.string().optional(),
    importId: z.coerce.number().int().positive().optional(),
    limit: z.coerce.number().int().min(1).max(1000).default(100),
    offset: z.coerce.number().int().min(0).default(0),
  })
  .catchall(z.string());

export function profileFilter(q: z.output<typeof ProfileQuery>): ProfileFilter {
  const metadata: Record<string, string> = {};
  for (const [k, v] of Object.entries(q)) if (k.startsWith("meta.") && typeof v === "string") metadata[k.slice(5)] = v;
  return { genotype: q.genotype, channel: q.channel, embryo: q.embryo, importId: q.importId, metadata, limit: q.limit, offset: q.offset };
}

export const profileRoutes = [
  defineRoute({
    method: "get",
    path: "/api/profiles",
    tag: "profiles",
    summary: "List stored profiles with their embryo's metadata (filter by any field, paginated)",
    query: ProfileQuery,
    handler({ db, query }) {
      const filter = profileFilter(query);
      return { total: countProfiles(db, { ...filter, limit: undefined, offset: undefined }), limit: query.limit, offset: query.offset, items: listProfiles(db, filter) };
    },
  }),
  defineRoute({
    method: "get",
    path: "/api/profiles/:id",
    tag: "profiles",
    summary: "One profile with its positions (µm and as imported) and intensities (a.u.)",
    params: IdParams,
    handler({ db, params }) {
      const [p] = loadProfiles(db, { profileIds: [params.id] });
      if (!p) throw new UserError("unknown-profile", `No profile with id ${params.id}.`, { status: 404 });
      return { ...p, positionsUm: Array.from(p.positionsUm), positionsRaw: Array.from(p.positionsRaw), intensities: Array.from(p.intensities) };
    },
  }),
  defineRoute({
    method: "get",
    path: "/api/groups",
    tag: "profiles",
    summary: "Distinct values of a grouping field (genotype, channel, stage, session or a metadata key)",
    query: z.object({ by: z.string().min(1).default("genotype") }),
    handler: ({ db, query }) => ({ by: query.by, values: distinctValues(db, query.by) }),
  }),
];
