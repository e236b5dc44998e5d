import { solveLinear } from "../linalg/solveLinear.ts";
import type { ProjectedProblem } from "./projectedProblem.ts";

export interface ProjectedMinimizerSettings {
  maxIterations: number;
  /** Relative step of every nonlinear parameter below which iteration stops. */
  stepTolerance: number;
  /** Relative actual and predicted RSS decrease below which iteration stops. */
  reductionTolerance: number;
  /** Largest cosine between residual and a Jacobian column below which iteration stops. */
  gradientTolerance: number;
}

export type StopReason = "step" | "reduction" | "gradient" | "exact" | "no-free-parameters" | "max-iterations" | "degenerate";

export interface ProjectedMinimum {
  /** Free nonlinear parameters at the end (natural units). */
  values: Float64Array;
  rss: number;
  iterations: number;
  converged: boolean;
  reason: StopReason;
  /** Per free parameter: −1 at its lower bound, +1 at its upper bound, 0 inside. */
  atBound: Int8Array;
}

/**
 * Levenberg–Marquardt on the variable-projection residual, in the
 * logarithms of the (positive) nonlinear parameters so that a step means the
 * same relative change at any scale, with steps clipped to the bounds.
 * Marquardt's diagonal scaling (Marquardt 1963, J Soc Ind Appl Math), with
 * the damping raised or lowered from the ratio of actual to predicted RSS
 * decrease (Nielsen 1999, Technical Report IMM-REP-1999-05, Technical
 * University of Denmark). Stopping rules follow Moré, Garbow & Hillstrom
 * 1980 (MINPACK, Argonne report ANL-80-74): relative step, relative actual
 * and predicted reduction, and the cosine between residual and Jacobian
 * columns; a step whose predicted gain is below the reduction tolerance is
 * not tried. On return the problem holds the state at the minimum.
 */
