import type { SteadyStateModel } from "./steadyStateModel.ts";
import { fallDistance } from "./fallDistance.ts";
import { lengthScaleBounds } from "./lengthScaleBounds.ts";

/**
 * Power law with a free exponent, A·(1 + x/x0)^(−m) + B, from degradation of
 * order n: ∂c/∂t = D c'' − k cⁿ has the steady state c = A'/(x + ε)^m with
 * m = 2/(n−1) and A' = [m(m+1)D/k]^(1/(n−1)). Source: Eldar, Rosin, Shilo,
 * Barkai 2003, Dev Cell (METHODS.md §1, nonlinear degradation). m = 2 is the
 * `power` model (n = 2); large m with m/x0 fixed tends to an exponential.
 * Evaluated as exp(−m·log1p(x/x0)) for accuracy near x = 0.
 */
export const powerFreeModel: SteadyStateModel = {
  name: "power-free",
  formula: "A·(1 + x/x0)^(−m) + B",
  source: "Eldar, Rosin, Shilo, Barkai 2003, Dev Cell (degradation of order n = 1 + 2/m)",
  requiresLength: false,
  parameters: [
    { name: "x0Um", unit: "µm", description: "offset x0 = ε" },
    { name: "exponent", unit: "", description: "power-law exponent m = 2/(n−1)" },
  ],
  amplitudeDescription: "A = A'/x0^m, the intensity above background at x = 0",

  basis(x, theta, _lengthUm, value, derivatives) {
    const x0 = theta[0];
    const m = theta[1];
    const inv = 1 / x0;
    const n = x.length;
    if (derivatives === null) {
      for (let i = 0; i < n; i++) value[i] = Math.exp(-m * Math.log1p(x[i] * inv));
      return;
    }
    // ∂g/∂x0 = g·m·x/(x0(x0 + x));  ∂g/∂m = −log1p(x/x0)·g
    const dX0 = derivatives[0];
    const dM = derivatives[1];
    for (let i = 0; i < n; i++) {
      const l = Math.log1p(x[i] * inv);
      const g = Math.exp(-m * l);
      value[i] = g;
      dX0[i] = (g * m * x[i]) / (x0 * (x0 + x[i]));
      dM[i] = -l * g;
    }
  },

  bounds(extent) {
    const [lower, upper] = lengthScaleBounds(extent);
    const positiveLower = extent.xMinUm < 0 ? Math.max(lower, -extent.xMinUm * (1 + 1e-6)) : lower;
    // m from 0.05 (degradation order 41) to 40 (order 1.05, nearly linear decay).
    return { lower: [positiveLower, 0.05], upper: [Math.max(upper, 10 * positiveLower), 40] };
  },

  initialGuess(x, y, extent) {
    const fall = fallDistance(x, y, 0.25);
    return [fall ? fall.distanceUm : (extent.xMaxUm - extent.xMinUm) / 3, 2];
  },

  checkDomain() {
    return null;
  },

  derived: [
    {
      name: "degradationOrder",
      unit: "",
      description: "n = 1 + 2/m, the order of the degradation term k·cⁿ",
      evaluate(theta, _amplitude, _background, gradient) {
        const m = theta[1];
        gradient.fill(0);
        gradient[1] = -2 / (m * m);
        return 1 + 2 / m;
      },
    },
    {
      name: "diffusionOverDegradationUm2Au",
      unit: "µm²·a.u.^(2/m)",
      description: "D/k = A^(2/m)·x0²/(m(m+1)); meaningful only with calibrated intensity (Eldar et al. 2003)",
      evaluate(theta, amplitude, _background, gradient) {
        const x0 = theta[0];
        const m = theta[1];
        const v = (Math.pow(amplitude, 2 / m) * x0 * x0) / (m * (m + 1));
        gradient.fill(0);
        gradient[0] = (2 * v) / x0;
        gradient[1] = v * ((-2 / (m * m)) * Math.log(amplitude) - (2 * m + 1) / (m * (m + 1)));
        gradient[2] = ((2 / m) * v) / amplitude;
        return v;
      },
    },
  ],
};
