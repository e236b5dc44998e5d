import type { StoredAnalysis } from "../../../db/analyses.ts";
import type { CompareResult } from "../../analysis/compare/compareGroups.ts";
import type { ComparisonEmbryoValues } from "./comparisonEmbryoValues.ts";
import { inputsOf, type AnalysisInputs } from "./analysisInputs.ts";

/** What a stored comparison keeps as its result: the comparison, the per-embryo values and its inputs (fit setting, fit ids, who was left out). */
export interface StoredComparison extends CompareResult {
  embryo_values?: ComparisonEmbryoValues;
  inputs?: AnalysisInputs;
  /** Stored by earlier versions instead of inputs. */
  fitted_now?: number;
}

/**
 * The comparison job's answer, rebuilt from what was stored: the job, the
 * figure and the export endpoints all answer with this one function.
 */
export function comparisonResponse(analysis: Pick<StoredAnalysis, "id" | "selection" | "settings" | "result">) {
  const selection = analysis.selection as { channel: string };
  const settings = analysis.settings as { by: string; metric: CompareResult["settings"]["metric"]; fitModel?: string; threshold: { value: number; source: string } };
  const { embryo_values, fitted_now, inputs, ...result } = analysis.result as StoredComparison;
  const used = inputsOf({ inputs });
  return {
    analysis_id: analysis.id,
    channel: selection.channel,
    by: settings.by,
    metric: settings.metric,
    fit_model: used.fit_setting?.model ?? settings.fitModel ?? null,
    boundary_threshold: settings.threshold,
    ...used,
    fitted_now: used.fitted_now ?? fitted_now ?? null,
    ...result,
    embryo_values: embryo_values ?? null,
  };
}

export type ComparisonResponse = ReturnType<typeof comparisonResponse>;
