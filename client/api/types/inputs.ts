/** An embryo or profile left out of an analysis by an exclusion. */
export interface LeftOut {
  embryo: string;
  genotype: string;
  scope: "embryo" | "profile";
  channel: string | null;
  time_s: number | null;
  reason: string;
  since: string;
}

/** A named fit setting as analyses report it. */
export interface FitSetting {
  name: string;
  hash: string;
  model: string;
  description: string;
  options: Record<string, unknown>;
}

export interface ModelPreference {
  used_model: string;
  models_compared: string[];
  groups: { group: string; n: number; weight_share: Record<string, number>; preferred: string | null; summed_aicc: Record<string, number>; n_summed: number; best_by_summed_aicc: string | null }[];
  best_overall: string | null;
  warnings: string[];
}

/** What every group analysis says about its inputs (null for analyses stored before they were recorded). */
export interface AnalysisInputs {
  fit_setting: FitSetting | null;
  fit_setting_chosen: string | null;
  fit_ids: number[] | null;
  profile_ids: number[] | null;
  fitted_now: number | null;
  left_out: LeftOut[] | null;
  model_preference: ModelPreference | null;
}

/** GET /api/fit-settings */
export interface FitSettingsOverview {
  channel: string | null;
  settings: (FitSetting & { created_at: string; coverage: { genotype: string; fitted: number; profiles: number }[] })[];
}

/** GET /api/exclusions */
export interface ExclusionOverview {
  current: LeftOut[];
  history: (LeftOut & { action: "exclude" | "include" })[];
}
