import type { ResolvedFitOptions } from "./fitOptions.ts";

/** The error model of a fit as reported: how intervals were computed, how points were weighted, in words. */
export interface ErrorModelDescription {
  covariance: "hc3" | "classic";
  weights: ResolvedFitOptions["weights"];
  description: string;
}

const covarianceText = {
  hc3: "HC3 sandwich covariance (valid when the noise differs between points)",
  classic: "classic s²(JᵀJ)⁻¹ covariance (assumes the noise, after weighting, is the same at every point)",
} as const;

const weightText = {
  intensity: "weights 1/(a + b·μ²) with a, b estimated from the residuals (noise growing with intensity μ)",
  none: "unweighted least squares",
  "inverse-variance": "weights 1/σ² from the supplied variances",
  poisson: "weights 1/μ (photon-counting noise)",
} as const;

export function describeErrorModel(options: ResolvedFitOptions): ErrorModelDescription {
  return {
    covariance: options.errorModel,
    weights: options.weights,
    description: `${covarianceText[options.errorModel]}; ${weightText[options.weights]}`,
  };
}
