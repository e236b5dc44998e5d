import type { Matrix } from "../linalg/matrix.ts";
import { modelRegistry } from "../models/modelRegistry.ts";
import type { ModelName, SteadyStateModel } from "../models/steadyStateModel.ts";
import { blockCovariance } from "./blockCovariance.ts";
import { correlationMatrix, type NamedMatrix } from "./correlationMatrix.ts";
import { deltaMethodVariance } from "./deltaMethod.ts";
import type { ResolvedFitOptions } from "./fitOptions.ts";
import { boundWarnings } from "./boundWarnings.ts";
import { formatNumber } from "./formatNumber.ts";
import { informationCriteria, sumOfLogWeights } from "./informationCriteria.ts";
import { parameterEstimate, type ParameterEstimate } from "./parameterEstimate.ts";
import { prepareWindowedProfile, type FitWindow } from "./fitWindow.ts";
import { releasePreparedProfile, type ProfileContext } from "./prepareProfile.ts";
import { residualCheck, type ResidualCheck } from "./residualCheck.ts";
import { sandwichCovariance } from "./sandwichCovariance.ts";
import { ProjectedProblem } from "./projectedProblem.ts";
import { resolveParameters } from "./resolveParameters.ts";
import { SeparableBlock } from "./separableBlock.ts";
import { solveSeparable } from "./solveSeparable.ts";
import { tQuantile95 } from "./tQuantile95.ts";
import { weightedTotalSumOfSquares } from "./weightedTotalSumOfSquares.ts";

export type FitStatus = "converged" | "max-iterations" | "ill-conditioned" | "no-decay" | "too-few-points" | "invalid-input";

interface FitCommon {
  model: ModelName;
  /** One sentence for the user: what happened and, on failure, what to do. */
  message: string;
  /** Things worth knowing that did not stop the fit, each saying how to act on it. */
  warnings: string[];
  /** Points used (inside the window, finite). */
  n: number;
  /** Fitted parameters (free nonlinear + linear). */
  p: number;
  /** Levenberg–Marquardt iterations. */
  iterations: number;
  lengthUm: number | null;
  /** The options the fit ran with, after defaults. */
  options: ResolvedFitOptions;
  /** The positions fitted (µm) and how they were chosen; null when the input was unusable. */
  window: FitWindow | null;
  /** How standard errors and intervals were computed (options.errorModel): "hc3" sandwich or "classic" s²(JᵀJ)⁻¹. */
  errorModel: "hc3" | "classic";
}

/** A fit that produced parameter values. */
export interface ProfileFit extends FitCommon {
  ok: true;
  /** "ill-conditioned": values found, but the parameters are not separately determined and se/ci are null. */
  status: "converged" | "max-iterations" | "ill-conditioned";
  /** Every model parameter, amplitude and background, by name (lambdaUm, amplitude, background, …). */
  parameters: Record<string, ParameterEstimate>;
  /** Quantities implied by the parameters (e.g. diffusionOverDegradationUm2 = λ²). */
  derived: Record<string, ParameterEstimate>;
  /** Covariance over the fitted parameters (the HC3 sandwich or s²(JᵀJ)⁻¹, see errorModel), or null when ill-conditioned. */
  covariance: NamedMatrix | null;
  correlation: NamedMatrix | null;
  /** Residual sum of squares (weighted when weights are used). */
  rss: number;
  r2: number | null;
  aicc: number | null;
  bic: number | null;
  logLikelihood: number | null;
  /** n − p. */
  dof: number;
  /** √(rss/dof). */
  residualSd: number;
  /** Positions used, their fitted intensities and residuals y − fitted (a.u.). */
  xUm: number[];
  fitted: number[];
  residuals: number[];
  /** Scale of the robust loss (standardised residual units), null without one. */
  robustScale: number | null;
  /** Do the residuals fit the error model? (trend of |residual| with intensity, runs of signs) */
  residualCheck: ResidualCheck;
}

/** A fit that could not produce meaningful parameter values. */
export interface ProfileFitFailure extends FitCommon {
  ok: false;
  status: "no-decay" | "too-few-points" | "invalid-input" | "ill-conditioned";
}

export type FitResult = ProfileFit | ProfileFitFailure;

/**
 * Fit one steady-state gradient profile (positions in µm, intensities in
 * a.u.) by variable projection: the amplitude and background are solved
 * linearly for every trial of the nonlinear parameters, which are found by
 * Levenberg–Marquardt with a bracketing fallback. The window is the one
 * asked for, its start moved past a detected source plateau or dip unless
 * given (fitWindow.ts). Standard errors come from the full covariance of all
 * fitted parameters — by default the HC3 sandwich, which holds when the noise
 * grows with the intensity (sandwichCovariance.ts), or s²(JᵀJ)⁻¹ — and 95%
 * intervals from t-quantiles at n − p degrees of freedom, on the log scale
 * for the positive nonlinear parameters (λ, s, x0, m). Outcomes are data: the
 * result says whether it converged, and why not.
 */
