import { median } from "../stats/descriptive.ts";
import { modelRegistry } from "../models/modelRegistry.ts";
import type { ModelName, ProfileExtent } from "../models/steadyStateModel.ts";
import { blockCovariance } from "./blockCovariance.ts";
import { boundWarnings } from "./boundWarnings.ts";
import type { ResolvedFitOptions } from "./fitOptions.ts";
import { formatNumber } from "./formatNumber.ts";
import { informationCriteria, sumOfLogWeights } from "./informationCriteria.ts";
import { parameterEstimate, type ParameterEstimate } from "./parameterEstimate.ts";
import { prepareWindowedProfile, type FitWindow } from "./fitWindow.ts";
import { releasePreparedProfile, type PreparedProfile } from "./prepareProfile.ts";
import { residualCheck, type ResidualCheck } from "./residualCheck.ts";
import { sandwichCovariance } from "./sandwichCovariance.ts";
import { ProjectedProblem } from "./projectedProblem.ts";
import { resolveParameters } from "./resolveParameters.ts";
import { SeparableBlock } from "./separableBlock.ts";
import { solveSeparable } from "./solveSeparable.ts";
import { tQuantile95 } from "./tQuantile95.ts";
import { weightedTotalSumOfSquares } from "./weightedTotalSumOfSquares.ts";

/** One replicate profile of a global fit. */
export interface ReplicateProfile {
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  /** Embryo length L (µm), for the finite model (and optionally the source model). */
  lengthUm?: number;
  /** Variance of each intensity, for weights "inverse-variance". */
  variance?: ArrayLike<number>;
}

/** The per-profile part of a global fit. */
export interface ReplicateEstimates {
  /** Position of the profile in the input list. */
  index: number;
  n: number;
  amplitude: ParameterEstimate;
  background: ParameterEstimate;
  /** This profile's share of the residual sum of squares. */
  rss: number;
  /** The positions fitted in this profile (µm) and how they were chosen. */
  window: FitWindow;
  xUm: number[];
  fitted: number[];
  residuals: number[];
}

interface GlobalFitCommon {
  model: ModelName;
  message: string;
  warnings: string[];
  /** Points used, over all profiles. */
  n: number;
  /** Fitted parameters: shared nonlinear ones plus each profile's amplitude (and background). */
  p: number;
  profileCount: number;
  iterations: number;
  options: ResolvedFitOptions;
  /** Over all profiles: from the smallest start to the largest end (µm), and how the ends were chosen; null when the input was unusable. */
  window: FitWindow | null;
  /** How standard errors and intervals were computed: "hc3" sandwich or "classic" s²(JᵀJ)⁻¹. */
  errorModel: "hc3" | "classic";
}

export interface GlobalFit extends GlobalFitCommon {
  ok: true;
  status: "converged" | "max-iterations" | "ill-conditioned";
  /** The shared nonlinear parameters (lambdaUm, …), with standard errors from the full covariance. */
  shared: Record<string, ParameterEstimate>;
  profiles: ReplicateEstimates[];
  rss: number;
  aicc: number | null;
  bic: number | null;
  logLikelihood: number | null;
  dof: number;
  residualSd: number;
  /** Residuals of all profiles against the error model (runs counted within each profile). */
  residualCheck: ResidualCheck;
}

export interface GlobalFitFailure extends GlobalFitCommon {
  ok: false;
  status: "no-decay" | "too-few-points" | "invalid-input" | "ill-conditioned";
}

export type GlobalFitResult = GlobalFit | GlobalFitFailure;

/**
 * Fit replicate profiles (embryos) jointly: one shared set of nonlinear
 * parameters (decay length λ, …) and an amplitude and background for each
 * profile. Solved by variable projection like a single fit: every profile's
 * linear parameters are eliminated separately (the linear part is
 * block-diagonal), so the cost grows only linearly with the number of
 * embryos. Each profile gets its own window (its start past a detected
 * source plateau or dip unless given, fitWindow.ts). The standard error of λ
 * comes from the full covariance of all parameters: by default the HC3
 * sandwich (sandwichCovariance.ts), else s²(JᵀJ)⁻¹ through the Schur
 * complement (blockCovariance.ts); λ's interval is on the log scale.
 * Source: variable projection, Golub & Pereyra 1973, SIAM J Numer Anal.
 */
