export { FitOptions, type FitOptionsInput, type ResolvedFitOptions } from "./fitOptions.ts";
export { fitProfile, type FitResult, type FitStatus, type ProfileFit, type ProfileFitFailure } from "./fitProfile.ts";
export {
  fitGlobal,
  type GlobalFit,
  type GlobalFitFailure,
  type GlobalFitResult,
  type ReplicateEstimates,
  type ReplicateProfile,
} from "./fitGlobal.ts";
export { summarizeDecayLengths, type DecayLengthSummary } from "./summarizeDecayLengths.ts";
export { compareModels, type ExcludedModel, type ProfileModelComparison } from "./compareModels.ts";
export { compareModelsGlobal, type GroupModelComparison } from "./compareModelsGlobal.ts";
export { akaikeWeights, type AkaikeComparison, type RankedModel } from "./akaikeWeights.ts";
export { informationCriteria, sumOfLogWeights, type InformationCriteria } from "./informationCriteria.ts";
export { parameterEstimate, type ParameterEstimate } from "./parameterEstimate.ts";
export { correlationMatrix, type NamedMatrix } from "./correlationMatrix.ts";
export { deltaMethodVariance } from "./deltaMethod.ts";
export type { ProfileContext } from "./prepareProfile.ts";
export { modelPreference, type ModelPreference } from "./modelPreference.ts";
export { type FitWindow, type WindowEndRule } from "./fitWindow.ts";
export { type ResidualCheck } from "./residualCheck.ts";
export { describeErrorModel, type ErrorModelDescription } from "./describeErrorModel.ts";
