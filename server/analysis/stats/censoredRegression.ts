import { solveLinear } from "../linalg/solveLinear.ts";
import { invertSymmetric } from "../linalg/invertSymmetric.ts";
import { erfcx } from "../special/errorFunction.ts";

/** One observation of y = a + b·t + ε, ε ~ N(0, σ²), seen exactly or only as a bound. */
export interface CensoredPoint {
  t: number;
  /** The value when seen ('observed'), else the bound it lies below ('below') or above ('above'). */
  y: number;
  kind: "observed" | "below" | "above";
}

export interface CensoredRegression {
  intercept: number;
  slope: number;
  /** Residual SD σ (maximum likelihood). */
  sigma: number;
  /** Covariance of (intercept, slope) from the observed information, scaled by n/(n − 2) (see below). */
  covariance: [[number, number], [number, number]];
  /** Maximised log-likelihood in the original parameters (a, b, σ). */
  logLikelihood: number;
  iterations: number;
  converged: boolean;
}

const SQRT2PI = Math.sqrt(2 * Math.PI);
/** log Φ(z) without underflow: Φ(z) = ½·erfcx(−z/√2)·e^(−z²/2). */
const logPhi = (z: number): number => (z > 0 ? Math.log1p(-0.5 * erfcx(z / Math.SQRT2) * Math.exp(-0.5 * z * z)) : Math.log(0.5 * erfcx(-z / Math.SQRT2)) - 0.5 * z * z);
/** Inverse Mills ratio φ(z)/Φ(z), stable for very negative z. */
const mills = (z: number): number => (z > 0 ? Math.exp(-0.5 * z * z) / SQRT2PI / (1 - 0.5 * erfcx(z / Math.SQRT2) * Math.exp(-0.5 * z * z)) : 2 / (SQRT2PI * erfcx(-z / Math.SQRT2)));

/**
 * Straight line fitted by maximum likelihood to data some of which are only
 * known to lie below or above a bound (the censored-normal, or Tobit, model:
 * Tobin 1958, Econometrica 26:24–36). Maximised by Newton's method in Olsen's
 * parameters δ = (a, b)/σ, h = 1/σ, where the log-likelihood is globally
 * concave (Olsen 1978, Econometrica 46:1211–1215), from the least-squares fit
 * of the observed points.
 *
 * The covariance of (a, b) is the inverse observed information mapped back by
 * the delta method and multiplied by n/(n − 2): with nothing censored the fit
 * is ordinary least squares and this makes the standard errors equal to the
 * usual OLS ones (ML divides the residual variance by n, OLS by n − 2), so the
 * t_{n−2} intervals callers form agree with OLS in that limit.
 * Needs at least 3 points, 2 distinct t and 2 observed points.
 */
export function censoredRegression(points: readonly CensoredPoint[]): CensoredRegression {
  const n = points.length;
  const observed = points.filter((p) => p.kind === "observed");
  if (n < 3 || observed.length < 2) throw new RangeError(`censoredRegression: needs at least 3 points of which 2 observed, got ${n} and ${observed.length}`);
  // Start: least squares on the observed points.
  const mt = observed.reduce((s, p) => s + p.t, 0) / observed.length;
  const my = observed.reduce((s, p) => s + p.y, 0) / observed.length;
  let sxx = 0;
  let sxy = 0;
  for (const p of observed) {
    sxx += (p.t - mt) ** 2;
    sxy += (p.t - mt) * (p.y - my);
  }
  const b0 = sxx > 0 ? sxy / sxx : 0;
  const a0 = my - b0 * mt;
  let rss = 0;
  for (const p of observed) rss += (p.y - a0 - b0 * p.t) ** 2;
  let sd0 = Math.sqrt(rss / Math.max(1, observed.length - 2));
  if (!(sd0 > 0)) sd0 = Math.max(1e-6, Math.abs(my) * 1e-3);
  let theta = [a0 / sd0, b0 / sd0, 1 / sd0];

  const evaluate = (th: number[], wantHessian: boolean) => {
    const [d0, d1, h] = th;
    if (!(h > 0)) return { ll: -Infinity, grad: [0, 0, 0], hess: null as number[][] | null };
    let ll = 0;
    const g = [0, 0, 0];
    const H = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
    for (const p of points) {
      const xd = d0 + d1 * p.t;
      if (p.kind === "observed") {
        const e = h * p.y - xd;
        ll += Math.log(h) - 0.5 * e * e;
        g[0] += e;
        g[1] += e * p.t;
        g[2] += 1 / h - e * p.y;
        if (wantHessian) {
          const x = [1, p.t];
          for (let i = 0; i < 2; i++) {
            for (let j = 0; j < 2; j++) H[i][j] -= x[i] * x[j];
            H[i][2] += p.y * x[i];
            H[2][i] += p.y * x[i];
          }
          H[2][2] += -1 / (h * h) - p.y * p.y;
        }
      } else {
        // below a bound: log Φ(h·y − xδ); above: log Φ(xδ − h·y).
        const s = p.kind === "below" ? 1 : -1;
        const z = s * (h * p.y - xd);
        const m = mills(z);
        ll += logPhi(z);
        const dz = [-s, -s * p.t, s * p.y];
        const d2 = -m * (z + m);
        for (let i = 0; i < 3; i++) {
          g[i] += m * dz[i];
          if (wantHessian) for (let j = 0; j < 3; j++) H[i][j] += d2 * dz[i] * dz[j];
        }
      }
    }
    return { ll, grad: g, hess: wantHessian ? H : null };
  };

  let current = evaluate(theta, true);
  let converged = false;
  let iterations = 0;
  for (; iterations < 200; iterations++) {
    const neg = current.hess!.map((row) => row.map((v) => -v));
    const step = solveLinear(neg, current.grad);
    if (!step) break;
    let scale = 1;
    let next = theta.map((v, i) => v + step[i]);
    let trial = evaluate(next, false);
    while (!(trial.ll >= current.ll - 1e-12) && scale > 1e-10) {
      scale /= 2;
      next = theta.map((v, i) => v + scale * step[i]);
      trial = evaluate(next, false);
    }
    const change = Math.max(...step.map((v, i) => Math.abs(scale * v) / Math.max(1, Math.abs(theta[i]))));
    theta = next;
    current = evaluate(theta, true);
    if (change < 1e-12) {
      converged = true;
      break;
    }
  }
  const [d0, d1, h] = theta;
  const info = invertSymmetric(current.hess!.map((row) => row.map((v) => -v)));
  if (!info) throw new RangeError("censoredRegression: the information matrix is singular (are all t equal?)");
  const C = info.inverse;
  // Jacobian of (a, b) = (δ0/h, δ1/h) with respect to (δ0, δ1, h).
  const J = [[1 / h, 0, -d0 / (h * h)], [0, 1 / h, -d1 / (h * h)]];
  const cov: [[number, number], [number, number]] = [[0, 0], [0, 0]];
  const inflate = n / (n - 2);
  for (let i = 0; i < 2; i++) {
    for (let j = 0; j < 2; j++) {
      let s = 0;
      for (let k = 0; k < 3; k++) for (let l = 0; l < 3; l++) s += J[i][k] * C[k][l] * J[j][l];
      cov[i][j] = s * inflate;
    }
  }
  return { intercept: d0 / h, slope: d1 / h, sigma: 1 / h, covariance: cov, logLikelihood: current.ll - 0.5 * observed.length * Math.log(2 * Math.PI), iterations, converged };
}