export function fitGlobal(profiles: readonly ReplicateProfile[], options: ResolvedFitOptions): GlobalFitResult {
  const model = modelRegistry[options.model];
  const warnings: string[] = [];
  const linearCount = options.background ? 2 : 1;
  let window: FitWindow | null = null;
  const fail = (status: GlobalFitFailure["status"], message: string, n = 0, p = 0, iterations = 0): GlobalFitFailure => ({
    ok: false, model: model.name, status, message, warnings, n, p, profileCount: profiles.length, iterations, options, window, errorModel: options.errorModel,
  });
  if (profiles.length === 0) return fail("invalid-input", "no profiles to fit");

  const prepared: PreparedProfile[] = [];
  const windows: FitWindow[] = [];
  let blocks: SeparableBlock[] = [];
  try {
    const autoStarts: number[] = [];
    for (let k = 0; k < profiles.length; k++) {
      const profile = profiles[k];
      const windowWarnings: string[] = [];
      const { outcome, window: profileWindow } = prepareWindowedProfile(profile.x, profile.y, options, { lengthUm: profile.lengthUm, variance: profile.variance }, windowWarnings);
      if (!outcome.ok || profileWindow === null) return fail("invalid-input", `profile ${k}: ${outcome.ok ? "no usable points" : outcome.message}`);
      const p = outcome.profile;
      prepared.push(p);
      windows.push(profileWindow);
      if (profileWindow.startRule === "past-source-plateau" || profileWindow.startRule === "past-source-dip") autoStarts.push(k);
      if (p.droppedNonFinite > 0) warnings.push(`profile ${k}: ${p.droppedNonFinite} point(s) skipped because a value was missing or not finite`);
      if (p.x.length < linearCount + 1)
        return fail("too-few-points", `profile ${k} has ${p.x.length} point(s) in the window; each profile needs at least ${linearCount + 1} for its own amplitude${options.background ? " and background" : ""}`);
      const domainProblem = model.checkDomain(p.extent);
      if (domainProblem !== null) return fail("invalid-input", `profile ${k}: ${domainProblem}`);
    }
    window = combineWindows(windows);
    if (autoStarts.length > 0) {
      const starts = autoStarts.map((k) => windows[k].fromUm);
      warnings.push(
        `a source plateau or dip was detected in ${autoStarts.length} of ${profiles.length} profile(s) (${autoStarts.join(", ")}), whose fits start past it, at ${formatNumber(Math.min(...starts))}–${formatNumber(Math.max(...starts))} µm; ` +
          "to fit from the first point give the window's start (--window 0: on the command line, window.xMinUm in the options) or turn autoWindow off",
      );
    }
    const n = prepared.reduce((acc, p) => acc + p.x.length, 0);
    if (prepared.every((p) => p.constant)) return fail("no-decay", "No decay: every profile is constant");

    // Bounds from all profiles together; the start is the median of per-profile guesses (on a log scale).
    const extent: ProfileExtent = {
      xMinUm: Math.min(...prepared.map((p) => p.extent.xMinUm)),
      xMaxUm: Math.max(...prepared.map((p) => p.extent.xMaxUm)),
      minSpacingUm: Math.min(...prepared.map((p) => p.extent.minSpacingUm)),
      lengthUm: prepared.some((p) => p.extent.lengthUm !== null)
        ? Math.min(...prepared.map((p) => p.extent.lengthUm ?? Infinity))
        : null,
    };
    const guesses = prepared.map((p) => model.initialGuess(p.x, p.y, p.extent));
    const guess = model.parameters.map((_, j) => logMedian(guesses.map((g) => g[j])));
    const resolved = resolveParameters(model, options, extent, guess, warnings);
    const p = resolved.free.length + linearCount * prepared.length;
    if (n < p + 1) return fail("too-few-points", `${n} points in all, but the global fit has ${p} parameters; at least ${p + 1} points are needed`, n, p);

    blocks = prepared.map((prof) => new SeparableBlock(prof.x, prof.y, prof.extent.lengthUm ?? Infinity, options.background, model.parameters.length));
    const problem = new ProjectedProblem(model, blocks, resolved.theta, resolved.free);
    const solution = solveSeparable(problem, resolved.start, resolved.lower, resolved.upper, options, prepared.map((prof) => prof.weights));
    const iterations = solution.iterations;
    if (!solution.evaluable)
      return fail("ill-conditioned", `The ${model.name} model could not be evaluated on these profiles at any parameter value tried; check fixed parameters and windows`, n, p, iterations);

    const lengthScale = model.parameters[0];
    const lengthScaleFreeIndex = resolved.free.indexOf(0);
    if (lengthScaleFreeIndex >= 0 && solution.atBound[lengthScaleFreeIndex] === 1)
      return fail("no-decay", `No decay within the windows: the shared ${lengthScale.name} runs to its upper limit (${formatNumber(resolved.upper[lengthScaleFreeIndex])} µm), so the profiles are flat or fall only linearly`, n, p, iterations);
    const rising = blocks.map((b, k) => (b.amplitude > 0 ? -1 : k)).filter((k) => k >= 0);
    if (rising.length === blocks.length)
      return fail("no-decay", "No decay: every profile's best amplitude is ≤ 0, i.e. the intensity does not fall with distance from the source", n, p, iterations);
    if (rising.length > 0)
      warnings.push(`profile(s) ${rising.join(", ")} have amplitude ≤ 0 and do not decay; check them (flipped end to end?) or leave them out`);

    const unitWeights = prepared.every((prof) => prof.weights === null) && (options.weights === "none" || options.weights === "inverse-variance") && options.robust.loss === "none";
    const sumLogWeights = unitWeights ? 0 : blocks.reduce((acc, b) => acc + sumOfLogWeights(b.weights), 0);
    const criteria = informationCriteria(solution.rss, n, p, sumLogWeights);
    // Flat alternative: each profile its own constant level.
    const flatRss = blocks.reduce((acc, b) => acc + weightedTotalSumOfSquares(b.y, b.weights), 0);
    const flat = informationCriteria(flatRss, n, blocks.length, sumLogWeights);
    if (criteria.aicc !== null && flat.aicc !== null && criteria.aicc >= flat.aicc)
      return fail("no-decay", `No decay detected: a flat line per profile fits as well as the shared ${model.name} model (AICc ${formatNumber(flat.aicc)} vs ${formatNumber(criteria.aicc)})`, n, p, iterations);

    const dof = n - p;
    const s2 = solution.rss / dof;
    const t = tQuantile95(dof);
    const covariance = options.errorModel === "hc3" ? sandwichCovariance(problem) : blockCovariance(problem, s2);
    const shared: Record<string, ParameterEstimate> = {};
    model.parameters.forEach((parameter, j) => {
      const k = resolved.free.indexOf(j);
      shared[parameter.name] = parameterEstimate(problem.theta[j], k >= 0 && covariance ? covariance.nonlinear[k][k] : null, t, parameter.unit, k < 0, true);
    });
    boundWarnings(model, resolved, solution.atBound, warnings);
    if (options.weights === "poisson" || options.robust.loss !== "none")
      warnings.push("AICc and BIC use the final reweighting weights and are approximate; compare models only under the same weighting");

    const offset = options.fixed.background ?? 0;
    const replicates: ReplicateEstimates[] = blocks.map((b, k) => {
      const linear = covariance ? covariance.linear[k] : null;
      const m = b.n;
      const xUm = new Array<number>(m);
      const fitted = new Array<number>(m);
      const residuals = new Array<number>(m);
      for (let i = 0; i < m; i++) {
        const mu = b.amplitude * b.basisValues[i] + b.background;
        xUm[i] = b.x[i];
        fitted[i] = mu + offset;
        residuals[i] = b.y[i] - mu;
      }
      return {
        index: k,
        n: m,
        amplitude: parameterEstimate(b.amplitude, linear ? linear[0][0] : null, t, "a.u."),
        background: options.background
          ? parameterEstimate(b.background, linear ? linear[1][1] : null, t, "a.u.")
          : parameterEstimate(offset, null, t, "a.u.", true),
        rss: b.rss,
        window: windows[k],
        xUm,
        fitted,
        residuals,
      };
    });

    const allFitted: number[] = [];
    const allResiduals: number[] = [];
    const segments: number[] = [];
    for (const b of blocks) {
      segments.push(allFitted.length);
      for (let i = 0; i < b.n; i++) {
        allFitted.push(b.amplitude * b.basisValues[i] + b.background + offset);
        allResiduals.push(b.residual[i]);
      }
    }
    const check = residualCheck(allFitted, allResiduals, options.errorModel, warnings, "", segments);

    let status: GlobalFit["status"] = "converged";
    let message = `Converged after ${iterations} iteration(s) over ${blocks.length} profiles`;
    if (covariance === null) {
      status = "ill-conditioned";
      message = "Best-fit values found, but the parameters are not separately determined by these data, so no standard errors are given; fix a parameter or widen the windows";
    } else if (!solution.converged) {
      status = "max-iterations";
      message = `Stopped after ${options.maxIterations} iterations without meeting the tolerances; raise maxIterations`;
    } else if (!solution.reweightingConverged) {
      status = "max-iterations";
      message = `The reweighting did not settle within ${options.maxReweightings} rounds; raise maxReweightings`;
    }
    return {
      ok: true,
      model: model.name,
      status,
      message,
      warnings,
      n,
      p,
      profileCount: blocks.length,
      iterations,
      options,
      window,
      errorModel: options.errorModel,
      shared,
      profiles: replicates,
      rss: solution.rss,
      aicc: criteria.aicc,
      bic: criteria.bic,
      logLikelihood: criteria.logLikelihood,
      dof,
      residualSd: Math.sqrt(s2),
      residualCheck: check,
    };
  } finally {
    // The pooled work arrays go back once the results hold their own copies.
    for (const b of blocks) b.release();
    for (const prof of prepared) releasePreparedProfile(prof);
  }
}

