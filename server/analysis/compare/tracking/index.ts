export { fitLinearTrend, type LinearTrend } from "./linearTrend.ts";
export { fitSaturatingTrend, type SaturatingTrend } from "./saturatingTrend.ts";
export { assessSteadyState, type SteadyStateAssessment, type SteadyStateOptions } from "./steadyState.ts";
export { TrackOptions, type TrackOptionsInput, type ResolvedTrackOptions } from "./trackOptions.ts";
export { trackOverTime, type TimePoint, type TimeBin, type TimeSeries, type TrackResult } from "./trackOverTime.ts";
export { DosageOptions, type DosageOptionsInput, type ResolvedDosageOptions } from "./dosageOptions.ts";
export { dosageSeries, type DosageLevel, type DosageResult } from "./dosageSeries.ts";
export { ScalingOptions, type ScalingOptionsInput, type ResolvedScalingOptions } from "./scalingOptions.ts";
export { sizeScaling, type ScalingFit, type ScalingGroup, type ScalingResult } from "./sizeScaling.ts";
