import type { SteadyStateModel } from "./steadyStateModel.ts";
import { fallDistance } from "./fallDistance.ts";
import { lengthScaleBounds } from "./lengthScaleBounds.ts";

/**
 * Power-law gradient A·(1 + x/x0)^(−2) + B from quadratic self-enhanced
 * degradation ∂c/∂t = D c'' − k c². Source: Eldar, Rosin, Shilo, Barkai 2003,
 * Dev Cell: steady state c = 6D/(k (x + ε)²) on a semi-infinite domain, i.e.
 * A = 6D/(k x0²) with x0 = ε (METHODS.md §1, nonlinear degradation).
 */
export const powerModel: SteadyStateModel = {
  name: "power",
  formula: "A·(1 + x/x0)^(−2) + B",
  source: "Eldar, Rosin, Shilo, Barkai 2003, Dev Cell (quadratic self-enhanced degradation)",
  requiresLength: false,
  parameters: [{ name: "x0Um", unit: "µm", description: "offset x0 = ε; the profile falls to a quarter of A at x = x0" }],
  amplitudeDescription: "A = 6D/(k·x0²), the intensity above background at x = 0",

  basis(x, theta, _lengthUm, value, derivatives) {
    const x0 = theta[0];
    const inv = 1 / x0;
    const n = x.length;
    if (derivatives === null) {
      for (let i = 0; i < n; i++) {
        const u = 1 / (1 + x[i] * inv);
        value[i] = u * u;
      }
      return;
    }
    // ∂/∂x0 (1 + x/x0)^(−2) = 2x/x0² · (1 + x/x0)^(−3)
    const dX0 = derivatives[0];
    const twoInv2 = 2 * inv * inv;
    for (let i = 0; i < n; i++) {
      const u = 1 / (1 + x[i] * inv);
      const g = u * u;
      value[i] = g;
      dX0[i] = twoInv2 * x[i] * g * u;
    }
  },

  bounds(extent) {
    const [lower, upper] = lengthScaleBounds(extent);
    // 1 + x/x0 must stay positive at the first point.
    const positiveLower = extent.xMinUm < 0 ? Math.max(lower, -extent.xMinUm * (1 + 1e-6)) : lower;
    return { lower: [positiveLower], upper: [Math.max(upper, 10 * positiveLower)] };
  },

  initialGuess(x, y, extent) {
    // (1 + d/x0)^(−2) = 1/4 at d = x0.
    const fall = fallDistance(x, y, 0.25);
    return [fall ? fall.distanceUm : (extent.xMaxUm - extent.xMinUm) / 3];
  },

  checkDomain() {
    return null;
  },

  derived: [
    {
      name: "diffusionOverDegradationUm2Au",
      unit: "µm²·a.u.",
      description: "D/k = A·x0²/6 for c² degradation; meaningful only with calibrated intensity (Eldar et al. 2003)",
      evaluate(theta, amplitude, _background, gradient) {
        const x0 = theta[0];
        gradient.fill(0);
        gradient[0] = (amplitude * x0) / 3;
        gradient[1] = (x0 * x0) / 6;
        return (amplitude * x0 * x0) / 6;
      },
    },
  ],
};
