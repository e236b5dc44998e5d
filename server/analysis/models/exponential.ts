import type { SteadyStateModel } from "./steadyStateModel.ts";
import { diffusionOverDegradation } from "./diffusionOverDegradation.ts";
import { decayingExponential } from "./decayingExponential.ts";
import { decayLengthFromIntegrals } from "./decayLengthFromIntegrals.ts";
import { fallDistance } from "./fallDistance.ts";
import { lengthScaleBounds } from "./lengthScaleBounds.ts";

/**
 * Exponential gradient A·e^(−x/λ) + B: the steady state of
 * ∂c/∂t = D c'' − k c on a semi-infinite domain with influx j0 at x = 0,
 * c = (j0λ/D) e^(−x/λ), λ = √(D/k). Source: textbook SDD steady state
 * (METHODS.md §1, first row), e.g. Crank, The Mathematics of Diffusion.
 */
export const exponentialModel: SteadyStateModel = {
  name: "exponential",
  formula: "A·exp(−x/λ) + B",
  source: "SDD steady state on a semi-infinite domain with influx at x = 0 (METHODS.md §1)",
  requiresLength: false,
  parameters: [{ name: "lambdaUm", unit: "µm", description: "decay length λ = √(D/k)" }],
  amplitudeDescription: "A = j0·λ/D, the intensity above background at the source (x = 0)",

  basis(x, theta, _lengthUm, value, derivatives) {
    // ∂/∂λ e^(−x/λ) = (x/λ²) e^(−x/λ), filled in the same pass.
    decayingExponential(x, theta[0], value, derivatives === null ? null : derivatives[0]);
  },

  bounds(extent) {
    const [lower, upper] = lengthScaleBounds(extent);
    return { lower: [lower], upper: [upper] };
  },

  initialGuess(x, y, extent) {
    const fromIntegrals = decayLengthFromIntegrals(x, y, 1);
    if (fromIntegrals !== null) return [fromIntegrals];
    // Otherwise: the profile falls to 1/e of its height over about one decay length.
    const fall = fallDistance(x, y, Math.exp(-1));
    return [fall ? fall.distanceUm : (extent.xMaxUm - extent.xMinUm) / 3];
  },

  checkDomain() {
    return null;
  },

  derived: [diffusionOverDegradation],
};
