import type { ResolvedFitOptions } from "./fitOptions.ts";
import type { ProjectedProblem } from "./projectedProblem.ts";
import { bracketedStart } from "./bracketedStart.ts";
import { minimizeProjected, type ProjectedMinimum, type ProjectedMinimizerSettings } from "./minimizeProjected.ts";
import { defaultRobustScale, robustWeight } from "./robustWeight.ts";

export interface SeparableSolution {
  /** Free nonlinear parameters (natural units). */
  values: Float64Array;
  rss: number;
  /** Levenberg–Marquardt iterations, summed over restarts and reweightings. */
  iterations: number;
  /** The last minimisation stopped on a convergence test. */
  converged: boolean;
  /** False when every start was degenerate (the basis could not be evaluated). */
  evaluable: boolean;
  atBound: Int8Array;
  /** The bracketing search was needed. */
  usedFallback: boolean;
  /** Rounds of reweighting (robust loss or Poisson weights); 0 without. */
  reweightings: number;
  /** The reweighting reached a fixed point (true when there was none to do). */
  reweightingConverged: boolean;
  /** Scale of the robust loss in standardised residual units, or null without one. */
  robustScale: number | null;
}

/**
 * Solve the separable fit held by `problem`: Levenberg–Marquardt from the
 * data-driven start, falling back to the bracketing search when that fails
 * or ends on a bound; then, for a robust loss or Poisson weights, reweight
 * and re-solve until the weights stop changing (iteratively reweighted least
 * squares). `baseWeights[b]` holds block b's inverse-variance weights, or
 * null for unit weights. On return every block holds the final state.
 */
export function solveSeparable(
  problem: ProjectedProblem,
  start: ArrayLike<number>,
  lower: ArrayLike<number>,
  upper: ArrayLike<number>,
  options: ResolvedFitOptions,
  baseWeights: readonly (Float64Array | null)[],
): SeparableSolution {
  const settings: ProjectedMinimizerSettings = {
    maxIterations: options.maxIterations,
    stepTolerance: options.tolerance.step,
    reductionTolerance: options.tolerance.reduction,
    gradientTolerance: options.tolerance.gradient,
  };
  const blocks = problem.blocks;
  const poisson = options.weights === "poisson";
  const intensity = options.weights === "intensity";
  const loss = options.robust.loss;
  const reweighting = poisson || intensity || loss !== "none";
  const offset = options.fixed.background ?? 0;
  // Poisson variance ∝ the intensity including any fixed background; floor it
  // at 1e-3 of the largest intensity so near-zero values do not dominate.
  const floors = reweighting
    ? blocks.map((b) => {
        let m = 0;
        for (let i = 0; i < b.n; i++) m = Math.max(m, Math.abs(b.y[i] + offset));
        return Math.max(1e-3 * m, 1e-300);
      })
    : [];
  const poissonFactor = reweighting ? blocks.map((b) => new Float64Array(b.n).fill(1)) : [];
  const work = reweighting ? blocks.map((b) => new Float64Array(b.n)) : [];

  blocks.forEach((b, k) => {
    const base = baseWeights[k];
    if (!reweighting) {
      if (base) b.setWeights(base);
      return;
    }
    if (poisson) for (let i = 0; i < b.n; i++) poissonFactor[k][i] = 1 / Math.max(b.y[i] + offset, floors[k]);
    for (let i = 0; i < b.n; i++) work[k][i] = (base ? base[i] : 1) * poissonFactor[k][i];
    b.setWeights(work[k]);
  });

  let iterations = 0;
  let usedFallback = false;
  const solveOnce = (from: ArrayLike<number>, allowFallback: boolean): ProjectedMinimum => {
    const first = minimizeProjected(problem, from, lower, upper, settings);
    iterations += first.iterations;
    const needsFallback =
      first.reason === "degenerate" || !first.converged || (first.atBound.length > 0 && first.atBound[0] !== 0);
    if (!allowFallback || !needsFallback || problem.free.length === 0) return first;
    usedFallback = true;
    const second = minimizeProjected(problem, bracketedStart(problem, from, lower, upper), lower, upper, settings);
    iterations += second.iterations;
    const firstUsable = first.reason !== "degenerate" && Number.isFinite(first.rss);
    const secondUsable = second.reason !== "degenerate" && Number.isFinite(second.rss);
    if (secondUsable && (!firstUsable || second.rss <= first.rss || (second.converged && !first.converged))) return second;
    problem.evaluate(first.values, true);
    return first;
  };

  let result = solveOnce(start, true);
  const evaluable = result.reason !== "degenerate";
  if (!evaluable || !reweighting) {
    return {
      values: result.values,
      rss: result.rss,
      iterations,
      converged: result.converged,
      evaluable,
      atBound: result.atBound,
      usedFallback,
      reweightings: 0,
      reweightingConverged: true,
      robustScale: null,
    };
  }

  // Residuals standardised by the non-robust weights set the robust scale.
  let robustScale: number | null = null;
  if (loss !== "none") {
    if (options.robust.scale !== undefined) robustScale = options.robust.scale;
    else {
      const all: number[] = [];
      for (const b of blocks) for (let i = 0; i < b.n; i++) all.push(b.residual[i]);
      robustScale = defaultRobustScale(all);
    }
  }

  let previous = snapshot(problem, result.values);
  let reweightings = 0;
  let reweightingConverged = false;
  let varianceModel: VarianceModel | null = null;
  while (reweightings < options.maxReweightings) {
    reweightings++;
    if (intensity) varianceModel = intensityVarianceModel(problem, offset, varianceModel);
    blocks.forEach((b, k) => {
      const base = baseWeights[k];
      const mu = b.fittedValues(work[k]);
      for (let i = 0; i < b.n; i++) {
        if (poisson) poissonFactor[k][i] = 1 / Math.max(mu[i] + offset, floors[k]);
        if (varianceModel) poissonFactor[k][i] = 1 / Math.max(varianceModel.a + varianceModel.b * (mu[i] + offset) ** 2, varianceModel.floor);
        const w0 = (base ? base[i] : 1) * poissonFactor[k][i];
        const standardised = Math.sqrt(w0) * (b.y[i] - mu[i]);
        work[k][i] = w0 * (robustScale === null ? 1 : robustWeight(loss, standardised, robustScale));
      }
      b.setWeights(work[k]);
    });
    result = solveOnce(result.values, false);
    if (result.reason === "degenerate") break;
    const current = snapshot(problem, result.values);
    const change = relativeChange(previous, current, blocks.length);
    previous = current;
    // Estimated intensity weights carry sampling error far above 1e-6, so a tighter fixed point buys nothing.
    if (change <= Math.max(options.tolerance.step, intensity && !poisson && loss === "none" ? 1e-6 : 1e-12)) {
      reweightingConverged = true;
      break;
    }
  }
  return {
    values: result.values,
    rss: result.rss,
    iterations,
    converged: result.converged,
    evaluable: result.reason !== "degenerate",
    atBound: result.atBound,
    usedFallback,
    reweightings,
    reweightingConverged,
    robustScale,
  };
}

