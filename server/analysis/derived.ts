import type { Estimate } from "./estimate.ts";
import type { ProfileFit } from "./fit/fitProfile.ts";
import type { ParameterEstimate } from "./fit/parameterEstimate.ts";
import { normalQuantile } from "./stats/normal.ts";

/**
 * What a steady-state profile can and cannot tell, attached to every derived
 * result. Source: METHODS.md §1 ("What one steady-state profile can tell
 * you"); FRAP's D versus the gradient's D: Sigaut et al. 2014, PLoS Comput Biol.
 */
export const steadyStateCaveat =
  "A single steady-state profile determines only λ = √(D/k) (and j0/D when intensity is calibrated): scaling D, k and j0 together leaves the profile unchanged. " +
  "D and k separately need a second measurement (FRAP, or the build-up over time), and a D measured by FRAP need not be the D that shapes the gradient.";

/** Diffusion coefficient measured independently (e.g. by FRAP), with its standard error. */
export interface DiffusionMeasurement {
  valueUm2PerS: number;
  /** Standard error (µm²/s); null or 0 when treated as exact. */
  seUm2PerS: number | null;
}

export interface DecayLengthQuantities {
  /** D/k = λ² (µm²). */
  diffusionOverDegradationUm2: ParameterEstimate;
  /** λ/L, the decay length as a fraction of the embryo length; null without L. */
  lambdaFractionOfLength: ParameterEstimate | null;
  caveat: string;
}

/**
 * Quantities that follow from λ alone: D/k = λ² with se 2λ·se(λ) (delta
 * method), and λ/L with se se(λ)/L (L taken as exact). Their intervals are
 * λ's interval carried through the (monotone) transformation.
 * Source: λ = √(D/k) for SDD gradients (METHODS.md §1).
 */
export function quantitiesFromDecayLength(lambdaUm: Estimate, lengthUm: number | null = null): DecayLengthQuantities {
  const l = lambdaUm.value;
  const se = lambdaUm.se;
  const ci = lambdaUm.ci95;
  const ratio: ParameterEstimate = {
    value: l * l,
    se: se === null ? null : 2 * l * se,
    ci95: ci === null ? null : [Math.max(ci[0], 0) ** 2, ci[1] ** 2],
    unit: "µm²",
    fixed: false,
  };
  const fraction: ParameterEstimate | null =
    lengthUm !== null && lengthUm > 0 && Number.isFinite(lengthUm)
      ? {
          value: l / lengthUm,
          se: se === null ? null : se / lengthUm,
          ci95: ci === null ? null : [ci[0] / lengthUm, ci[1] / lengthUm],
          unit: "",
          fixed: false,
        }
      : null;
  return { diffusionOverDegradationUm2: ratio, lambdaFractionOfLength: fraction, caveat: steadyStateCaveat };
}

export interface KineticsInput {
  /** The SDD model the decay length (and amplitude) came from. */
  model: "exponential" | "finite" | "source";
  lambdaUm: Estimate;
  /** Fitted amplitude A (a.u.), for the source flux. */
  amplitude?: Estimate;
  /** Cov(λ, A) from the fit's covariance (µm·a.u.); 0 when absent. */
  covarianceLambdaAmplitude?: number;
  /** Embryo length L (µm), needed for the source flux of the finite model. */
  lengthUm?: number | null;
  diffusion: DiffusionMeasurement;
  /** Positions (µm) at which to report the local accumulation time (exponential model). */
  accumulationPositionsUm?: readonly number[];
}

export interface AccumulationTime {
  positionUm: number;
  timeS: ParameterEstimate;
}

export interface KineticQuantities {
  /** k = D/λ² (1/s). */
  degradationPerS: ParameterEstimate;
  /** Protein half-life ln2/k = ln2·λ²/D (s). */
  halfLifeS: ParameterEstimate;
  /** Influx j0 at the source (a.u.·µm/s); null without an amplitude. */
  sourceFlux: ParameterEstimate | null;
  /** Local accumulation time τ(x) = (1 + x/λ)/(2k) (exponential model only). */
  accumulationTimes: AccumulationTime[];
  caveat: string;
}

/**
 * Degradation rate, half-life, source flux and local accumulation time once
 * D is known from a second measurement. Uncertainties by the delta method
 * (Casella & Berger 2002, Statistical Inference, §5.5.4), with D independent
 * of the fit and the λ–A covariance of the fit where both enter; 95%
 * intervals are formed on the log scale, v·exp(±1.96·se/v), which keeps
 * these positive quantities positive.
 *
 * Formulas (METHODS.md §1–2):
 *   k = D/λ²;  t½ = ln2/k;
 *   exponential and localized source: A = j0λ/D, so j0 = A·D/λ
 *     (for the source model j0 = ν·s, the total production);
 *   finite [0, L]: A = c(0) = (j0λ/D)·coth(L/λ), so j0 = A·D·tanh(L/λ)/λ;
 *   τ(x) = (1 + x/λ)/(2k) = (λ² + xλ)/(2D) — Berezhkovskii, Sample &
 *     Shvartsman 2010, Biophys J (influx boundary, semi-infinite domain).
 */
