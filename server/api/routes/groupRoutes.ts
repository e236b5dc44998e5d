import type { CompareResult } from "../../analysis/compare/compareGroups.ts";
import type { SamplePlan } from "../../analysis/compare/planning/planSampleSize.ts";
import { CompareRequest } from "../../services/groups/compareRequest.ts";
import { prepareComparison, storeComparison } from "../../services/groups/compareService.ts";
import { PlanRequest, TrackRequest } from "../../services/groups/trackRequest.ts";
import { preparePlan, prepareTracking, storePlan, storeTracking } from "../../services/groups/trackService.ts";
import type { TrackTaskOutput } from "../../services/groups/trackTask.ts";
import { defineRoute } from "../route.ts";

export const groupRoutes = [
  defineRoute({
    method: "post",
    path: "/api/comparisons",
    tag: "compare",
    summary: "Start comparing groups: summaries with bootstrap CIs, Welch and permutation tests, Hedges' g, Holm-adjusted p (a background job)",
    body: CompareRequest,
    status: 202,
    handler({ db, jobs, body }) {
      const prepared = prepareComparison(db, body);
      return jobs.submit("compare", prepared.task, (output) => storeComparison(db, prepared, output as CompareResult));
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/tracking",
    tag: "compare",
    summary: "Start tracking a metric over stage or age, a dosage series (λ from the boundary shift) or size scaling (a background job)",
    body: TrackRequest,
    status: 202,
    handler({ db, jobs, body }) {
      const prepared = prepareTracking(db, body);
      return jobs.submit("track", prepared.task, (output) => storeTracking(db, prepared, output as TrackTaskOutput));
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/plans",
    tag: "compare",
    summary: "Start a sample-size plan: embryos per group to detect a relative change, with simulated power (a background job)",
    body: PlanRequest,
    status: 202,
    handler({ db, jobs, body }) {
      const prepared = preparePlan(db, body);
      return jobs.submit("plan", prepared.options, (output) => storePlan(db, prepared, output as SamplePlan));
    },
  }),
];
