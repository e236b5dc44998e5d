import type { Estimate, Parameter } from "./estimate.ts";

/** One entry of GET /api/fits: the newest fit per profile and model. */
export interface FitItem {
  fitId: number;
  profileId: number;
  embryo: string;
  genotype: string;
  channel: string;
  timeS: number | null;
  model: string;
  status: string;
  message: string;
  lambdaUm: Estimate | null;
  aicc: number | null;
  window: { xMinUm?: number; xMaxUm?: number } | null;
  /** Name of the fit setting the fit belongs to. */
  setting: string | null;
  createdAt: string;
  /** Weight among the models stored for this profile over the same window; null when it is the only one. */
  akaikeWeight: number | null;
}

export interface FitList {
  fits: FitItem[];
  caveat: string;
}

/** GET /api/fits/:id: one stored fit in full with the profile it was fitted to. */
export interface FitDetail {
  id: number;
  profileId: number;
  model: string;
  status: string;
  lambdaUm: number | null;
  lambdaSeUm: number | null;
  aicc: number | null;
  createdAt: string;
  options: Record<string, unknown>;
  result: {
    fit: {
      ok: boolean;
      model: string;
      status: string;
      message: string;
      warnings: (string | { message: string })[];
      n: number;
      parameters: Record<string, Parameter>;
      derived: Record<string, Parameter>;
      r2: number | null;
      aicc: number | null;
      residualSd: number | null;
      xUm: number[];
      fitted: number[];
      residuals: number[];
      /** The positions fitted and how they were chosen (absent in fits stored before windows were reported). */
      window?: { fromUm: number; toUm: number; startRule: string; endRule: string; description: string } | null;
    };
  };
  /** How the fit's standard errors and intervals were computed, in words. */
  errorModel: { covariance: string; weights: string; description: string };
  profile: { embryo: string; genotype: string; channel: string; lengthUm: number | null; positionsUm: number[]; intensities: number[] } | null;
  caveat: string;
}

/** A per-profile fit in the fit job's result (snake_case as the job returns it). */
export interface JobFit {
  fit_id: number;
  profile_id: number;
  embryo: string;
  model: string;
  status: string;
  akaike_weight: number | null;
}

/** A global fit of one genotype × channel group in the fit job's result. */
export interface JobGlobalFit {
  analysis_id: number;
  genotype: string;
  channel: string;
  model: string;
  status: string;
  message: string;
  n_embryos: number;
  lambda_um: Estimate | null;
  per_embryo: { parameter: string; fitted: number; failed: number; mean_um: number; sd_um: number; median_um: number; sem_um: number; mean_over_global: number } | null;
  note: string | null;
  akaike_weight: number | null;
  window?: { from_um: number; to_um: number; how_chosen: string } | null;
  model_preference?: { model: string | null; message: string; agrees: boolean } | null;
}

/** Which model AICc prefers for a group, per fitted model (fit job result `groups`). */
export interface JobGroupFit {
  genotype: string;
  channel: string;
  model: string;
  model_preference: { model: string | null; summed_weight: number; profiles_preferring: number; profiles_compared: number; agrees: boolean; message: string };
  warning: string | null;
}

/** The result of a fit job (POST /api/fits). */
export interface FitJobResult {
  fits: JobFit[];
  global: JobGlobalFit[];
  /** The named fit setting of each model's fits. */
  settings?: { name: string; model: string; description: string; renamed: boolean }[];
  groups: JobGroupFit[];
  group_model_comparison: { genotype: string; channel: string; best: string; message: string }[];
  caveat: string;
}
