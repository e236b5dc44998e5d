import type { Matrix } from "../linalg/matrix.ts";
import { solveLinear } from "../linalg/solveLinear.ts";

/** Mean vector and covariance matrix across embryos at each grid position, for K channels. */
export interface ChannelMoments {
  /** means[c][k]: channel c at grid point k. */
  means: Float64Array[];
  /** covariances[k]: K×K sample covariance (ddof 1) across embryos at grid point k. */
  covariances: Matrix[];
}

/** `channels[c][i][k]` is channel c, embryo i, grid point k; `indices` selects (possibly repeated) embryos. */
export function channelMoments(channels: readonly (readonly ArrayLike<number>[])[], indices?: ArrayLike<number>): ChannelMoments {
  const K = channels.length;
  const n = indices ? indices.length : channels[0].length;
  if (n < 2) throw new RangeError(`channelMoments: needs at least 2 embryos, got ${n}`);
  const g = channels[0][0].length;
  const means = channels.map(() => new Float64Array(g));
  for (let c = 0; c < K; c++)
    for (let r = 0; r < n; r++) {
      const v = channels[c][indices ? indices[r] : r];
      for (let k = 0; k < g; k++) means[c][k] += v[k];
    }
  for (let c = 0; c < K; c++) for (let k = 0; k < g; k++) means[c][k] /= n;
  const covariances: Matrix[] = [];
  const d = new Float64Array(K);
  for (let k = 0; k < g; k++) {
    const cov = Array.from({ length: K }, () => new Array<number>(K).fill(0));
    for (let r = 0; r < n; r++) {
      const i = indices ? indices[r] : r;
      for (let c = 0; c < K; c++) d[c] = channels[c][i][k] - means[c][k];
      for (let a = 0; a < K; a++) for (let b = a; b < K; b++) cov[a][b] += d[a] * d[b];
    }
    for (let a = 0; a < K; a++)
      for (let b = a; b < K; b++) {
        cov[a][b] /= n - 1;
        cov[b][a] = cov[a][b];
      }
    covariances.push(cov);
  }
  return { means, covariances };
}

/**
 * Joint positional error of several channels read together:
 * σ_x⁻²(x) = ḡ′(x)ᵀ C(x)⁻¹ ḡ′(x), with C the across-embryo covariance.
 * Source: Dubuis, Tkačik, Wieschaus, Gregor, Bialek 2013, PNAS; Tkačik et al. 2015, Genetics.
 * For independent channels it reduces to σ⁻² = Σ σ_c⁻²; ignoring real correlations gives
 * the wrong answer. NaN where C is singular. `slopes[c][k]` is dḡ_c/dx at grid point k.
 */
export function jointSigmaX(slopes: readonly ArrayLike<number>[], covariances: readonly Matrix[], out = new Float64Array(covariances.length)): Float64Array {
  const K = slopes.length;
  const v = new Array<number>(K);
  for (let k = 0; k < covariances.length; k++) {
    for (let c = 0; c < K; c++) v[c] = slopes[c][k];
    const solved = solveLinear(covariances[k], v);
    if (!solved) {
      out[k] = NaN;
      continue;
    }
    let q = 0;
    for (let c = 0; c < K; c++) q += v[c] * solved[c];
    out[k] = q > 0 ? 1 / Math.sqrt(q) : NaN;
  }
  return out;
}

/** The same combination ignoring correlations between channels: σ⁻² = Σ_c ḡ_c′²/C_cc. */
export function independentSigmaX(slopes: readonly ArrayLike<number>[], covariances: readonly Matrix[]): Float64Array {
  const out = new Float64Array(covariances.length);
  for (let k = 0; k < covariances.length; k++) {
    let q = 0;
    for (let c = 0; c < slopes.length; c++) q += slopes[c][k] ** 2 / covariances[k][c][c];
    out[k] = q > 0 ? 1 / Math.sqrt(q) : NaN;
  }
  return out;
}

/**
 * Factor by which inverting a sample covariance of K channels from n embryos
 * inflates σ_x⁻² on average: E[S⁻¹] = C⁻¹·(n−1)/(n−K−2) for Gaussian data
 * (mean of the inverse Wishart distribution; Anderson 2003, An Introduction to
 * Multivariate Statistical Analysis, §7.2). Infinity when n ≤ K + 2.
 */
export function inverseCovarianceBias(n: number, channels: number): number {
  return n - channels - 2 > 0 ? (n - 1) / (n - channels - 2) : Infinity;
}
