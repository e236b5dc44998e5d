import type { SteadyStateModel } from "../../../server/analysis/models/steadyStateModel.ts";

/** The model's basis at one parameter vector, with or without derivatives. */
export function evaluateBasis(model: SteadyStateModel, x: ArrayLike<number>, theta: readonly number[], lengthUm = Infinity) {
  const xs = Float64Array.from(x);
  const value = new Float64Array(xs.length);
  const derivatives = theta.map(() => new Float64Array(xs.length));
  model.basis(xs, Float64Array.from(theta), lengthUm, value, derivatives);
  return { value, derivatives };
}

/**
 * Largest discrepancy between the analytic ∂g/∂θ_j and a central finite
 * difference with relative step 1e-6, relative to the largest |∂g/∂θ_j|.
 * Common practice, no source (central differences have O(h²) error).
 */
export function jacobianDiscrepancy(model: SteadyStateModel, x: ArrayLike<number>, theta: readonly number[], lengthUm = Infinity): number {
  const { derivatives } = evaluateBasis(model, x, theta, lengthUm);
  let worst = 0;
  theta.forEach((t, j) => {
    const h = 1e-6 * t;
    const up = theta.slice();
    const down = theta.slice();
    up[j] = t + h;
    down[j] = t - h;
    const vu = evaluateBasis(model, x, up, lengthUm).value;
    const vd = evaluateBasis(model, x, down, lengthUm).value;
    let scale = 0;
    for (const d of derivatives[j]) scale = Math.max(scale, Math.abs(d));
    for (let i = 0; i < vu.length; i++) {
      const fd = (vu[i] - vd[i]) / (2 * h);
      worst = Math.max(worst, Math.abs(fd - derivatives[j][i]) / scale);
    }
  });
  return worst;
}

/** Evenly spaced positions from a to b inclusive. */
export function grid(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1));
}
