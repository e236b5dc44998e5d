import { z } from "zod";
import { EXPORT_TABLES, storedTable } from "../../services/exports/storedTable.ts";
import { defineRoute } from "../route.ts";

export const exportRoutes = [
  defineRoute({
    method: "get",
    path: "/api/exports/:table.csv",
    tag: "exports",
    summary: "A results table as CSV (RFC 4180; units in the column names, e.g. lambda_um)",
    description:
      "fits: the newest fit of every profile and model with λ, SE and 95% CI (filter by genotype, channel, model). precision: σ_x with its CI and the mean ± SD profile of analysis=ID (channel= for another channel). comparison: group estimates and contrasts of analysis=ID. tracking: its per-embryo points. plan: its power table. inputs: the profiles analysis=ID used (with each fit id and the fit setting) and those an exclusion left out, with the reason.",
    params: z.object({ table: z.enum(EXPORT_TABLES) }),
    query: z.object({
      analysis: z.coerce.number().int().positive().optional().describe("Stored analysis id (every table but fits)."),
      channel: z.string().min(1).optional(),
      genotype: z.string().min(1).optional(),
      model: z.string().min(1).optional(),
    }),
    produces: "text/csv",
    handler({ db, params, query, res }) {
      const { csv, fileName } = storedTable(db, { table: params.table, ...query });
      res.status(200).set({ "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${fileName}"` }).send(csv);
      return undefined;
    },
  }),
];
