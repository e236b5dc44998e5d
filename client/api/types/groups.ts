import type { Estimate, GroupSummary } from "./estimate.ts";

/** A difference or ratio with its 95% CI, how that CI was formed, and a bootstrap CI as a second opinion. */
export interface Interval {
  value: number;
  ci95: [number, number] | null;
  interval_method?: string;
  bootstrap_ci95?: [number, number] | null;
  bootstrap_method?: string;
}

export interface ComparisonGroup {
  name: string;
  n: number;
  lambda_um: GroupSummary | null;
  amplitude_au: GroupSummary | null;
  boundary_um: GroupSummary | null;
  boundary_sd_um: Estimate | null;
  sigma_x_min_um: Estimate | null;
  lambda_global_um: Estimate | null;
}

export interface Contrast {
  a: string;
  b: string;
  metric: string;
  n_a: number;
  n_b: number;
  difference: Interval | null;
  ratio: Interval | null;
  p_welch: number | null;
  p_permutation: number | null;
  p_spread: number | null;
  p_holm: number | null;
  effect_size: Estimate | null;
  note: string | null;
}

/** The result of a comparison job (POST /api/comparisons). */
export interface ComparisonResult {
  analysis_id: number;
  channel: string;
  by: string;
  metric: "lambda" | "amplitude" | "boundary" | "sigma_x";
  fit_model: string;
  boundary_threshold: { value: number; source: string } | null;
  fitted_now: number;
  groups: ComparisonGroup[];
  contrasts: Contrast[];
  warnings: string[];
}

export interface LinearTrend {
  kind: "linear";
  slope: Estimate;
  intercept: Estimate;
  pSlope: number | null;
  r2: number | null;
  n: number;
}

export interface SaturatingTrend {
  kind: "saturating";
  converged: boolean;
  reason: string | null;
  yInf: Estimate | null;
  y0: Estimate | null;
  tau: Estimate | null;
  timeOrigin: number;
}

export interface TimeSeries {
  group: string;
  n: number;
  numeric: boolean;
  points: { embryo: string; time: number | null; stage: string | null; value: number }[];
  bins: { label: string; meanTime: number | null; summary: GroupSummary | null }[];
  trend: LinearTrend | SaturatingTrend | null;
  trendNote: string | null;
  steadyState: { notAtSteadyState: boolean | null; reasons: string[]; rule: string } | null;
}

export interface TimeTrack {
  settings: { metric: string; time: string };
  series: TimeSeries[];
}

export interface DosageTrack {
  n: number;
  /** Absent in results stored before uncrossed embryos were counted. */
  no_crossing?: { before_start: number; beyond_end: number };
  shift_method?: string | null;
  shift_refused?: string | null;
  dosages: { dosage: number; n: number; n_embryos?: number; no_crossing?: { before_start: number; beyond_end: number }; boundary_um: GroupSummary | null }[];
  lambda_from_shift_um: Estimate | null;
  boundary_at_unit_dosage_um: Estimate | null;
  lambda_from_fit_um: Estimate | null;
  difference_um: Estimate | null;
  agree: boolean | null;
  assumptions: string[];
  warnings: string[];
}

export interface ScalingFit {
  slope: Estimate;
  intercept: Estimate;
  r2: number | null;
  n: number;
  consistent_with_scaling: boolean;
  consistent_with_no_scaling: boolean;
}

export interface LengthTrack {
  groups: { group: string; n: number; lambda: ScalingFit | null; boundary: ScalingFit | null; note: string | null }[];
}

interface TrackingBase {
  analysis_id: number;
  channel: string;
  fit_model: string;
  boundary_threshold: { value: number; source: string } | null;
  fitted_now: number;
}

/** The result of a tracking job (POST /api/tracking), read according to `over`. */
export type TrackingResult = TrackingBase &
  ({ over: "stage" | "age"; result: TimeTrack } | { over: "dosage"; result: DosageTrack } | { over: "length"; result: LengthTrack });

/** The result of a plan job (POST /api/plans). */
export interface PlanResult {
  analysis_id: number;
  metric: string;
  group: string;
  quantity: string;
  cv: number;
  standardized_effect: number;
  n_required: number;
  n_normal: number;
  capped: boolean;
  settings: { effect: number; power: number; alpha: number; simulations: number };
  table: { n: number; power_analytic: number; power_normal: number; power_simulated: number; power_permutation_simulated: number | null }[];
  formula: string;
  notes: string[];
  /** Which group's variability was used and why (null for a spread plan). */
  variability_group: { group: string; n: number; cv: number; rule: "chosen" | "most_variable"; candidates: { group: string; n: number; cv: number }[]; sentence: string } | null;
}