export function kineticsWithDiffusion(input: KineticsInput): KineticQuantities {
  const l = input.lambdaUm.value;
  const varL = (input.lambdaUm.se ?? 0) ** 2;
  const d = input.diffusion.valueUm2PerS;
  const varD = (input.diffusion.seUm2PerS ?? 0) ** 2;
  // An unknown se of λ leaves derived se unknown; an absent se of D means D is taken as exact.
  const lambdaKnown = input.lambdaUm.se !== null;
  const withSe = (value: number, variance: number, unit: string, known: boolean) => logScaleEstimate(value, known ? variance : null, unit);

  // k = D/λ²: ∂k/∂D = 1/λ², ∂k/∂λ = −2D/λ³.
  const k = d / (l * l);
  const varK = varD / l ** 4 + ((2 * d) / l ** 3) ** 2 * varL;
  // t½ = ln2·λ²/D: ∂/∂λ = 2ln2·λ/D, ∂/∂D = −ln2·λ²/D².
  const halfLife = (Math.LN2 * l * l) / d;
  const varHalf = ((2 * Math.LN2 * l) / d) ** 2 * varL + ((Math.LN2 * l * l) / (d * d)) ** 2 * varD;

  let sourceFlux: ParameterEstimate | null = null;
  if (input.amplitude !== undefined) {
    const a = input.amplitude.value;
    const varA = (input.amplitude.se ?? 0) ** 2;
    const covLA = input.covarianceLambdaAmplitude ?? 0;
    let shape = 1 / l;
    let dShape = -1 / (l * l);
    if (input.model === "finite") {
      const lengthUm = input.lengthUm ?? null;
      if (lengthUm === null || !(lengthUm > 0)) throw new RangeError("kineticsWithDiffusion: the finite model needs lengthUm for the source flux");
      // f(λ) = tanh(L/λ)/λ, f'(λ) = −[tanh(u) + u·sech²(u)]/λ² with u = L/λ; sech² = 1 − tanh².
      const u = lengthUm / l;
      const th = Math.tanh(u);
      shape = th / l;
      dShape = -(th + u * (1 - th * th)) / (l * l);
    }
    const j0 = a * d * shape;
    const gA = d * shape;
    const gL = a * d * dShape;
    const gD = a * shape;
    const varJ = gA * gA * varA + gL * gL * varL + 2 * gA * gL * covLA + gD * gD * varD;
    sourceFlux = withSe(j0, varJ, "a.u.·µm/s", lambdaKnown && input.amplitude.se !== null);
  }

  const accumulationTimes: AccumulationTime[] =
    input.model === "exponential"
      ? (input.accumulationPositionsUm ?? []).map((x) => {
          const tau = (l * l + x * l) / (2 * d);
          const gL = (2 * l + x) / (2 * d);
          const gD = -tau / d;
          return { positionUm: x, timeS: withSe(tau, gL * gL * varL + gD * gD * varD, "s", lambdaKnown) };
        })
      : [];

  return {
    degradationPerS: withSe(k, varK, "1/s", lambdaKnown),
    halfLifeS: withSe(halfLife, varHalf, "s", lambdaKnown),
    sourceFlux,
    accumulationTimes,
    caveat: steadyStateCaveat,
  };
}

export type FitInterpretation =
  | { ok: true; decayLength: DecayLengthQuantities; kinetics: KineticQuantities | null; caveat: string }
  | { ok: false; reason: string; caveat: string };

/**
 * The derived quantities of a successful single-profile fit of an SDD model:
 * always those from λ, and with a measured D also k, t½, j0 and τ(x).
 */
export function interpretFit(
  fit: ProfileFit,
  diffusion: DiffusionMeasurement | null = null,
  accumulationPositionsUm: readonly number[] = [],
): FitInterpretation {
  if (fit.model !== "exponential" && fit.model !== "finite" && fit.model !== "source")
    return {
      ok: false,
      reason: `the ${fit.model} model describes nonlinear degradation; D/k, k and the half-life of the linear SDD model do not apply (see its derived quantities instead)`,
      caveat: steadyStateCaveat,
    };
  const lambda = fit.parameters.lambdaUm;
  const decayLength = quantitiesFromDecayLength(lambda, fit.lengthUm);
  if (diffusion === null) return { ok: true, decayLength, kinetics: null, caveat: steadyStateCaveat };
  const cov = fit.covariance;
  const iL = cov ? cov.names.indexOf("lambdaUm") : -1;
  const iA = cov ? cov.names.indexOf("amplitude") : -1;
  const covarianceLambdaAmplitude = cov && iL >= 0 && iA >= 0 ? cov.matrix[iL][iA] : 0;
  const kinetics = kineticsWithDiffusion({
    model: fit.model,
    lambdaUm: lambda,
    amplitude: fit.parameters.amplitude,
    covarianceLambdaAmplitude,
    lengthUm: fit.lengthUm,
    diffusion,
    accumulationPositionsUm,
  });
  return { ok: true, decayLength, kinetics, caveat: steadyStateCaveat };
}

const z975 = normalQuantile(0.975);

/** Delta-method estimate with a 95% interval on the log scale; se and interval null when unknown. */
function logScaleEstimate(value: number, variance: number | null, unit: string): ParameterEstimate {
  if (variance === null || !Number.isFinite(variance) || !(value > 0)) return { value, se: null, ci95: null, unit, fixed: false };
  const se = Math.sqrt(Math.max(variance, 0));
  const factor = Math.exp((z975 * se) / value);
  return { value, se, ci95: [value / factor, value * factor], unit, fixed: false };
}
