import type { StoredAnalysis } from "../../../db/analyses.ts";
import type { SamplePlan } from "../../analysis/compare/planning/planSampleSize.ts";
import { inputsOf, type AnalysisInputs } from "./analysisInputs.ts";

/** What a stored plan keeps: the plan and, when it used fitted λ, its inputs. */
export type StoredPlan = SamplePlan & { inputs?: AnalysisInputs };
import type { PlanningGroupChoice } from "../../analysis/compare/planning/mostVariableGroup.ts";

/**
 * The sample-size plan job's answer, rebuilt from what was stored: the job,
 * the figure and the export endpoints all answer with this one function.
 */
export function planResponse(analysis: Pick<StoredAnalysis, "id" | "selection" | "settings" | "result">) {
  const selection = analysis.selection as { group: string | null };
  const settings = analysis.settings as { metric: "lambda" | "sigma_x" };
  const { inputs, ...plan } = analysis.result as StoredPlan & { variability_group?: PlanningGroupChoice };
  return { analysis_id: analysis.id, metric: settings.metric, group: selection.group, variability_group: null, ...inputsOf({ inputs }), ...plan };
}

export type PlanResponse = ReturnType<typeof planResponse>;
