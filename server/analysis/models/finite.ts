import type { SteadyStateModel } from "./steadyStateModel.ts";
import { diffusionOverDegradation } from "./diffusionOverDegradation.ts";
import { decayLengthFromIntegrals } from "./decayLengthFromIntegrals.ts";
import { fallDistance } from "./fallDistance.ts";
import { lengthScaleBounds } from "./lengthScaleBounds.ts";

/**
 * Gradient on a finite embryo [0, L] with influx at x = 0 and no flux at
 * x = L: A·cosh((L−x)/λ)/cosh(L/λ) + B, so A is the intensity above
 * background at the source. Source: SDD steady state with a no-flux far
 * boundary, c = (j0λ/D)·cosh((L−x)/λ)/sinh(L/λ) (METHODS.md §1, second row),
 * renormalised to c(0) = A = (j0λ/D)·coth(L/λ).
 *
 * cosh overflows for L/λ > ~710, so the basis is evaluated in the
 * overflow-free form (METHODS.md §1, "Overflow"):
 *   g = [e^(−x/λ) + e^(−(2L−x)/λ)] / (1 + e^(−2L/λ)),
 * obtained by multiplying numerator and denominator by e^(−L/λ); every
 * exponent is ≤ 0 for 0 ≤ x ≤ L.
 */
export const finiteModel: SteadyStateModel = {
  name: "finite",
  formula: "A·cosh((L−x)/λ)/cosh(L/λ) + B",
  source: "SDD steady state on [0, L] with influx at 0 and no flux at L (METHODS.md §1)",
  requiresLength: true,
  parameters: [{ name: "lambdaUm", unit: "µm", description: "decay length λ = √(D/k)" }],
  amplitudeDescription: "A = (j0·λ/D)·coth(L/λ), the intensity above background at the source (x = 0)",

  basis(x, theta, lengthUm, value, derivatives) {
    const lambdaUm = theta[0];
    const inv = 1 / lambdaUm;
    const twoL = 2 * lengthUm;
    const c = Math.exp(-twoL * inv);
    const invDen = 1 / (1 + c);
    const n = x.length;
    if (derivatives === null) {
      for (let i = 0; i < n; i++) value[i] = (Math.exp(-x[i] * inv) + Math.exp((x[i] - twoL) * inv)) * invDen;
      return;
    }
    // With a = e^(−x/λ), b = e^(−(2L−x)/λ), c = e^(−2L/λ):
    // ∂g/∂λ = [x·a + (2L−x)·b]/(λ²(1+c)) − g·2L·c/(λ²(1+c)).
    const dLambda = derivatives[0];
    const inv2 = inv * inv;
    const denTerm = twoL * c * invDen;
    for (let i = 0; i < n; i++) {
      const xi = x[i];
      const a = Math.exp(-xi * inv);
      const b = Math.exp((xi - twoL) * inv);
      const g = (a + b) * invDen;
      value[i] = g;
      dLambda[i] = inv2 * ((xi * a + (twoL - xi) * b) * invDen - g * denTerm);
    }
  },

  bounds(extent) {
    const [lower, upper] = lengthScaleBounds(extent);
    return { lower: [lower], upper: [upper] };
  },

  initialGuess(x, y, extent) {
    const fromIntegrals = decayLengthFromIntegrals(x, y, 2);
    if (fromIntegrals !== null) return [fromIntegrals];
    // Otherwise: the profile falls to 1/e of its height over about one decay length.
    const fall = fallDistance(x, y, Math.exp(-1));
    return [fall ? fall.distanceUm : (extent.xMaxUm - extent.xMinUm) / 3];
  },

  checkDomain(extent) {
    const L = extent.lengthUm;
    if (L === null || !(L > 0) || !Number.isFinite(L))
      return "the finite-domain model needs the embryo length L (lengthUm > 0) for each profile";
    // Allow rounding in exported positions; beyond that the no-flux boundary is not where the data end.
    const slack = 1e-9 * L;
    if (extent.xMinUm < -slack) return `positions start at x = ${extent.xMinUm} µm, before the source at x = 0; set a window with xMinUm ≥ 0`;
    if (extent.xMaxUm > L + slack) return `positions reach x = ${extent.xMaxUm} µm, beyond the embryo length L = ${L} µm; check L or set a window with xMaxUm ≤ L`;
    return null;
  },

  derived: [diffusionOverDegradation],
};
