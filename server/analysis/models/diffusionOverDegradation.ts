import type { DerivedQuantity } from "./steadyStateModel.ts";

/**
 * D/k = λ² for every synthesis–diffusion–degradation model, where λ = √(D/k)
 * is θ[0]. A steady-state profile fixes only this ratio, not D and k
 * separately. Source: the SDD steady state c'' = c/λ² (METHODS.md §1).
 */
export const diffusionOverDegradation: DerivedQuantity = {
  name: "diffusionOverDegradationUm2",
  unit: "µm²",
  positive: true,
  description: "D/k = λ²; D and k separately need a second measurement (FRAP or build-up kinetics)",
  evaluate(theta, _amplitude, _background, gradient) {
    const lambdaUm = theta[0];
    gradient.fill(0);
    gradient[0] = 2 * lambdaUm;
    return lambdaUm * lambdaUm;
  },
};
