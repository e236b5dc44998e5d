import type { Matrix } from "../linalg/matrix.ts";

/**
 * Variance of a smooth function f(θ) of estimated parameters by the delta
 * method, ∇fᵀ Σ ∇f, to first order. Source: e.g. Casella & Berger 2002,
 * Statistical Inference, §5.5.4. Returns null when the result is not a
 * finite non-negative number.
 */
export function deltaMethodVariance(gradient: ArrayLike<number>, covariance: Matrix): number | null {
  const p = gradient.length;
  let v = 0;
  for (let i = 0; i < p; i++) {
    if (gradient[i] === 0) continue;
    for (let j = 0; j < p; j++) if (gradient[j] !== 0) v += gradient[i] * covariance[i][j] * gradient[j];
  }
  if (!Number.isFinite(v)) return null;
  // Rounding can leave a tiny negative value for an (almost) exactly known quantity.
  return Math.max(v, 0);
}