export function fitProfile(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  options: ResolvedFitOptions,
  context: ProfileContext = {},
): FitResult {
  const model = modelRegistry[options.model];
  const warnings: string[] = [];
  const lengthUm = context.lengthUm ?? null;
  const linearCount = options.background ? 2 : 1;
  let window: FitWindow | null = null;
  const fail = (status: ProfileFitFailure["status"], message: string, n: number, p: number, iterations = 0): ProfileFitFailure => ({
    ok: false, model: model.name, status, message, warnings, n, p, iterations, lengthUm, options, window, errorModel: options.errorModel,
  });

  const windowed = prepareWindowedProfile(x, y, options, context, warnings);
  const prepared = windowed.outcome;
  window = windowed.window;
  if (!prepared.ok) return fail("invalid-input", prepared.message, 0, 0);
  const profile = prepared.profile;
  let block: SeparableBlock | null = null;
  try {
    const n = profile.x.length;
    if (profile.droppedNonFinite > 0)
      warnings.push(`${profile.droppedNonFinite} point(s) skipped because the position, intensity or variance was missing or not finite`);

    const resolved = resolveParameters(model, options, profile.extent, n >= 2 ? model.initialGuess(profile.x, profile.y, profile.extent) : [], warnings);
    const p = resolved.free.length + linearCount;
    if (n < p + 1)
      return fail("too-few-points", `${n} point(s) to fit, but the ${model.name} model has ${p} free parameters and needs at least ${p + 1} points; widen the window or fix parameters`, n, p);
    const domainProblem = model.checkDomain(profile.extent);
    if (domainProblem !== null) return fail("invalid-input", domainProblem, n, p);
    if (profile.constant)
      return fail("no-decay", `No decay: all ${n} intensities are equal (${profile.y[0] + (options.fixed.background ?? 0)} a.u.)`, n, p);

    block = new SeparableBlock(profile.x, profile.y, lengthUm ?? Infinity, options.background, model.parameters.length);
    const problem = new ProjectedProblem(model, [block], resolved.theta, resolved.free);
    const solution = solveSeparable(problem, resolved.start, resolved.lower, resolved.upper, options, [profile.weights]);
    if (!solution.evaluable)
      return fail("ill-conditioned", `The ${model.name} model could not be evaluated on these positions: its basis is degenerate or not finite at every parameter value tried; check fixed parameters and the window`, n, p, solution.iterations);
    const theta = problem.theta;
    const iterations = solution.iterations;

    // No decay: a profile that rises, or whose decay is slower than the window can show.
    const lengthScale = model.parameters[0];
    if (!(block.amplitude > 0))
      return fail("no-decay", `No decay: the best ${model.name} fit has amplitude ${formatNumber(block.amplitude)} a.u. ≤ 0, i.e. the intensity does not fall with distance from the source`, n, p, iterations);
    const lengthScaleFreeIndex = resolved.free.indexOf(0);
    if (lengthScaleFreeIndex >= 0 && solution.atBound[lengthScaleFreeIndex] === 1)
      return fail("no-decay", `No decay within the window: the best ${lengthScale.name} runs to its upper limit (${formatNumber(resolved.upper[lengthScaleFreeIndex])} µm, 1000× the window), so the profile is flat or falls only linearly`, n, p, iterations);

    const unitWeights = profile.weights === null && (options.weights === "none" || options.weights === "inverse-variance") && options.robust.loss === "none";
    const sumLogWeights = unitWeights ? 0 : sumOfLogWeights(block.weights);
    const criteria = informationCriteria(solution.rss, n, p, sumLogWeights);
    const tss = weightedTotalSumOfSquares(profile.y, block.weights);
    const flat = informationCriteria(tss, n, 1, sumLogWeights);
    if (criteria.aicc !== null && flat.aicc !== null && criteria.aicc >= flat.aicc)
      return fail("no-decay", `No decay detected: a flat line fits these ${n} points as well as the ${model.name} model (AICc ${formatNumber(flat.aicc)} vs ${formatNumber(criteria.aicc)})`, n, p, iterations);
    if (criteria.aicc === null || flat.aicc === null)
      warnings.push(`with ${n} points the decay was not tested against a flat line (AICc needs n > p + 2)`);

    const dof = n - p;
    const s2 = solution.rss / dof;
    const t = tQuantile95(dof);
    const covariance = options.errorModel === "hc3" ? sandwichCovariance(problem) : blockCovariance(problem, s2);
    const names = [...resolved.free.map((j) => model.parameters[j].name), "amplitude", ...(options.background ? ["background"] : [])];
    const fullCovariance = covariance === null ? null : assembleCovariance(covariance.nonlinear, covariance.linear[0], covariance.cross[0]);

    const parameters: Record<string, ParameterEstimate> = {};
    model.parameters.forEach((parameter, j) => {
      const k = resolved.free.indexOf(j);
      parameters[parameter.name] = parameterEstimate(theta[j], k >= 0 && fullCovariance ? fullCovariance[k][k] : null, t, parameter.unit, k < 0, true);
    });
    const pf = resolved.free.length;
    parameters.amplitude = parameterEstimate(block.amplitude, fullCovariance ? fullCovariance[pf][pf] : null, t, "a.u.");
    parameters.background = options.background
      ? parameterEstimate(block.background, fullCovariance ? fullCovariance[pf + 1][pf + 1] : null, t, "a.u.")
      : parameterEstimate(options.fixed.background ?? 0, null, t, "a.u.", true);

    const derived = derivedEstimates(model, theta, parameters.amplitude.value, parameters.background.value, resolved.free, options.background, fullCovariance, t, warnings);
    boundWarnings(model, resolved, solution.atBound, warnings);
    if (theta[0] > 5 * (profile.extent.xMaxUm - profile.extent.xMinUm))
      warnings.push(`${lengthScale.name} = ${formatNumber(theta[0])} µm is more than 5× the fitted window, so it is weakly constrained; widen the window if the data allow`);
    if (options.weights === "poisson" || options.robust.loss !== "none")
      warnings.push("AICc and BIC use the final reweighting weights and are approximate; compare models only under the same weighting");

    const offset = options.fixed.background ?? 0;
    const xUm = new Array<number>(n);
    const fitted = new Array<number>(n);
    const residuals = new Array<number>(n);
    const g = block.basisValues;
    for (let i = 0; i < n; i++) {
      const mu = block.amplitude * g[i] + block.background;
      xUm[i] = profile.x[i];
      fitted[i] = mu + offset;
      residuals[i] = profile.y[i] - mu;
    }
    const covarianceNamed = fullCovariance ? { names, matrix: fullCovariance } : null;
    const check = residualCheck(fitted, block.residual, options.errorModel, warnings);

    let status: ProfileFit["status"] = "converged";
    let message = `Converged after ${iterations} iteration(s)`;
    if (covariance === null) {
      status = "ill-conditioned";
      message = `Best-fit values found, but the parameters (${names.join(", ")}) are not separately determined by these data, so no standard errors are given; fix a parameter or widen the window`;
    } else if (!solution.converged) {
      status = "max-iterations";
      message = `Stopped after ${options.maxIterations} iterations without meeting the tolerances; the values may be inaccurate, raise maxIterations`;
    } else if (!solution.reweightingConverged) {
      status = "max-iterations";
      message = `The reweighting did not settle within ${options.maxReweightings} rounds; the values may be inaccurate, raise maxReweightings`;
    }

    return {
      ok: true,
      model: model.name,
      status,
      message,
      warnings,
      n,
      p,
      iterations,
      lengthUm,
      options,
      window,
      errorModel: options.errorModel,
      parameters,
      derived,
      covariance: covarianceNamed,
      correlation: covarianceNamed ? correlationMatrix(covarianceNamed) : null,
      rss: solution.rss,
      r2: tss > 0 ? 1 - solution.rss / tss : null,
      aicc: criteria.aicc,
      bic: criteria.bic,
      logLikelihood: criteria.logLikelihood,
      dof,
      residualSd: Math.sqrt(s2),
      xUm,
      fitted,
      residuals,
      robustScale: solution.robustScale,
      residualCheck: check,
    };
  } finally {
    // The pooled work arrays go back once the results hold their own copies.
    block?.release();
    releasePreparedProfile(profile);
  }
}

