import { scaledMad } from "../stats/descriptive.ts";

export type RobustLoss = "none" | "soft-l1" | "huber";

/**
 * Weight ρ'(z) given to a point in iteratively reweighted least squares, for
 * z = (r/scale)² with r the standardised residual. Minimising Σρ(z_i) and
 * solving weighted least squares with weights ρ'(z_i) fixed at the current
 * residuals share their stationary points, so iterating the latter converges
 * to the robust M-estimate (Holland & Welsch 1977, Commun Stat Theory Methods).
 * Loss definitions as in scipy.optimize.least_squares:
 *   soft-l1: ρ(z) = 2(√(1+z) − 1),      ρ'(z) = 1/√(1+z)
 *   huber:   ρ(z) = z (z ≤ 1), 2√z − 1,  ρ'(z) = 1 (z ≤ 1), 1/√z
 */
export function robustWeight(loss: RobustLoss, residual: number, scale: number): number {
  if (loss === "none") return 1;
  const z = (residual / scale) ** 2;
  if (loss === "soft-l1") return 1 / Math.sqrt(1 + z);
  return z <= 1 ? 1 : 1 / Math.sqrt(z);
}

/**
 * Default loss scale: 1.345 × the robust SD (scaled MAD) of the residuals of
 * an ordinary fit. 1.345 is Huber's tuning constant giving 95% efficiency
 * when the noise is normal (Huber 1981, Robust Statistics, §4.6).
 * Falls back to the RMS residual when more than half the residuals are 0.
 */
export function defaultRobustScale(residuals: ArrayLike<number>): number {
  const mad = scaledMad(residuals);
  if (mad > 0) return 1.345 * mad;
  let ss = 0;
  for (let i = 0; i < residuals.length; i++) ss += residuals[i] * residuals[i];
  const rms = Math.sqrt(ss / Math.max(residuals.length, 1));
  return rms > 0 ? 1.345 * rms : 1;
}
