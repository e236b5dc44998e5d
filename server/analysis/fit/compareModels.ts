import type { ModelName } from "../models/steadyStateModel.ts";
import { akaikeWeights, type AkaikeComparison } from "./akaikeWeights.ts";
import type { ResolvedFitOptions } from "./fitOptions.ts";
import { fitProfile, type FitResult } from "./fitProfile.ts";
import type { ProfileContext } from "./prepareProfile.ts";

export interface ExcludedModel {
  model: ModelName;
  /** Why the model has no AICc: its fit status and message. */
  reason: string;
}

export interface ProfileModelComparison extends AkaikeComparison {
  /** Every candidate's fit, by model name. */
  fits: Partial<Record<ModelName, FitResult>>;
  excluded: ExcludedModel[];
}

/**
 * Fit several steady-state models to one profile with the same options
 * (window, weights, fixed values) and rank them by AICc with Akaike weights.
 * A model whose fit failed or has no AICc is listed under `excluded` with
 * the reason. Source: Burnham & Anderson 2002 (see akaikeWeights.ts).
 */
export function compareModels(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  models: readonly ModelName[],
  options: ResolvedFitOptions,
  context: ProfileContext = {},
): ProfileModelComparison {
  const fits: Partial<Record<ModelName, FitResult>> = {};
  const excluded: ExcludedModel[] = [];
  const candidates: { model: string; aicc: number }[] = [];
  for (const model of new Set(models)) {
    const fit = fitProfile(x, y, { ...options, model }, context);
    fits[model] = fit;
    if (fit.ok && fit.aicc !== null) candidates.push({ model, aicc: fit.aicc });
    else excluded.push({ model, reason: fit.ok ? `${fit.status}: AICc needs more points than parameters + 2` : `${fit.status}: ${fit.message}` });
  }
  return { ...akaikeWeights(candidates), fits, excluded };
}
