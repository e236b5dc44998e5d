import type { DerivedQuantity, SteadyStateModel } from "./steadyStateModel.ts";
import { diffusionOverDegradation } from "./diffusionOverDegradation.ts";
import { fallDistance } from "./fallDistance.ts";
import { lengthScaleBounds } from "./lengthScaleBounds.ts";

/**
 * Localized source: production at constant rate ν in 0 < x < s, no flux at
 * x = 0, degradation everywhere. Source: SDD steady states in METHODS.md §1
 * (rows three and four, [derived] there):
 *   semi-infinite, x < s: (ν/k)[1 − e^(−s/λ) cosh(x/λ)]
 *                  x > s: (ν/k) sinh(s/λ) e^(−x/λ)
 *   finite [0, L], x < s: (ν/k)[1 − sinh((L−s)/λ) cosh(x/λ)/sinh(L/λ)]
 *                  x > s: (ν/k) sinh(s/λ) cosh((L−x)/λ)/sinh(L/λ)
 * A source symmetric about x = 0 (−s < x < s) is the same in |x|.
 *
 * Amplitude: A = νs·λ/(D) = (ν/k)(s/λ), i.e. j0λ/D with j0 = νs the total
 * production, so that the basis is g = (λ/s)·h with h the bracketed shape
 * above. With this choice A has the same meaning as in the exponential model
 * and g → e^(−x/λ) as s → 0 (METHODS.md: s→0 with νs = j0 gives row one).
 *
 * Evaluated without overflow: every term is rewritten as a product of
 * exponentials with non-positive exponents, e.g. for x > s
 *   h = ½ e^((s−x)/λ) (1 − e^(−2s/λ)) (1 + e^(−2(L−x)/λ)) / (1 − e^(−2L/λ)),
 * and 1 − ½(e^((x−s)/λ) + e^(−(x+s)/λ)) through expm1 to keep precision
 * for small s/λ. On a semi-infinite domain (L = ∞) the L-terms are 0.
 */
