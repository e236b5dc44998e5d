import { invertSymmetric } from "../linalg/invertSymmetric.ts";
import { solveLinear } from "../linalg/solveLinear.ts";

export interface LeastSquaresFit {
  parameters: number[];
  residuals: Float64Array;
  sumOfSquares: number;
  /** (JᵀJ)⁻¹ at the minimum (multiply by s² for the covariance); null when singular. */
  inverseInformation: number[][] | null;
  /** Columns of the Jacobian of the residuals at the minimum (∂r/∂θⱼ). */
  jacobian: Float64Array[];
  iterations: number;
  converged: boolean;
}

/**
 * Nonlinear least squares by Levenberg–Marquardt with a central-difference
 * Jacobian (the dynamics models are cheap to evaluate but awkward to
 * differentiate by hand). Parameters stay inside [lower, upper].
 * Source: Marquardt 1963, J Soc Ind Appl Math 11:431; Nocedal & Wright 2006,
 * Numerical Optimization, §10.3.
 */
export function levenbergMarquardt(
  residualsOf: (p: readonly number[]) => Float64Array,
  start: readonly number[],
  lower: readonly number[],
  upper: readonly number[],
  maxIterations = 200,
): LeastSquaresFit {
  const m = start.length;
  let p = start.map((v, i) => Math.min(upper[i], Math.max(lower[i], v)));
  let r = residualsOf(p);
  let ss = sumSquares(r);
  let mu = 1e-3;
  let converged = false;
  let iterations = 0;
  let jac = jacobian(residualsOf, p, lower, upper);
  for (; iterations < maxIterations; iterations++) {
    const jtj = gram(jac);
    const jtr = jac.map((col) => -dot(col, r));
    let improved = false;
    for (let attempt = 0; attempt < 20; attempt++) {
      const a = jtj.map((row, i) => row.map((v, j) => (i === j ? v + mu * Math.max(v, 1e-12) : v)));
      const step = solveLinear(a, jtr);
      if (step === null) {
        mu *= 10;
        continue;
      }
      const trial = p.map((v, i) => Math.min(upper[i], Math.max(lower[i], v + step[i])));
      const rt = residualsOf(trial);
      const sst = sumSquares(rt);
      if (Number.isFinite(sst) && sst <= ss) {
        const relative = (ss - sst) / Math.max(ss, 1e-300);
        const stepSize = Math.max(...step.map((s, i) => Math.abs(s) / (Math.abs(p[i]) + 1e-8)));
        p = trial;
        r = rt;
        ss = sst;
        mu = Math.max(mu / 3, 1e-12);
        improved = true;
        if (relative < 1e-12 || stepSize < 1e-10) converged = true;
        break;
      }
      mu *= 10;
    }
    if (!improved) {
      converged = true;
      break;
    }
    jac = jacobian(residualsOf, p, lower, upper);
    if (converged) break;
  }
  const inverse = invertSymmetric(gram(jac));
  return { parameters: p, residuals: r, sumOfSquares: ss, inverseInformation: inverse ? inverse.inverse : null, jacobian: jac, iterations, converged };
}

function jacobian(f: (p: readonly number[]) => Float64Array, p: readonly number[], lower: readonly number[], upper: readonly number[]): Float64Array[] {
  return p.map((v, i) => {
    const h = 1e-6 * Math.max(Math.abs(v), 1e-3);
    const up = [...p];
    const down = [...p];
    up[i] = Math.min(upper[i], v + h);
    down[i] = Math.max(lower[i], v - h);
    const fu = f(up);
    const fd = f(down);
    const span = up[i] - down[i];
    const col = new Float64Array(fu.length);
    for (let k = 0; k < fu.length; k++) col[k] = (fu[k] - fd[k]) / span;
    return col;
  });
}

function gram(cols: Float64Array[]): number[][] {
  return cols.map((a) => cols.map((b) => dot(a, b)));
}

function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

function sumSquares(r: Float64Array): number {
  return dot(r, r);
}

/**
 * Heteroscedasticity-consistent (HC3) covariance of least-squares estimates:
 * (JᵀJ)⁻¹·Jᵀ·diag(rᵢ²/(1 − hᵢ)²)·J·(JᵀJ)⁻¹, hᵢ the leverages. Fluorescence
 * noise grows with intensity, where s²(JᵀJ)⁻¹ under-covers.
 * Source: MacKinnon & White 1985, J Econometrics 29:305; White 1980, Econometrica 48:817.
 */
export function sandwichCovariance(fit: LeastSquaresFit): number[][] | null {
  const inv = fit.inverseInformation;
  if (!inv) return null;
  const m = inv.length;
  const n = fit.residuals.length;
  const meat = Array.from({ length: m }, () => new Array<number>(m).fill(0));
  const row = new Array<number>(m);
  for (let i = 0; i < n; i++) {
    for (let a = 0; a < m; a++) row[a] = fit.jacobian[a][i];
    let h = 0;
    for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) h += row[a] * inv[a][b] * row[b];
    const w = fit.residuals[i] ** 2 / Math.max(1 - h, 1e-8) ** 2;
    for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) meat[a][b] += w * row[a] * row[b];
  }
  const left = inv.map((r) => r.map((_, j) => r.reduce((s, v, k) => s + v * meat[k][j], 0)));
  return left.map((r) => r.map((_, j) => r.reduce((s, v, k) => s + v * inv[k][j], 0)));
}
