import type { Db } from "../../../db/connection.ts";
import { listFits } from "../../../db/fits.ts";
import { loadProfiles } from "../../../db/profiles.ts";
import { steadyStateCaveat } from "../../analysis/derived.ts";
import type { FitInterpretation } from "../../analysis/derived.ts";
import type { FitResult } from "../../analysis/fit/fitProfile.ts";
import { describeErrorModel } from "../../analysis/fit/describeErrorModel.ts";
import { FitOptions } from "../../analysis/fit/fitOptions.ts";
import { UserError } from "../../userError.ts";

/** What a stored fit keeps in its result column (see storeFitOutput). */
export interface StoredFitResult {
  fit: FitResult;
  interpretation: FitInterpretation | null;
  profile: { embryo: string; genotype: string; channel: string };
}

/**
 * One stored fit in full with the profile it was fitted to: the answer of
 * GET /api/fits/:id and the input of the fit figures. 404 for an unknown id.
 */
export function fitResponse(db: Db, id: number) {
  const [fit] = listFits(db, { ids: [id] });
  if (!fit) throw new UserError("unknown-fit", `No fit with id ${id}.`, { status: 404 });
  const [profile] = loadProfiles(db, { profileIds: [fit.profileId] });
  return {
    ...fit,
    result: fit.result as StoredFitResult,
    profile: profile ? { ...profile, positionsUm: Array.from(profile.positionsUm), positionsRaw: Array.from(profile.positionsRaw), intensities: Array.from(profile.intensities) } : null,
    errorModel: storedErrorModel(fit.result as StoredFitResult),
    caveat: steadyStateCaveat,
  };
}

export type FitResponse = ReturnType<typeof fitResponse>;

/** The error model of a stored fit; fits stored before error models were chosen used unweighted or their stated weights with s²(JᵀJ)⁻¹. */
function storedErrorModel(result: StoredFitResult) {
  const options = result.fit.options as Partial<ReturnType<typeof FitOptions.parse>>;
  if (options.errorModel !== undefined) return describeErrorModel(result.fit.options);
  const weights = options.weights ?? "none";
  return { ...describeErrorModel({ ...FitOptions.parse({}), weights, errorModel: "classic" }), description: `classic s²(JᵀJ)⁻¹ covariance, ${weights === "none" ? "unweighted" : `${weights} weights`} (stored before the error model was reported)` };
}
