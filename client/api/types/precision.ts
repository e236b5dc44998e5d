import type { LeftOut } from "./inputs.ts";
import type { Estimate } from "./estimate.ts";

/** One group's positional-precision summary: `results[i]` of the precision job. */
export interface PrecisionSummary {
  analysis_id: number;
  group: string;
  channel: string;
  n_embryos: number;
  coords: "absolute" | "relative";
  unit: string;
  x: number[];
  mean_intensity: number[];
  sd_intensity: number[];
  /** null where σ_x is masked (flat gradient, no spread, or too large). */
  sigma_x: (number | null)[];
  sigma_x_ci95: ([number, number] | null)[];
  sigma_x_expected_relative_error: number | null;
  masked_positions: number;
  /** The stated region of positional information and the headline σ_x (null for analyses stored before regions were stated). */
  information_region: InformationRegion | null;
  /** Headline σ_x: geometric mean over the region, interval centred on the value. */
  sigma_x_summary:
    | (Estimate & { method: string; description: string; fraction_of_length: Estimate | null; positions_without_information: number; region_positions: number })
    | null;
  sigma_x_at: { position: number; value: number | null; ci95: [number, number] | null }[];
  boundary: {
    threshold: number;
    threshold_source: string;
    positions: Record<string, number>;
    never_cross: string[];
    mean_position: number | null;
    sd: number | null;
    sd_ci95: [number, number] | null;
    sd_bootstrap_ci95: [number, number] | null;
    sigma_x_at_threshold: Estimate | null;
    sd_over_sigma_x: number | null;
  } | null;
  positional_information_bits: {
    small_noise: Estimate | null;
    /** The headline direct estimate; null below 12 embryos. */
    direct_extrapolated: Estimate | null;
    /** Raw direct estimate from all embryos: biased upward, not a headline. */
    direct_raw: (Estimate & { bias: number | null; note: string }) | null;
    kernel_density: Estimate | null;
    note: string;
  } | null;
  normalisation: string;
  derivative: string;
  warnings: { code: string; message: string; fix?: string; count?: number }[];
  flipped: { flagged: string[]; flipped: string[] } | null;
  outliers: { flagged: { embryo: string; metric: string; value: number; z: number }[] } | null;
  /** Embryos and profiles left out by an exclusion, with the reasons. */
  left_out?: LeftOut[];
  settings: { grid: { spacing: number; range: [number, number]; points: number }; bootstrap: { resamples: number; seed: number } };
  decoding: { positions: number[]; probability: number[][]; decodedMean: (number | null)[]; decodedSd: (number | null)[]; rmsError: number | null; leaveOneOut: boolean; channels: number; embryos: number } | null;
  /** The other channels' summaries when several were analysed together. */
  per_channel?: PrecisionSummary[];
  joint: {
    channels: string[];
    n_embryos: number;
    x: number[];
    sigma_x: (number | null)[];
    information_region: InformationRegion | null;
    sigma_x_summary: (Estimate & { method: string }) | null;
    positional_information_bits: { small_noise: Estimate | null; direct_raw: Estimate | null };
    note: string;
  } | null;
}

export interface InformationRegion {
  from: number;
  to: number;
  unit: string;
  source: string;
  description: string;
}

export interface PrecisionJobResult {
  results: PrecisionSummary[];
}
