import { z } from "zod";
import { getAnalysis, listAnalyses } from "../../../db/analyses.ts";
import { UserError } from "../../userError.ts";
import { demoFrapFiles } from "../../services/demoData.ts";
import { CombineRequest, FrapRequest, SimulateRequest, TimeCourseRequest } from "../../services/dynamics/dynamicsRequests.ts";
import { combineFrapWithFit } from "../../services/dynamics/combineService.ts";
import { prepareFrap, storeFrap, type FrapTaskOutput } from "../../services/dynamics/frapService.ts";
import { simulateBuildUp } from "../../services/dynamics/simulateService.ts";
import { prepareTimeCourse, storeTimeCourse, type TimeCourseGroupOutput } from "../../services/dynamics/timeCourseService.ts";
import { FrapFitOptions } from "../../analysis/dynamics/frap/frapFitOptions.ts";
import { defineRoute, IdParams } from "../route.ts";
import { submitJob } from "../submitJob.ts";

const DYNAMICS_KINDS = ["dynamics", "frap", "combine", "simulation"] as const;

export const dynamicsRoutes = [
  defineRoute({
    method: "post",
    path: "/api/dynamics/time-course",
    tag: "dynamics",
    summary: "Start a build-up fit of stored profiles with a time point (a background job; poll /api/jobs/{id})",
    description: "Fits D, k and the source strength jointly per genotype × channel, with λ, half-life, τ(x), the D–k correlation and the profile likelihood of k. Times are seconds since production started.",
    body: TimeCourseRequest,
    status: 202,
    handler(ctx) {
      const input = prepareTimeCourse(ctx.db, ctx.body);
      return submitJob<TimeCourseGroupOutput[]>(ctx, "dynamics", input, {
        profileIds: input.groups.flatMap((g) => g.profileIds),
        store: (output) => storeTimeCourse(ctx.db, input, output),
      });
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/dynamics/frap",
    tag: "dynamics",
    summary: "Fit FRAP recovery tables sent as text (a background job)",
    description: "Each file: time (s; pre-bleach at negative times or flagged), bleached-region intensity with optional reference and background, or a normalised curve. The post-bleach intensity is fitted.",
    body: FrapRequest,
    status: 202,
    handler(ctx) {
      const input = prepareFrap(ctx.body);
      return submitJob<FrapTaskOutput>(ctx, "frap", input, { profileIds: [], store: (output) => storeFrap(ctx.db, input, output) });
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/dynamics/frap/demo",
    tag: "dynamics",
    summary: "Fit the invented demo FRAP curves (spot of radius 3 µm) with the given options (a background job)",
    body: z.strictObject({ options: FrapFitOptions.optional() }),
    status: 202,
    handler(ctx) {
      const input = prepareFrap(FrapRequest.parse({ files: demoFrapFiles(), options: ctx.body.options ?? { geometry: { kind: "spot", radiusUm: 3 } } }));
      return submitJob<FrapTaskOutput>(ctx, "frap", input, { profileIds: [], store: (output) => storeFrap(ctx.db, input, output) });
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/dynamics/combine",
    tag: "dynamics",
    summary: "k, half-life, j0 and τ(x) from a stored FRAP analysis and a group's stored global fit",
    body: CombineRequest,
    handler: ({ db, body }) => combineFrapWithFit(db, body),
  }),
  defineRoute({
    method: "post",
    path: "/api/dynamics/simulate",
    tag: "dynamics",
    summary: "What-if: run the build-up forward for given D, k and flux (not stored unless store is true)",
    body: SimulateRequest.extend({ store: z.boolean().default(false) }),
    handler: ({ db, body }) => {
      const { store, ...request } = body;
      return simulateBuildUp(request, store ? db : null);
    },
  }),
  defineRoute({
    method: "get",
    path: "/api/dynamics/analyses",
    tag: "dynamics",
    summary: "Stored dynamics analyses (build-up fits, FRAP, combinations, simulations), newest first, without results",
    handler: ({ db }) => ({ analyses: DYNAMICS_KINDS.flatMap((k) => listAnalyses(db, k)).sort((a, b) => b.id - a.id) }),
  }),
  defineRoute({
    method: "get",
    path: "/api/dynamics/analyses/:id",
    tag: "dynamics",
    summary: "One stored dynamics analysis with its settings and result",
    params: IdParams,
    handler: ({ db, params }) => {
      const a = getAnalysis(db, params.id);
      if (!a || !(DYNAMICS_KINDS as readonly string[]).includes(a.kind)) throw new UserError("not-found", `no dynamics analysis has id ${params.id}`, { status: 404 });
      return a;
    },
  }),
];
