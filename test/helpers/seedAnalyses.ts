import type { Db } from "../../db/connection.ts";
import { CompareRequest } from "../../server/services/groups/compareRequest.ts";
import { prepareComparison, storeComparison } from "../../server/services/groups/compareService.ts";
import { runCompareTask } from "../../server/services/groups/compareTask.ts";
import { PlanRequest, TrackRequest } from "../../server/services/groups/trackRequest.ts";
import { preparePlan, prepareTracking, storePlan, storeTracking } from "../../server/services/groups/trackService.ts";
import { runPlanTask, runTrackTask } from "../../server/services/groups/trackTask.ts";
import { FitRequest } from "../../server/services/fits/fitRequest.ts";
import { prepareFitInput, storeFitOutput } from "../../server/services/fits/fitService.ts";
import { runFitTask } from "../../server/services/fits/fitTask.ts";
import { PrecisionRequest } from "../../server/services/precision/precisionRequest.ts";
import { preparePrecisionInput, storePrecisionOutput } from "../../server/services/precision/precisionService.ts";
import { runPrecisionTask } from "../../server/services/precision/precisionTask.ts";

/**
 * Run, in-process and with small resample counts, one of each stored result
 * on the demo data: wt fits (with a global fit), a wt precision analysis of
 * glm and one of glm + vellin, a genotype comparison, a dosage series and a plan.
 */
export function seedAnalyses(db: Db) {
  const fitInput = prepareFitInput(db, FitRequest.parse({ selection: { genotype: "wt", channel: "glm" }, global: true }));
  const fits = storeFitOutput(db, fitInput, runFitTask(fitInput));
  const precision = (channels: string[]) => {
    const input = preparePrecisionInput(db, PrecisionRequest.parse({ selection: { genotype: "wt" }, channels, bootstrap: 40 }));
    return storePrecisionOutput(db, input, runPrecisionTask(input)).results[0];
  };
  const precisionGlm = precision(["glm"]);
  const precisionJoint = precision(["glm", "vellin"]);
  const compared = prepareComparison(db, CompareRequest.parse({ channel: "glm", permutations: 999, bootstrap: 200 }));
  const comparison = storeComparison(db, compared, runCompareTask(compared.task));
  const tracked = prepareTracking(db, TrackRequest.parse({ over: "dosage", channel: "glm", selection: { genotypes: ["glm-0.5x", "wt", "glm-2x", "glm-4x"] }, bootstrap: 200 }));
  const tracking = storeTracking(db, tracked, runTrackTask(tracked.task));
  const planned = preparePlan(db, PlanRequest.parse({ effect: 0.15, channel: "glm", simulations: 200, permutationSimulations: 50 }));
  const plan = storePlan(db, planned, runPlanTask(planned.options));
  return { fits, precisionGlm, precisionJoint, comparison, tracking, plan };
}