/** Median on a log scale of the finite positive values, NaN when there are none. */
function logMedian(values: number[]): number {
  const logs = values.filter((v) => Number.isFinite(v) && v > 0).map(Math.log);
  return logs.length === 0 ? NaN : Math.exp(median(logs));
}

/** One window describing several profiles' windows: the widest span, and the rules when they agree. */
function combineWindows(windows: readonly FitWindow[]): FitWindow {
  const fromUm = Math.min(...windows.map((w) => w.fromUm));
  const toUm = Math.max(...windows.map((w) => w.toUm));
  const auto = windows.filter((w) => w.startRule === "past-source-plateau" || w.startRule === "past-source-dip").length;
  const startRule = auto > 0 ? (windows.some((w) => w.startRule === "past-source-dip") ? "past-source-dip" : "past-source-plateau") : windows[0].startRule;
  const endRule = windows[0].endRule;
  const description =
    windows.length === 1
      ? windows[0].description
      : `${formatNumber(fromUm)}–${formatNumber(toUm)} µm over ${windows.length} profiles` +
        (auto > 0 ? ` (start past a detected source plateau or dip in ${auto} of them, each profile's own window)` : windows.every((w) => w.description === windows[0].description) ? ` (${windows[0].description})` : " (each profile's own window)");
  return { fromUm, toUm, startRule, endRule, description };
}
