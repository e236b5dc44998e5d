import { fitGlobal, type GlobalFitResult } from "../../analysis/fit/fitGlobal.ts";
import { fitProfile, type FitResult, type ProfileFit } from "../../analysis/fit/fitProfile.ts";
import { modelRegistry } from "../../analysis/models/modelRegistry.ts";
import type { ResolvedFitOptions } from "../../analysis/fit/fitOptions.ts";
import { akaikeWeights, type AkaikeComparison } from "../../analysis/fit/akaikeWeights.ts";
import { summarizeDecayLengths, type DecayLengthSummary } from "../../analysis/fit/summarizeDecayLengths.ts";
import { modelPreference, type ModelPreference } from "../../analysis/fit/modelPreference.ts";
import { modelNames, type ModelName } from "../../analysis/models/steadyStateModel.ts";
import { interpretFit, type DiffusionMeasurement, type FitInterpretation } from "../../analysis/derived.ts";
import type { ProgressCallback } from "../../jobs/jobTypes.ts";

export interface FitTaskProfile {
  profileId: number;
  embryo: string;
  genotype: string;
  channel: string;
  timeS: number | null;
  x: Float64Array;
  y: Float64Array;
  lengthUm: number | null;
}

export interface FitTaskInput {
  profiles: FitTaskProfile[];
  models: ModelName[];
  options: Record<string, ResolvedFitOptions>;
  global: boolean;
  diffusion: DiffusionMeasurement | null;
  accumulationPositionsUm: number[];
  /** Per model, the fit setting its fits are stored under (planned before fitting; see fitSettings.ts). */
  settings?: Record<string, { name: string; hash: string; rename: boolean }>;
  /**
   * Also fit every other model on each profile's window, to say which model
   * AICc prefers for the group (model_preference); false when absent
   * (FitRequest.checkModels is true by default, so `fit` always checks).
   */
  checkModels?: boolean;
}

export interface ProfileFitOutput {
  profileId: number;
  model: ModelName;
  fit: FitResult;
  interpretation: FitInterpretation | null;
}

export interface GlobalFitOutput {
  genotype: string;
  channel: string;
  model: ModelName;
  profileIds: number[];
  fit: GlobalFitResult;
  /** Per-embryo λ next to the global λ. */
  summary: DecayLengthSummary;
}

export interface FitTaskOutput {
  fits: ProfileFitOutput[];
  /** Per profile, the models ranked by AICc (only when more than one model was fitted). */
  comparisons: { profileId: number; comparison: AkaikeComparison }[];
  globals: GlobalFitOutput[];
  /** Per group, the models ranked by the global fits' AICc. */
  groupComparisons: { genotype: string; channel: string; comparison: AkaikeComparison }[];
  /** Per group and fitted model: the model AICc prefers over the group's profiles, each compared on the fitted window. */
  preferences: { genotype: string; channel: string; model: ModelName; preference: ModelPreference }[];
}

/**
 * Fit every selected profile with every requested model, and optionally each
 * genotype × channel group globally. Pure: runs in a worker thread or in-process.
 */
