import type { EmbryoRecord } from "../../analysis/compare/embryoRecord.ts";
import { dosageSeries, type DosageResult } from "../../analysis/compare/tracking/dosageSeries.ts";
import type { DosageOptionsInput } from "../../analysis/compare/tracking/dosageOptions.ts";
import { sizeScaling, type ScalingResult } from "../../analysis/compare/tracking/sizeScaling.ts";
import { trackOverTime, type TrackResult } from "../../analysis/compare/tracking/trackOverTime.ts";
import type { TrackOptionsInput } from "../../analysis/compare/tracking/trackOptions.ts";
import { planSampleSize, type SamplePlan } from "../../analysis/compare/planning/planSampleSize.ts";
import type { PlanOptionsInput } from "../../analysis/compare/planning/planOptions.ts";
import type { ProgressCallback } from "../../jobs/jobTypes.ts";
import { UserError } from "../../userError.ts";

export type TrackTaskInput =
  | { over: "time"; records: EmbryoRecord[]; options: TrackOptionsInput }
  | { over: "dosage"; records: EmbryoRecord[]; options: DosageOptionsInput }
  | { over: "length"; records: EmbryoRecord[] };

export type TrackTaskOutput = { over: "time"; result: TrackResult } | { over: "dosage"; result: DosageResult } | { over: "length"; result: ScalingResult };

/** Trends over time, dosage series, size scaling. Pure: runs in a worker thread or in-process. */
export function runTrackTask(input: TrackTaskInput, progress: ProgressCallback = () => {}): TrackTaskOutput {
  progress(0, `tracking over ${input.over}`);
  const out = userErrors((): TrackTaskOutput => {
    if (input.over === "time") return { over: "time", result: trackOverTime(input.records, input.options) };
    if (input.over === "dosage") return { over: "dosage", result: dosageSeries(input.records, input.options) };
    return { over: "length", result: sizeScaling(input.records, { by: "group" }) };
  });
  progress(1, "done");
  return out;
}

/** Sample-size plan with simulated power. Pure. */
export function runPlanTask(options: PlanOptionsInput, progress: ProgressCallback = () => {}): SamplePlan {
  progress(0, "simulating power");
  const plan = userErrors(() => planSampleSize(options));
  progress(1, "done");
  return plan;
}

function userErrors<T>(f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof RangeError) throw new UserError("tracking-input", e.message, { status: 422 });
    throw e;
  }
}
