import type { FitSettingSummary } from "../fits/fitSettings.ts";
import type { LeftOut } from "../exclusions/exclusionService.ts";
import type { EmbryoRecords } from "./embryoRecords.ts";
import type { ModelPreference } from "./modelPreference.ts";

/** What every stored group analysis says about its inputs: the fit setting, the fits, who was left out and why. */
export interface AnalysisInputs {
  fit_setting: FitSettingSummary;
  /** How the setting was chosen, in words. */
  fit_setting_chosen: string;
  /** The fit of each profile used, in the order of profile_ids: re-running with these fit ids reproduces the analysis. */
  fit_ids: number[];
  profile_ids: number[];
  /** Profiles fitted now with the setting because they had no fit under it. */
  fitted_now: number;
  left_out: LeftOut[];
  model_preference: ModelPreference | null;
}

export function analysisInputs(g: Omit<EmbryoRecords, "records">): AnalysisInputs {
  return {
    fit_setting: g.fitSetting,
    fit_setting_chosen: g.fitSettingChosen,
    fit_ids: g.fitIds,
    profile_ids: g.profileIds,
    fitted_now: g.fittedNow,
    left_out: g.leftOut,
    model_preference: g.modelPreference,
  };
}

/** The stored settings' part that names the inputs, so runs on other fits are stored apart. */
export function inputSettings(g: Omit<EmbryoRecords, "records">) {
  return { fitSetting: { name: g.fitSetting.name, hash: g.fitSetting.hash }, fitIds: g.fitIds };
}

/** The inputs block of a stored result, or nulls for analyses stored before inputs were recorded. */
export function inputsOf(stored: { inputs?: AnalysisInputs }): AnalysisInputs | { [K in keyof AnalysisInputs]: null } {
  return stored.inputs ?? { fit_setting: null, fit_setting_chosen: null, fit_ids: null, profile_ids: null, fitted_now: null, left_out: null, model_preference: null };
}
