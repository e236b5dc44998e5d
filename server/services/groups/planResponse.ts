import type { StoredAnalysis } from "../../../db/analyses.ts";
import type { SamplePlan } from "../../analysis/compare/planning/planSampleSize.ts";
import type { PlanningGroupChoice } from "../../analysis/compare/planning/mostVariableGroup.ts";

/**
 * The sample-size plan job's answer, rebuilt from what was stored: the job,
 * the figure and the export endpoints all answer with this one function.
 */
export function planResponse(analysis: Pick<StoredAnalysis, "id" | "selection" | "settings" | "result">) {
  const selection = analysis.selection as { group: string | null };
  const settings = analysis.settings as { metric: "lambda" | "sigma_x" };
  return { analysis_id: analysis.id, metric: settings.metric, group: selection.group, variability_group: null, ...(analysis.result as SamplePlan & { variability_group?: PlanningGroupChoice }) };
}

export type PlanResponse = ReturnType<typeof planResponse>;
