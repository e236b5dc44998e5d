import type { ModelName } from "../models/steadyStateModel.ts";
import { akaikeWeights, type AkaikeComparison } from "./akaikeWeights.ts";
import type { ExcludedModel } from "./compareModels.ts";
import { fitGlobal, type GlobalFitResult, type ReplicateProfile } from "./fitGlobal.ts";
import type { ResolvedFitOptions } from "./fitOptions.ts";

export interface GroupModelComparison extends AkaikeComparison {
  fits: Partial<Record<ModelName, GlobalFitResult>>;
  excluded: ExcludedModel[];
}

/**
 * Compare models for a group of replicate profiles (one genotype): each
 * model is fitted globally (shared shape parameters, per-profile amplitude
 * and background) and the global fits are ranked by AICc with Akaike
 * weights. Source: Burnham & Anderson 2002 (see akaikeWeights.ts).
 */
export function compareModelsGlobal(
  profiles: readonly ReplicateProfile[],
  models: readonly ModelName[],
  options: ResolvedFitOptions,
): GroupModelComparison {
  const fits: Partial<Record<ModelName, GlobalFitResult>> = {};
  const excluded: ExcludedModel[] = [];
  const candidates: { model: string; aicc: number }[] = [];
  for (const model of new Set(models)) {
    const fit = fitGlobal(profiles, { ...options, model });
    fits[model] = fit;
    if (fit.ok && fit.aicc !== null) candidates.push({ model, aicc: fit.aicc });
    else excluded.push({ model, reason: fit.ok ? `${fit.status}: AICc needs more points than parameters + 2` : `${fit.status}: ${fit.message}` });
  }
  return { ...akaikeWeights(candidates), fits, excluded };
}