export const sourceModel: SteadyStateModel = {
  name: "source",
  formula: "A·(λ/s)·h(x; λ, s, L) + B, h the localized-source SDD steady state",
  source: "SDD steady state with production in 0 < x < s (METHODS.md §1)",
  requiresLength: false,
  parameters: [
    { name: "lambdaUm", unit: "µm", description: "decay length λ = √(D/k)" },
    { name: "sourceWidthUm", unit: "µm", description: "width s of the producing region" },
  ],
  amplitudeDescription: "A = j0·λ/D with j0 = ν·s the total production (as in the exponential model)",

  basis(x, theta, lengthUm, value, derivatives) {
    const lambdaUm = theta[0];
    const s = theta[1];
    const a = 1 / lambdaUm;
    const a2 = a * a;
    const finiteL = Number.isFinite(lengthUm);
    const L = lengthUm;
    const pre = lambdaUm / s;
    // Terms of the finite domain; all vanish on a semi-infinite one.
    const q = finiteL ? Math.exp(-2 * L * a) : 0;
    const r = finiteL ? Math.exp(-2 * (L - s) * a) : 0;
    const den = finiteL ? -Math.expm1(-2 * L * a) : 1;
    const R = finiteL ? -Math.expm1(-2 * (L - s) * a) / den : 1;
    const oneMinusR = finiteL ? (r - q) / den : 0;
    const dRdl = finiteL ? (-r * 2 * (L - s) * a2 * den + (1 - r) * q * 2 * L * a2) / (den * den) : 0;
    const dRds = finiteL ? (-r * 2 * a) / den : 0;
    const eP = Math.exp(-2 * s * a);
    const P = -Math.expm1(-2 * s * a);
    const dlnPdl = (-eP * 2 * s * a2) / P;
    const dlnPds = (eP * 2 * a) / P;
    const dlnDendl = finiteL ? (-q * 2 * L * a2) / den : 0;
    const n = x.length;
    const dl = derivatives === null ? null : derivatives[0];
    const ds = derivatives === null ? null : derivatives[1];
    for (let i = 0; i < n; i++) {
      const xi = Math.abs(x[i]);
      if (xi < s) {
        const E1 = Math.exp((xi - s) * a);
        const E2 = Math.exp(-(xi + s) * a);
        const S = E1 + E2;
        const h = -0.5 * (Math.expm1((xi - s) * a) + Math.expm1(-(xi + s) * a)) + 0.5 * S * oneMinusR;
        value[i] = pre * h;
        if (dl !== null && ds !== null) {
          const dSdl = a2 * (E1 * (s - xi) + E2 * (xi + s));
          const dSds = -a * S;
          const dhdl = -0.5 * (dSdl * R + S * dRdl);
          const dhds = -0.5 * (dSds * R + S * dRds);
          dl[i] = h / s + pre * dhdl;
          ds[i] = pre * (dhds - h / s);
        }
      } else {
        const F1 = Math.exp((s - xi) * a);
        const eQ = finiteL ? Math.exp(-2 * (L - xi) * a) : 0;
        const Q = 1 + eQ;
        const g = (pre * 0.5 * F1 * P * Q) / den;
        value[i] = g;
        if (dl !== null && ds !== null) {
          const dlnQdl = finiteL ? (eQ * 2 * (L - xi) * a2) / Q : 0;
          dl[i] = g * (a + (xi - s) * a2 + dlnPdl + dlnQdl - dlnDendl);
          ds[i] = g * (a - 1 / s + dlnPds);
        }
      }
    }
  },

  bounds(extent) {
    const [lower, upper] = lengthScaleBounds(extent);
    const sLower = lower;
    let sUpper = Math.max(Math.abs(extent.xMinUm), Math.abs(extent.xMaxUm), 10 * sLower);
    if (extent.lengthUm !== null) sUpper = Math.min(sUpper, extent.lengthUm * (1 - 1e-9));
    return { lower: [lower, sLower], upper: [upper, sUpper] };
  },

  initialGuess(x, y, extent) {
    // Outside a wide source the profile is about half its plateau at x = s and
    // then falls as e^(−(x−s)/λ), reaching ½e^(−1) one decay length later.
    const width = extent.xMaxUm - extent.xMinUm;
    const half = fallDistance(x, y, 0.5);
    const later = fallDistance(x, y, 0.5 * Math.exp(-1));
    const sUm = half ? half.peakUm + half.distanceUm : width / 10;
    const lambdaUm = half && later && later.distanceUm > half.distanceUm ? later.distanceUm - half.distanceUm : width / 3;
    return [lambdaUm, Math.max(sUm, extent.minSpacingUm)];
  },

  checkDomain(extent) {
    const L = extent.lengthUm;
    if (L === null) return null;
    if (!(L > 0) || !Number.isFinite(L)) return `the embryo length must be a positive number of µm, got ${L}`;
    const far = Math.max(Math.abs(extent.xMinUm), Math.abs(extent.xMaxUm));
    if (far > L * (1 + 1e-9)) return `positions reach |x| = ${far} µm, beyond the embryo length L = ${L} µm; check L or set a window`;
    return null;
  },

  derived: [diffusionOverDegradation, productionOverDegradation()],
};

/** ν/k = A·λ/s: the level reached deep inside a source much wider than λ. */
function productionOverDegradation(): DerivedQuantity {
  return {
    name: "plateauAu",
    unit: "a.u.",
    description: "ν/k = A·λ/s, the intensity deep inside a source much wider than λ",
    evaluate(theta, amplitude, _background, gradient) {
      const lambdaUm = theta[0];
      const s = theta[1];
      gradient.fill(0);
      gradient[0] = amplitude / s;
      gradient[1] = (-amplitude * lambdaUm) / (s * s);
      gradient[2] = lambdaUm / s;
      return (amplitude * lambdaUm) / s;
    },
  };
}