/** Full covariance over [free nonlinear…, amplitude, background?]. */
function assembleCovariance(nonlinear: Matrix, linear: Matrix, cross: Matrix): Matrix {
  const pf = nonlinear.length;
  const q = linear.length;
  const size = pf + q;
  const m: Matrix = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  for (let i = 0; i < pf; i++) for (let j = 0; j < pf; j++) m[i][j] = nonlinear[i][j];
  for (let r = 0; r < q; r++) {
    for (let c = 0; c < q; c++) m[pf + r][pf + c] = linear[r][c];
    for (let k = 0; k < pf; k++) {
      m[pf + r][k] = cross[r][k];
      m[k][pf + r] = cross[r][k];
    }
  }
  return m;
}

function derivedEstimates(
  model: SteadyStateModel,
  theta: Float64Array,
  amplitude: number,
  background: number,
  free: number[],
  fitBackground: boolean,
  covariance: Matrix | null,
  t: number,
  warnings: string[],
): Record<string, ParameterEstimate> {
  const out: Record<string, ParameterEstimate> = {};
  const P = model.parameters.length;
  const gradient = new Float64Array(P + 2);
  for (const quantity of model.derived) {
    const value = quantity.evaluate(theta, amplitude, background, gradient);
    if (!Number.isFinite(value)) {
      warnings.push(`${quantity.name} is not defined for these parameter values and is omitted`);
      continue;
    }
    let variance: number | null = null;
    if (covariance !== null) {
      const g = [...free.map((j) => gradient[j]), gradient[P], ...(fitBackground ? [gradient[P + 1]] : [])];
      variance = g.every(Number.isFinite) ? deltaMethodVariance(g, covariance) : null;
    }
    out[quantity.name] = parameterEstimate(value, variance, t, quantity.unit, false, quantity.positive === true);
  }
  return out;
}