export function minimizeProjected(
  problem: ProjectedProblem,
  start: ArrayLike<number>,
  lower: ArrayLike<number>,
  upper: ArrayLike<number>,
  settings: ProjectedMinimizerSettings,
): ProjectedMinimum {
  const p = problem.free.length;
  const values = new Float64Array(p);
  const atBound = new Int8Array(p);
  if (p === 0) {
    const ok = problem.evaluate(values, true);
    return { values, rss: problem.rss, iterations: 0, converged: ok, reason: ok ? "no-free-parameters" : "degenerate", atBound };
  }
  const logLower = Float64Array.from({ length: p }, (_, k) => Math.log(lower[k]));
  const logUpper = Float64Array.from({ length: p }, (_, k) => Math.log(upper[k]));
  const u = new Float64Array(p);
  for (let k = 0; k < p; k++) u[k] = clamp(Math.log(start[k]), logLower[k], logUpper[k]);
  const trial = new Float64Array(p);
  const step = new Float64Array(p);
  const a = new Float64Array(p * p);
  const g = new Float64Array(p);
  const rhs = new Float64Array(p);
  const damped = new Float64Array(p * p);

  const toNatural = (from: Float64Array) => {
    for (let k = 0; k < p; k++) values[k] = Math.exp(from[k]);
    return values;
  };
  // Gram matrix and gradient in log coordinates: ∂r/∂ln θ = θ·∂r/∂θ.
  const captureDerivatives = () => {
    for (let i = 0; i < p; i++) {
      const ti = values[i];
      g[i] = problem.jtr[i] * ti;
      for (let j = 0; j < p; j++) a[i * p + j] = problem.jtj[i * p + j] * ti * values[j];
    }
  };

  if (!problem.evaluate(toNatural(u), true)) {
    return { values: toNatural(u).slice(), rss: NaN, iterations: 0, converged: false, reason: "degenerate", atBound };
  }
  let rss = problem.rss;
  captureDerivatives();
  // Dimensionless damping: the step solves (A + μ·diag(A))δ = −g.
  let mu = 1e-3;
  let nu = 2;
  let maxDiag = 0;
  let stateAtU = true;
  let reason: StopReason = "max-iterations";
  let iterations = 0;

  while (iterations < settings.maxIterations) {
    if (rss === 0) {
      reason = "exact";
      break;
    }
    let cosine = 0;
    for (let k = 0; k < p; k++) {
      const d = a[k * p + k];
      if (d > 0) cosine = Math.max(cosine, Math.abs(g[k]) / Math.sqrt(d * rss));
    }
    if (cosine <= settings.gradientTolerance) {
      reason = "gradient";
      break;
    }
    iterations++;
    maxDiag = 0;
    for (let k = 0; k < p; k++) maxDiag = Math.max(maxDiag, a[k * p + k]);
    for (let i = 0; i < p; i++) {
      rhs[i] = -g[i];
      for (let j = 0; j < p; j++) damped[i * p + j] = a[i * p + j];
      // A parameter without influence still gets a positive damping term.
      damped[i * p + i] += mu * Math.max(a[i * p + i], 1e-12 * maxDiag, 1e-300);
    }
    if (!solveSmall(damped, rhs, p, step)) {
      mu *= nu;
      nu *= 2;
      if (!(mu < 1e300)) {
        reason = "step";
        break;
      }
      continue;
    }
    let stepMax = 0;
    for (let k = 0; k < p; k++) {
      trial[k] = clamp(u[k] + step[k], logLower[k], logUpper[k]);
      step[k] = trial[k] - u[k];
      stepMax = Math.max(stepMax, Math.abs(step[k]));
    }
    if (stepMax <= settings.stepTolerance) {
      reason = "step";
      break;
    }
    // Predicted decrease of Σr² from the linearisation: −(2gᵀδ + δᵀAδ).
    let predicted = 0;
    for (let i = 0; i < p; i++) {
      let ad = 0;
      for (let j = 0; j < p; j++) ad += a[i * p + j] * step[j];
      predicted -= 2 * g[i] * step[i] + step[i] * ad;
    }
    // A step whose predicted gain is below the tolerance cannot be told from rounding in the RSS.
    if (predicted <= settings.reductionTolerance * rss) {
      reason = "reduction";
      break;
    }
    const ok = problem.evaluate(toNatural(trial), true);
    stateAtU = false;
    const trialRss = ok ? problem.rss : Infinity;
    const rho = predicted > 0 ? (rss - trialRss) / predicted : -1;
    if (ok && trialRss < rss && rho > 0) {
      const actualRelative = (rss - trialRss) / rss;
      const predictedRelative = predicted / rss;
      u.set(trial);
      rss = trialRss;
      captureDerivatives();
      stateAtU = true;
      mu *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
      nu = 2;
      if (actualRelative <= settings.reductionTolerance && predictedRelative <= settings.reductionTolerance) {
        reason = "reduction";
        break;
      }
      if (stepMax <= settings.stepTolerance) {
        reason = "step";
        break;
      }
    } else {
      mu *= nu;
      nu *= 2;
      // No step, however short, lowers the RSS: a minimum to working precision.
      if (!(mu < 1e300)) {
        reason = "step";
        break;
      }
    }
  }

  toNatural(u);
  if (!stateAtU) problem.evaluate(values, true);
  for (let k = 0; k < p; k++) {
    if (u[k] <= logLower[k] + 1e-9) atBound[k] = -1;
    else if (u[k] >= logUpper[k] - 1e-9) atBound[k] = 1;
  }
  return { values: values.slice(), rss, iterations, converged: reason !== "max-iterations", reason, atBound };
}

function clamp(v: number, lo: number, hi: number): number {
  return v < lo ? lo : v > hi ? hi : v;
}

/** Solve a small symmetric system; closed form for one or two unknowns. */
function solveSmall(m: Float64Array, b: Float64Array, p: number, out: Float64Array): boolean {
  if (p === 1) {
    if (!(m[0] > 0)) return false;
    out[0] = b[0] / m[0];
    return Number.isFinite(out[0]);
  }
  if (p === 2) {
    const det = m[0] * m[3] - m[1] * m[2];
    if (!(det > 0)) return false;
    out[0] = (m[3] * b[0] - m[1] * b[1]) / det;
    out[1] = (m[0] * b[1] - m[2] * b[0]) / det;
    return Number.isFinite(out[0]) && Number.isFinite(out[1]);
  }
  const rows = Array.from({ length: p }, (_, i) => Array.from(m.subarray(i * p, i * p + p)));
  const x = solveLinear(rows, b);
  if (x === null) return false;
  for (let i = 0; i < p; i++) out[i] = x[i];
  return out.every(Number.isFinite);
}
