import type { StoredAnalysis } from "../../../db/analyses.ts";
import type { TrackPoint } from "./trackPoints.ts";
import type { TrackTaskOutput } from "./trackTask.ts";
import { inputsOf, type AnalysisInputs } from "./analysisInputs.ts";

/** What a stored tracking analysis keeps: the task's output, its per-embryo points and how many profiles were fitted for it. */
export type StoredTracking = TrackTaskOutput & { points?: TrackPoint[] | null; inputs?: AnalysisInputs; fitted_now?: number };

/**
 * The tracking job's answer, rebuilt from what was stored: the job, the
 * figure and the export endpoints all answer with this one function.
 */
export function trackingResponse(analysis: Pick<StoredAnalysis, "id" | "selection" | "settings" | "result">) {
  const selection = analysis.selection as { channel: string };
  const settings = analysis.settings as { over: "stage" | "age" | "dosage" | "length"; fitModel?: string; threshold: { value: number; source: string } };
  const stored = analysis.result as StoredTracking;
  const used = inputsOf(stored);
  return {
    analysis_id: analysis.id,
    over: settings.over,
    channel: selection.channel,
    fit_model: used.fit_setting?.model ?? settings.fitModel ?? null,
    boundary_threshold: settings.threshold,
    ...used,
    fitted_now: used.fitted_now ?? stored.fitted_now ?? null,
    result: stored.result,
    points: stored.points ?? null,
  };
}

export type TrackingResponse = ReturnType<typeof trackingResponse>;
