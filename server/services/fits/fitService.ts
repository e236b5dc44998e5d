import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { storeFits } from "../../../db/fits.ts";
import { loadProfiles } from "../../../db/profiles.ts";
import { steadyStateCaveat } from "../../analysis/derived.ts";
import type { ParameterEstimate } from "../../analysis/fit/parameterEstimate.ts";
import { describeErrorModel, type ErrorModelDescription } from "../../analysis/fit/describeErrorModel.ts";
import type { FitWindow } from "../../analysis/fit/fitWindow.ts";
import type { ModelPreference } from "../../analysis/fit/modelPreference.ts";
import type { ResidualCheck } from "../../analysis/fit/residualCheck.ts";
import { UserError } from "../../userError.ts";
import { ENGINE_VERSION } from "../../version.ts";
import { describeSelection, selectionFilter } from "../selection.ts";
import { resolveFitOptions, resolveModels, type FitRequest } from "./fitRequest.ts";
import { fitSettingSummary, planFitSettings, storePlannedSetting, type FitSettingSummary } from "./fitSettings.ts";
import type { FitTaskInput, FitTaskOutput } from "./fitTask.ts";

/** Read the selected profiles and resolve the options: the input of a fit task. */
export function prepareFitInput(db: Db, request: FitRequest): FitTaskInput {
  const options = resolveFitOptions(request);
  const profiles = loadProfiles(db, selectionFilter(request.selection));
  if (profiles.length === 0) {
    throw new UserError("nothing-selected", `No stored profiles match ${describeSelection(request.selection)}.`, { status: 404 });
  }
  return {
    profiles: profiles.map((p) => ({
      profileId: p.profileId,
      embryo: p.embryo,
      genotype: p.genotype,
      channel: p.channel,
      timeS: p.timeS,
      x: p.positionsUm,
      y: p.intensities,
      lengthUm: p.lengthUm,
    })),
    models: resolveModels(request.models),
    options,
    global: request.global,
    diffusion: request.diffusion ?? null,
    accumulationPositionsUm: request.accumulationPositionsUm,
    settings: planFitSettings(db, options, request.as),
    checkModels: request.checkModels,
  };
}

export interface EstimateJson {
  value: number;
  se: number | null;
  ci95: [number, number] | null;
}

/** The positions a fit used (µm) and how each end was chosen. Stable JSON names. */
export interface WindowJson {
  from_um: number;
  to_um: number;
  unit: "µm";
  /** "data" | "given-um" | "given-fraction-of-length" | "past-source-plateau" | "past-source-dip" */
  start: string;
  end: string;
  how_chosen: string;
}

/** Which model AICc prefers over a group's profiles. Stable JSON names. */
export interface ModelPreferenceJson {
  model: string | null;
  summed_weight: number;
  mean_weight: number;
  profiles_preferring: number;
  profiles_compared: number;
  fitted_model: string;
  agrees: boolean;
  message: string;
  candidates: { model: string; summed_weight: number; profiles_preferring: number }[];
}

export interface ResidualCheckJson {
  intensity_trend: { spearman: number; p: number } | null;
  runs: { runs: number; expected: number; z: number; p: number } | null;
  verdict: string[];
}

export function windowJson(w: FitWindow | null): WindowJson | null {
  return w ? { from_um: w.fromUm, to_um: w.toUm, unit: "µm", start: w.startRule, end: w.endRule, how_chosen: w.description } : null;
}

export function modelPreferenceJson(p: ModelPreference): ModelPreferenceJson {
  return {
    model: p.model,
    summed_weight: p.summedWeight,
    mean_weight: p.meanWeight,
    profiles_preferring: p.profilesPreferring,
    profiles_compared: p.profilesCompared,
    fitted_model: p.fittedModel,
    agrees: p.agrees,
    message: p.message,
    candidates: p.candidates.map((c) => ({ model: c.model, summed_weight: c.summedWeight, profiles_preferring: c.profilesPreferring })),
  };
}

function residualCheckJson(c: ResidualCheck): ResidualCheckJson {
  return { intensity_trend: c.intensityTrend, runs: c.runs, verdict: c.verdict };
}

