/**
 * What each figure builder reads from the API's JSON. Structural and
 * read-only, listing only the fields the builders use, so that both the
 * server's typed results and the browser's parsed JSON fit.
 */

/** A value with its standard error and 95% confidence interval. */
export interface EstimateInput {
  value: number;
  se?: number | null;
  ci95?: readonly [number, number] | null;
}

/** One stored fit as GET /api/fits/:id answers it. */
export interface FitFigureInput {
  id: number;
  model: string;
  status: string;
  result: {
    fit: {
      ok: boolean;
      model: string;
      status: string;
      message: string;
      /** Positions used by the fit (µm), their fitted intensities and residuals (a.u.); absent when the fit failed. */
      xUm?: readonly number[];
      fitted?: readonly number[];
      residuals?: readonly number[];
      parameters?: Readonly<Record<string, EstimateInput>>;
      r2?: number | null;
    };
  };
  profile: {
    embryo: string;
    genotype: string;
    channel: string;
    positionsUm: ArrayLike<number>;
    intensities: ArrayLike<number>;
  } | null;
}

/** One group's precision summary (an element of the precision job's `results`, or its `per_channel`). */
export interface PrecisionFigureInput {
  analysis_id: number;
  group: string;
  channel: string;
  n_embryos: number;
  coords: string;
  /** "um" for absolute coordinates, else the positions are fractions of the embryo length. */
  unit: string;
  x: readonly number[];
  mean_intensity: readonly number[];
  sd_intensity: readonly number[];
  /** σ_x per grid position; null where masked (flat gradient or no spread). */
  sigma_x: readonly (number | null)[];
  sigma_x_ci95: readonly (readonly [number, number] | null)[];
  /** Headline σ_x over the stated region (geometric mean); null for analyses stored before it existed. */
  sigma_x_summary?: { value: number } | null;
  /** The stated region of the information and the headline σ_x. */
  information_region?: { from: number; to: number } | null;
  boundary: {
    threshold: number;
    positions: Readonly<Record<string, number | null>>;
    never_cross: readonly string[];
    mean_position: number | null;
    sd: number | null;
  } | null;
  normalisation: string;
  decoding: {
    positions: readonly number[];
    /** probability[t][d]: share of embryos at true position t decoded at position d. */
    probability: readonly (readonly number[])[];
    decodedMean: readonly (number | null)[];
    rmsError: number | null;
    leaveOneOut: boolean;
  } | null;
  joint?: {
    channels: readonly string[];
    x: readonly number[];
    sigma_x: readonly (number | null)[];
  } | null;
}

/** Summary of one metric across a group's embryos. */
export interface MetricSummaryInput {
  n: number;
  mean: number;
  sd: number | null;
  ci95: readonly [number, number] | null;
}

/** The comparison job's result. */
export interface ComparisonFigureInput {
  channel: string;
  by: string;
  metric: string;
  groups: readonly {
    name: string;
    n: number;
    lambda_um: MetricSummaryInput | null;
    amplitude_au: MetricSummaryInput | null;
    boundary_um: MetricSummaryInput | null;
    boundary_sd_um: EstimateInput | null;
    sigma_x_min_um: EstimateInput | null;
  }[];
  /** Per-embryo values of the compared metric, per group (absent in comparisons stored before they were kept). */
  embryo_values?: {
    /** lambda_um, amplitude_au or boundary_um; null for spread comparisons, which have no per-embryo values. */
    quantity: string | null;
    groups: readonly { name: string; values: readonly { embryo: string; value: number }[] }[];
  } | null;
}

export interface TimeSeriesInput {
  group: string;
  numeric: boolean;
  points: readonly { embryo: string; time: number | null; stage: string | null; value: number }[];
  bins: readonly { label: string; meanTime: number | null; summary: MetricSummaryInput | null }[];
  trend:
    | { kind: "linear"; slope: EstimateInput; intercept: EstimateInput }
    | { kind: "saturating"; converged: boolean; yInf: EstimateInput | null; y0: EstimateInput | null; tau: EstimateInput | null; timeOrigin: number }
    | null;
}

export interface TimeTrackInput {
  settings: { metric: string; time: string };
  series: readonly TimeSeriesInput[];
}

export interface DosageTrackInput {
  dosages: readonly { dosage: number; n: number; boundary_um: MetricSummaryInput | null }[];
  lambda_from_shift_um: EstimateInput | null;
  boundary_at_unit_dosage_um: EstimateInput | null;
  lambda_from_fit_um: EstimateInput | null;
}

export interface ScalingFitInput {
  slope: EstimateInput;
  intercept: EstimateInput;
}

export interface LengthTrackInput {
  groups: readonly { group: string; n: number; lambda: ScalingFitInput | null; boundary: ScalingFitInput | null }[];
}

/** One embryo of a dosage series or a size-scaling analysis. */
export interface TrackPointInput {
  embryo: string;
  group: string;
  dosage?: number | null;
  length_um?: number | null;
  lambda_um?: number | null;
  boundary_um?: number | null;
}

/** The tracking job's result; `result` is read according to `over`. */
export interface TrackingFigureInput {
  over: string;
  channel: string;
  result: TimeTrackInput | DosageTrackInput | LengthTrackInput;
  /** Per-embryo values for dosage and length tracking (time tracking keeps them in its series). */
  points?: readonly TrackPointInput[] | null;
}

/** The sample-size plan job's result. */
export interface PlanFigureInput {
  metric: string;
  group: string | null;
  quantity: string;
  settings: { power: number; alpha: number; effect: number };
  n_required: number;
  table: readonly {
    n: number;
    power_analytic: number;
    power_simulated: number;
    power_permutation_simulated: number | null;
  }[];
}
