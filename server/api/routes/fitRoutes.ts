import { z } from "zod";
import { getAnalysis, listAnalyses } from "../../../db/analyses.ts";
import { listFitItems } from "../../../db/fits.ts";
import { steadyStateCaveat } from "../../analysis/derived.ts";
import { FitRequest } from "../../services/fits/fitRequest.ts";
import { fitResponse } from "../../services/fits/fitResponse.ts";
import { prepareFitInput, storeFitOutput } from "../../services/fits/fitService.ts";
import type { FitTaskOutput } from "../../services/fits/fitTask.ts";
import { UserError } from "../../userError.ts";
import { weightStoredFits } from "../../services/fits/weightStoredFits.ts";
import { assignMissingFitSettings } from "../../services/fits/fitSettings.ts";
import { defineRoute, IdParams } from "../route.ts";
import { submitJob } from "../submitJob.ts";

export const fitRoutes = [
  defineRoute({
    method: "post",
    path: "/api/fits",
    tag: "fits",
    summary: "Start fitting the selected profiles (a background job; poll /api/jobs/{id})",
    description: `The job's result lists every fit with λ ± SE and its 95% CI, its \`window\` (from_um, to_um, how it was chosen: by default past a detected source plateau or dip; options.window takes µm or fractions of the embryo length), its \`error_model\` (by default intensity weights with the HC3 sandwich covariance; options.errorModel "classic" for s²(JᵀJ)⁻¹) and \`residual_check\`; per genotype × channel group, \`groups[].model_preference\` says which model AICc prefers; and the global fits when asked. ${steadyStateCaveat}`,
    body: FitRequest,
    status: 202,
    handler(ctx) {
      const input = prepareFitInput(ctx.db, ctx.body);
      return submitJob<FitTaskOutput>(ctx, "fit", input, { profileIds: input.profiles.map((p) => p.profileId), store: (output) => storeFitOutput(ctx.db, input, output) });
    },
  }),
  defineRoute({
    method: "get",
    path: "/api/fits",
    tag: "fits",
    summary: "Stored fits (newest per profile and model), with λ and its CI",
    query: z.object({
      genotype: z.string().optional(),
      channel: z.string().optional(),
      model: z.string().optional(),
      profileId: z.coerce.number().int().positive().optional(),
      /** Only fits of this named fit setting. */
      setting: z.string().min(1).optional(),
    }),
    handler: ({ db, query }) => {
      assignMissingFitSettings(db);
      return { fits: weightStoredFits(listFitItems(db, query)), caveat: steadyStateCaveat };
    },
  }),
  defineRoute({
    method: "get",
    path: "/api/fits/:id",
    tag: "fits",
    summary: "One stored fit in full: options, parameters with SE and CI, correlations, residuals, and the profile it was fitted to",
    params: IdParams,
    handler: ({ db, params }) => fitResponse(db, params.id),
  }),
  defineRoute({
    method: "get",
    path: "/api/analyses",
    tag: "analyses",
    summary: "Stored group analyses (global fits, precision, comparisons, tracking, plans) with their settings",
    query: z.object({ kind: z.enum(["global-fit", "precision", "comparison", "tracking", "plan"]).optional() }),
    handler: ({ db, query }) => ({ analyses: listAnalyses(db, query.kind) }),
  }),
  defineRoute({
    method: "get",
    path: "/api/analyses/:id",
    tag: "analyses",
    summary: "One stored analysis: selection, settings, engine version, input profiles and result",
    params: IdParams,
    handler({ db, params }) {
      const a = getAnalysis(db, params.id);
      if (!a) throw new UserError("unknown-analysis", `No analysis with id ${params.id}.`, { status: 404 });
      return a;
    },
  }),
];