export interface FitSummary {
  fit_id: number;
  /** Name of the fit setting the fit belongs to. */
  setting: string;
  profile_id: number;
  embryo: string;
  genotype: string;
  channel: string;
  time_s: number | null;
  model: string;
  status: string;
  message: string;
  warnings: string[];
  lambda_um: EstimateJson | null;
  amplitude: EstimateJson | null;
  background: EstimateJson | null;
  aicc: number | null;
  r2: number | null;
  n_points: number;
  parameters: Record<string, ParameterEstimate>;
  derived: Record<string, ParameterEstimate>;
  akaike_weight: number | null;
  /** The positions fitted and how they were chosen (null when the input was unusable). */
  window: WindowJson | null;
  error_model: ErrorModelDescription;
  residual_check: ResidualCheckJson | null;
}

export interface GlobalSummary {
  analysis_id: number;
  genotype: string;
  channel: string;
  model: string;
  status: string;
  message: string;
  n_embryos: number;
  lambda_um: EstimateJson | null;
  shared: Record<string, ParameterEstimate>;
  aicc: number | null;
  per_embryo: { parameter: string; fitted: number; failed: number; mean_um: number | null; sd_um: number | null; median_um: number | null; sem_um: number | null; mean_over_global: number | null };
  note: string;
  akaike_weight: number | null;
  /** From the smallest start to the largest end of the embryos' windows, and how they were chosen. */
  window: WindowJson | null;
  error_model: ErrorModelDescription;
  residual_check: ResidualCheckJson | null;
  /** Which model AICc prefers for most of this group's profiles (null when models were not checked). */
  model_preference: ModelPreferenceJson | null;
}

/** Per genotype × channel group and fitted model. */
export interface GroupFitSummary {
  genotype: string;
  channel: string;
  model: string;
  model_preference: ModelPreferenceJson;
  /** Set when AICc prefers another model than the one fitted. */
  warning: string | null;
}

export interface FitRunResult {
  fits: FitSummary[];
  global: GlobalSummary[];
  /** Per group and fitted model: which model AICc prefers over the group's profiles. */
  groups: GroupFitSummary[];
  /** Per group, the models ranked by AICc of the global fits. */
  /** Per model, the named fit setting the fits were stored under. */
  settings: (FitSettingSummary & { renamed: boolean })[];
  group_model_comparison: { genotype: string; channel: string; best: string | null; indistinguishable: boolean; message: string; ranking: { model: string; aicc: number; deltaAicc: number; weight: number }[] }[];
  caveat: string;
}

const est = (p: ParameterEstimate | undefined): EstimateJson | null => (p ? { value: p.value, se: p.se, ci95: p.ci95 } : null);

/**
 * Store the fits (replacing those with identical options) and global fits in
 * one transaction, and answer with their summaries: a failure part-way stores none of them.
 */
export function storeFitOutput(db: Db, input: FitTaskInput, output: FitTaskOutput): FitRunResult {
  return db.transaction(() => storeFitOutputNow(db, input, output))();
}