export function runFitTask(input: FitTaskInput, progress: ProgressCallback = () => {}): FitTaskOutput {
  const fits: ProfileFitOutput[] = [];
  const comparisons: FitTaskOutput["comparisons"] = [];
  const checkModels = input.checkModels ?? false;
  // Per profile and fitted model: every candidate ranked by AICc on that fit's window.
  const checks = new Map<string, AkaikeComparison>();
  const total = input.profiles.length * input.models.length + (input.global ? input.models.length : 0);
  let done = 0;
  for (const p of input.profiles) {
    const candidates: { model: string; aicc: number }[] = [];
    for (const model of input.models) {
      const fit = fitProfile(p.x, p.y, input.options[model], { lengthUm: p.lengthUm ?? undefined });
      const interpretation = fit.ok ? interpretFit(fit, input.diffusion, input.accumulationPositionsUm) : null;
      fits.push({ profileId: p.profileId, model, fit, interpretation });
      if (fit.ok && fit.aicc !== null) candidates.push({ model, aicc: fit.aicc });
      done++;
    }
    if (input.models.length > 1 && candidates.length > 0) comparisons.push({ profileId: p.profileId, comparison: akaikeWeights(candidates) });
    if (checkModels)
      for (const model of input.models) {
        const own = fits.find((f) => f.profileId === p.profileId && f.model === model)!.fit;
        if (own.ok) checks.set(`${p.profileId}|${model}`, compareOnWindow(p, own, input.options[model]));
      }
    progress(done / Math.max(total, 1), `fitted ${done} of ${total}`);
  }
  const globals: GlobalFitOutput[] = [];
  const groupComparisons: FitTaskOutput["groupComparisons"] = [];
  const groups = byGenotypeAndChannel(input.profiles);
  if (input.global) {
    for (const [key, members] of groups) {
      const [genotype, channel] = JSON.parse(key) as [string, string];
      const replicates = members.map((m) => ({ x: m.x, y: m.y, lengthUm: m.lengthUm ?? undefined }));
      const candidates: { model: string; aicc: number }[] = [];
      for (const model of input.models) {
        const fit = fitGlobal(replicates, input.options[model]);
        if (fit.ok && fit.aicc !== null) candidates.push({ model, aicc: fit.aicc });
        const own = fits.filter((f) => f.model === model && members.some((m) => m.profileId === f.profileId)).map((f) => f.fit);
        const parameter = model === "power" || model === "power-free" ? "x0Um" : "lambdaUm";
        globals.push({ genotype, channel, model, profileIds: members.map((m) => m.profileId), fit, summary: summarizeDecayLengths(own, fit, parameter) });
        done++;
        progress(done / total, `global fit ${genotype}/${channel} (${model})`);
      }
      if (input.models.length > 1) groupComparisons.push({ genotype, channel, comparison: akaikeWeights(candidates) });
    }
  }
  const preferences: FitTaskOutput["preferences"] = [];
  if (checkModels) {
    for (const [key, members] of groups) {
      const [genotype, channel] = JSON.parse(key) as [string, string];
      for (const model of input.models) {
        const own = members.map((m) => checks.get(`${m.profileId}|${model}`)).filter((c): c is AkaikeComparison => c !== undefined);
        preferences.push({ genotype, channel, model, preference: modelPreference(own, model) });
      }
    }
  }
  return { fits, comparisons, globals, groupComparisons, preferences };
}

/**
 * Every model fitted to the points of `fit` (its window, taken as given) and
 * ranked by AICc, reusing `fit` itself. A model the profile cannot take (the
 * finite model without a length) is left out.
 */
function compareOnWindow(p: FitTaskProfile, fit: ProfileFit, options: ResolvedFitOptions): AkaikeComparison {
  const candidates: { model: string; aicc: number }[] = [];
  if (fit.aicc !== null) candidates.push({ model: fit.model, aicc: fit.aicc });
  const window = { xMinUm: fit.window!.fromUm, xMaxUm: fit.window!.toUm };
  for (const model of modelNames) {
    if (model === fit.model || (modelRegistry[model].requiresLength && p.lengthUm === null)) continue;
    const other = fitProfile(p.x, p.y, { ...options, model, window, autoWindow: false }, { lengthUm: p.lengthUm ?? undefined });
    if (other.ok && other.aicc !== null) candidates.push({ model, aicc: other.aicc });
  }
  return akaikeWeights(candidates);
}

/** Profiles grouped by genotype × channel, keyed by JSON of the pair (global fits and the model check use the same groups). */
function byGenotypeAndChannel(profiles: readonly FitTaskProfile[]): Map<string, FitTaskProfile[]> {
  const groups = new Map<string, FitTaskProfile[]>();
  for (const p of profiles) {
    const key = JSON.stringify([p.genotype, p.channel]);
    groups.set(key, [...(groups.get(key) ?? []), p]);
  }
  return groups;
}
