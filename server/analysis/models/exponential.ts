import type { SteadyStateModel } from "./steadyStateModel.ts";
import { diffusionOverDegradation } from "./diffusionOverDegradation.ts";
import { fallDistance } from "./fallDistance.ts";
import { lengthScaleBounds } from "./lengthScaleBounds.ts";

/**
 * Exponential gradient A·e^(−x/λ) + B: the steady state of
 * ∂c/∂t = D c'' − k c on a semi-infinite domain with influx j0 at x = 0,
 * c = (j0λ/D) e^(−x/λ), λ = √(D/k). Source: textbook SDD steady state
 * (science.md §1, first row), e.g. Crank, The Mathematics of Diffusion.
 */
export const exponentialModel: SteadyStateModel = {
  name: "exponential",
  formula: "A·exp(−x/λ) + B",
  source: "SDD steady state on a semi-infinite domain with influx at x = 0 (science.md §1)",
  requiresLength: false,
  parameters: [{ name: "lambdaUm", unit: "µm", description: "decay length λ = √(D/k)" }],
  amplitudeDescription: "A = j0·λ/D, the intensity above background at the source (x = 0)",

  basis(x, theta, _lengthUm, value, derivatives) {
    const lambdaUm = theta[0];
    const inv = 1 / lambdaUm;
    const n = x.length;
    if (derivatives === null) {
      for (let i = 0; i < n; i++) value[i] = Math.exp(-x[i] * inv);
      return;
    }
    // ∂/∂λ e^(−x/λ) = (x/λ²) e^(−x/λ)
    const dLambda = derivatives[0];
    const inv2 = inv * inv;
    for (let i = 0; i < n; i++) {
      const g = Math.exp(-x[i] * inv);
      value[i] = g;
      dLambda[i] = x[i] * inv2 * g;
    }
  },

  bounds(extent) {
    const [lower, upper] = lengthScaleBounds(extent);
    return { lower: [lower], upper: [upper] };
  },

  initialGuess(x, y, extent) {
    // The profile falls to 1/e of its height over one decay length.
    const fall = fallDistance(x, y, Math.exp(-1));
    return [fall ? fall.distanceUm : (extent.xMaxUm - extent.xMinUm) / 3];
  },

  checkDomain() {
    return null;
  },

  derived: [diffusionOverDegradation],
};