function storeFitOutputNow(db: Db, input: FitTaskInput, output: FitTaskOutput): FitRunResult {
  const meta = new Map(input.profiles.map((p) => [p.profileId, p]));
  const planned = input.settings ?? planFitSettings(db, input.options, undefined);
  const settings = Object.fromEntries(input.models.map((m) => [m, storePlannedSetting(db, planned[m], input.options[m])]));
  const ids = storeFits(
    db,
    output.fits.map((f) => ({
      profileId: f.profileId,
      model: f.model,
      options: { ...f.fit.options, diffusion: input.diffusion, accumulationPositionsUm: input.accumulationPositionsUm },
      engineVersion: ENGINE_VERSION,
      status: f.fit.status,
      lambdaUm: f.fit.ok ? (f.fit.parameters.lambdaUm?.value ?? null) : null,
      lambdaSeUm: f.fit.ok ? (f.fit.parameters.lambdaUm?.se ?? null) : null,
      aicc: f.fit.ok ? f.fit.aicc : null,
      result: { fit: f.fit, interpretation: f.interpretation, profile: { embryo: meta.get(f.profileId)!.embryo, genotype: meta.get(f.profileId)!.genotype, channel: meta.get(f.profileId)!.channel } },
      settingId: settings[f.model].id,
    })),
  );
  const weightOf = (profileId: number, model: string) =>
    output.comparisons.find((c) => c.profileId === profileId)?.comparison.ranking.find((r) => r.model === model)?.weight ?? null;
  const fits: FitSummary[] = output.fits.map((f, i) => {
    const p = meta.get(f.profileId)!;
    const kinetics = f.interpretation?.ok && f.interpretation.kinetics ? f.interpretation.kinetics : null;
    const fromLambda = f.interpretation?.ok ? f.interpretation.decayLength : null;
    const derived: Record<string, ParameterEstimate> = { ...(f.fit.ok ? f.fit.derived : {}) };
    if (fromLambda?.lambdaFractionOfLength) derived.lambdaFractionOfLength = fromLambda.lambdaFractionOfLength;
    if (kinetics) {
      derived.degradationPerS = kinetics.degradationPerS;
      derived.halfLifeS = kinetics.halfLifeS;
      if (kinetics.sourceFlux) derived.sourceFlux = kinetics.sourceFlux;
      for (const t of kinetics.accumulationTimes) derived[`accumulationTimeS_at_${t.positionUm}um`] = t.timeS;
    }
    return {
      fit_id: ids[i],
      setting: settings[f.model].name,
      profile_id: f.profileId,
      embryo: p.embryo,
      genotype: p.genotype,
      channel: p.channel,
      time_s: p.timeS,
      model: f.model,
      status: f.fit.status,
      message: f.fit.message,
      warnings: f.fit.warnings,
      lambda_um: f.fit.ok ? est(f.fit.parameters.lambdaUm) : null,
      amplitude: f.fit.ok ? est(f.fit.parameters.amplitude) : null,
      background: f.fit.ok ? est(f.fit.parameters.background) : null,
      aicc: f.fit.ok ? f.fit.aicc : null,
      r2: f.fit.ok ? f.fit.r2 : null,
      n_points: f.fit.n,
      parameters: f.fit.ok ? f.fit.parameters : {},
      derived,
      akaike_weight: weightOf(f.profileId, f.model),
      window: windowJson(f.fit.window),
      error_model: describeErrorModel(f.fit.options),
      residual_check: f.fit.ok ? residualCheckJson(f.fit.residualCheck) : null,
    };
  });
  const preferenceOf = (genotype: string, channel: string, model: string) =>
    output.preferences.find((p) => p.genotype === genotype && p.channel === channel && p.model === model)?.preference ?? null;
  const global: GlobalSummary[] = output.globals.map((g) => {
    const preference = preferenceOf(g.genotype, g.channel, g.model);
    const analysisId = storeAnalysis(db, {
      kind: "global-fit",
      selection: { genotype: g.genotype, channel: g.channel, profileIds: g.profileIds },
      settings: { model: g.model, options: input.options[g.model] },
      engineVersion: ENGINE_VERSION,
      result: { fit: g.fit, summary: g.summary, modelPreference: preference },
      profileIds: g.profileIds,
    });
    const cmp = output.groupComparisons.find((c) => c.genotype === g.genotype && c.channel === g.channel);
    return {
      analysis_id: analysisId,
      genotype: g.genotype,
      channel: g.channel,
      model: g.model,
      status: g.fit.status,
      message: g.fit.message,
      n_embryos: g.profileIds.length,
      lambda_um: g.fit.ok ? est(g.fit.shared.lambdaUm) : null,
      shared: g.fit.ok ? g.fit.shared : {},
      aicc: g.fit.ok ? g.fit.aicc : null,
      per_embryo: {
        parameter: g.summary.parameter,
        fitted: g.summary.fitted,
        failed: g.summary.failed,
        mean_um: g.summary.meanUm,
        sd_um: g.summary.sdUm,
        median_um: g.summary.medianUm,
        sem_um: g.summary.semUm,
        mean_over_global: g.summary.meanOverGlobal,
      },
      note: g.summary.note,
      akaike_weight: cmp?.comparison.ranking.find((r) => r.model === g.model)?.weight ?? null,
      window: windowJson(g.fit.window),
      error_model: describeErrorModel(g.fit.options),
      residual_check: g.fit.ok ? residualCheckJson(g.fit.residualCheck) : null,
      model_preference: preference ? modelPreferenceJson(preference) : null,
    };
  });
  const groups: GroupFitSummary[] = output.preferences.map((p) => ({
    genotype: p.genotype,
    channel: p.channel,
    model: p.model,
    model_preference: modelPreferenceJson(p.preference),
    warning: p.preference.agrees ? null : p.preference.message,
  }));
  return {
    fits,
    global,
    settings: input.models.map((m) => ({ ...fitSettingSummary(settings[m]), renamed: planned[m].rename })),
    groups,
    group_model_comparison: output.groupComparisons.map((c) => ({ genotype: c.genotype, channel: c.channel, ...c.comparison })),
    caveat: steadyStateCaveat,
  };
}