/**
 * Variance function σ² = a + b·μ² (a, b ≥ 0) fitted by least squares to the
 * squared residuals r² of every block against their fitted intensity μ: the
 * constant part is camera/background noise, the part growing with μ² is
 * multiplicative (fluorescence) noise. r² is weighted by the previous
 * round's 1/σ⁴, since its variance grows as σ⁴. Iterating weights 1/σ²(μ) and the fit
 * is the usual estimated-weights scheme (Carroll & Ruppert 1988,
 * Transformation and Weighting in Regression, ch. 2 [memory]). The variance
 * is floored at 1e-3 of its value at the largest intensity so that points
 * near zero do not dominate.
 */
interface VarianceModel {
  a: number;
  b: number;
  floor: number;
}

function intensityVarianceModel(problem: ProjectedProblem, offset: number, previous: VarianceModel | null): VarianceModel {
  let s1 = 0, sm = 0, smm = 0, sr = 0, smr = 0, muMax = 0;
  for (const b of problem.blocks) {
    for (let i = 0; i < b.n; i++) {
      const mu = b.amplitude * b.basisValues[i] + b.background;
      const r = b.y[i] - mu;
      const m2 = (mu + offset) ** 2;
      // r² has variance ∝ σ⁴: weight by the previous round's 1/σ⁴ (unweighted in the first round).
      const v = previous ? Math.max(previous.a + previous.b * m2, previous.floor) : 1;
      const w = 1 / (v * v);
      s1 += w;
      sm += w * m2;
      smm += w * m2 * m2;
      sr += w * r * r;
      smr += w * m2 * r * r;
      muMax = Math.max(muMax, m2);
    }
  }
  const det = s1 * smm - sm * sm;
  let a = det > 0 ? (smm * sr - sm * smr) / det : sr / s1;
  let b = det > 0 ? (s1 * smr - sm * sr) / det : 0;
  if (b < 0) { b = 0; a = sr / s1; }
  if (a < 0) { a = 0; b = smm > 0 ? smr / smm : 0; }
  const top = a + b * muMax;
  const floor = Math.max(1e-3 * top, 1e-300);
  return top > 0 ? { a, b, floor } : { a: 1, b: 0, floor: 1e-300 };
}

/** Nonlinear values followed by each block's amplitude and background. */
function snapshot(problem: ProjectedProblem, values: Float64Array): Float64Array {
  const out = new Float64Array(values.length + 2 * problem.blocks.length);
  out.set(values);
  problem.blocks.forEach((b, k) => {
    out[values.length + 2 * k] = b.amplitude;
    out[values.length + 2 * k + 1] = b.background;
  });
  return out;
}

/**
 * Largest relative change between snapshots: nonlinear parameters relative
 * to themselves, amplitude and background relative to the amplitude's size.
 */
function relativeChange(a: Float64Array, b: Float64Array, blockCount: number): number {
  const p = a.length - 2 * blockCount;
  let change = 0;
  for (let k = 0; k < p; k++) change = Math.max(change, Math.abs(b[k] - a[k]) / Math.abs(b[k]));
  for (let k = 0; k < blockCount; k++) {
    const scale = Math.abs(b[p + 2 * k]) + Math.abs(b[p + 2 * k + 1]) || 1;
    change = Math.max(change, Math.abs(b[p + 2 * k] - a[p + 2 * k]) / scale);
    change = Math.max(change, Math.abs(b[p + 2 * k + 1] - a[p + 2 * k + 1]) / scale);
  }
  return change;
}
