import type { CompareResult } from "../../analysis/compare/compareGroups.ts";
import type { SamplePlan } from "../../analysis/compare/planning/planSampleSize.ts";
import { CompareRequest } from "../../services/groups/compareRequest.ts";
import { prepareComparison, storeComparison } from "../../services/groups/compareService.ts";
import { PlanRequest, TrackRequest } from "../../services/groups/trackRequest.ts";
import { preparePlan, prepareTracking, storePlan, storeTracking } from "../../services/groups/trackService.ts";
import type { TrackTaskOutput } from "../../services/groups/trackTask.ts";
import { compareWork, planWork, trackWork } from "../../services/jobWork.ts";
import { defineRoute } from "../route.ts";
import { submitJob } from "../submitJob.ts";

export const groupRoutes = [
  defineRoute({
    method: "post",
    path: "/api/comparisons",
    tag: "compare",
    summary: "Start comparing groups: summaries with bootstrap CIs, Welch and permutation tests, Hedges' g, Holm-adjusted p (a background job)",
    body: CompareRequest,
    status: 202,
    handler(ctx) {
      const prepared = prepareComparison(ctx.db, ctx.body);
      return submitJob<CompareResult>(ctx, "compare", prepared.task, { profileIds: prepared.gathered.profileIds, work: compareWork(prepared), store: (output) => storeComparison(ctx.db, prepared, output) });
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/tracking",
    tag: "compare",
    summary: "Start tracking a metric over stage or age, a dosage series (λ from the boundary shift) or size scaling (a background job)",
    body: TrackRequest,
    status: 202,
    handler(ctx) {
      const prepared = prepareTracking(ctx.db, ctx.body);
      return submitJob<TrackTaskOutput>(ctx, "track", prepared.task, { profileIds: prepared.gathered.profileIds, work: trackWork(prepared), store: (output) => storeTracking(ctx.db, prepared, output) });
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/plans",
    tag: "compare",
    summary: "Start a sample-size plan: embryos per group to detect a relative change, with simulated power (a background job)",
    body: PlanRequest,
    status: 202,
    handler(ctx) {
      const prepared = preparePlan(ctx.db, ctx.body);
      return submitJob<SamplePlan>(ctx, "plan", prepared.options, { profileIds: prepared.gathered?.profileIds ?? [], work: planWork(prepared), store: (output) => storePlan(ctx.db, prepared, output) });
    },
  }),
];
