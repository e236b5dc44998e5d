import type { StoredAnalysis } from "../../../db/analyses.ts";
import type { CompareResult } from "../../analysis/compare/compareGroups.ts";
import type { ComparisonEmbryoValues } from "./comparisonEmbryoValues.ts";

/** What a stored comparison keeps as its result: the comparison, the per-embryo values and how many profiles were fitted for it. */
export interface StoredComparison extends CompareResult {
  embryo_values?: ComparisonEmbryoValues;
  fitted_now?: number;
}

/**
 * The comparison job's answer, rebuilt from what was stored: the job, the
 * figure and the export endpoints all answer with this one function.
 */
export function comparisonResponse(analysis: Pick<StoredAnalysis, "id" | "selection" | "settings" | "result">) {
  const selection = analysis.selection as { channel: string };
  const settings = analysis.settings as { by: string; metric: CompareResult["settings"]["metric"]; fitModel: string; threshold: { value: number; source: string } };
  const { embryo_values, fitted_now, ...result } = analysis.result as StoredComparison;
  return {
    analysis_id: analysis.id,
    channel: selection.channel,
    by: settings.by,
    metric: settings.metric,
    fit_model: settings.fitModel,
    boundary_threshold: settings.threshold,
    fitted_now: fitted_now ?? null,
    ...result,
    embryo_values: embryo_values ?? null,
  };
}

export type ComparisonResponse = ReturnType<typeof comparisonResponse>;
