import { invertSymmetric } from "../linalg/invertSymmetric.ts";

/** How well position can be read back from concentration: true position → distribution of decoded positions. */
export interface DecodingMap {
  /** Grid positions of the region; rows are true positions, columns decoded positions. */
  positions: number[];
  /** probability[t][d]: share of embryos whose concentration at positions[t] decodes to positions[d]; each row sums to 1. */
  probability: number[][];
  /** Mean decoded position for each true position (null when no embryo could be decoded there). */
  decodedMean: (number | null)[];
  /** SD of the decoded positions for each true position: the decoder's positional error. */
  decodedSd: (number | null)[];
  /** Root-mean-square decoding error over all embryos and positions. */
  rmsError: number | null;
  leaveOneOut: boolean;
  channels: number;
  embryos: number;
  /** Grid positions over which the covariance was pooled (1: none). */
  poolPoints: number;
}

/**
 * Maximum-likelihood decoding: each embryo's concentration(s) at each true
 * position are assigned to the grid position x̂ maximising the Gaussian
 * likelihood P(c|x) = N(c; ḡ(x), C(x)), with ḡ and C estimated across embryos
 * (leaving the decoded embryo out when asked, so it is not judged by its own noise).
 * Source: Dubuis et al. 2013, PNAS; Tkačik, Dubuis, Petkova, Gregor 2015, Genetics.
 *
 * `poolPoints` (odd, ≥ 1) pools the covariance over that many neighbouring grid
 * positions (each about its own mean). With one point per position the sample
 * covariance is noisy from position to position, and positions where it happens
 * to be small attract decodings — stripes in the map that belong to the estimate,
 * not to the embryo. The covariance of a gradient changes over the scale of the
 * profile, not of the grid, so a window as wide as the slope's smoothing window
 * removes the stripes without hiding real changes.
 * `channels[c][i][k]` is channel c, embryo i, grid point k.
 */
export function decodingMap(
  gridX: ArrayLike<number>,
  channels: readonly (readonly ArrayLike<number>[])[],
  startIndex: number,
  endIndex: number,
  leaveOneOut: boolean,
  poolPoints = 1,
): DecodingMap {
  const K = channels.length;
  const n = channels[0].length;
  if (n < (leaveOneOut ? K + 3 : K + 2))
    throw new RangeError(`decodingMap: ${n} embryos are too few to estimate a ${K}-channel covariance${leaveOneOut ? " leaving one out" : ""}`);
  if (!Number.isInteger(poolPoints) || poolPoints < 1 || poolPoints % 2 === 0) throw new RangeError(`decodingMap: poolPoints must be an odd whole number ≥ 1, got ${poolPoints}`);
  const m = endIndex - startIndex + 1;
  const positions = Array.from({ length: m }, (_, k) => gridX[startIndex + k]);
  const half = (poolPoints - 1) / 2;
  const gridLength = channels[0][0].length;
  const value = (a: number, i: number, k: number) => channels[a][i][k];

  // Per grid point: mean over all embryos and the scatter matrix about it (flattened K×K).
  const meanAt = (k: number) => {
    const mu = new Float64Array(K);
    for (let a = 0; a < K; a++) {
      for (let i = 0; i < n; i++) mu[a] += value(a, i, k);
      mu[a] /= n;
    }
    return mu;
  };
  const means = new Map<number, Float64Array>();
  const scatters = new Map<number, Float64Array>();
  const neighbours = (j: number) => {
    const k = startIndex + j;
    const out: number[] = [];
    for (let q = Math.max(0, k - half); q <= Math.min(gridLength - 1, k + half); q++) out.push(q);
    return out;
  };
  for (let j = 0; j < m; j++) {
    for (const q of neighbours(j)) {
      if (means.has(q)) continue;
      const mu = meanAt(q);
      const s = new Float64Array(K * K);
      for (let i = 0; i < n; i++)
        for (let a = 0; a < K; a++)
          for (let b = 0; b < K; b++) s[a * K + b] += (value(a, i, q) - mu[a]) * (value(b, i, q) - mu[b]);
      means.set(q, mu);
      scatters.set(q, s);
    }
  }

  // The decoder's Gaussian at candidate j, built from all embryos or all but embryo i.
  const nLeft = leaveOneOut ? n - 1 : n;
  const factor = n / (n - 1);
  const candidate = (j: number, i: number | null): { mu: Float64Array; inverse: number[][]; logDet: number } | null => {
    const k = startIndex + j;
    const mu0 = means.get(k)!;
    const mu = new Float64Array(K);
    for (let a = 0; a < K; a++) mu[a] = i === null ? mu0[a] : mu0[a] - (value(a, i, k) - mu0[a]) / (n - 1);
    const pooled = Array.from({ length: K }, () => new Array<number>(K).fill(0));
    const window = neighbours(j);
    for (const q of window) {
      const s = scatters.get(q)!;
      const mq = means.get(q)!;
      for (let a = 0; a < K; a++)
        for (let b = 0; b < K; b++) {
          // Removing embryo i from a scatter matrix is a rank-one downdate: S − n/(n−1)·d dᵀ.
          const down = i === null ? 0 : factor * (value(a, i, q) - mq[a]) * (value(b, i, q) - mq[b]);
          pooled[a][b] += s[a * K + b] - down;
        }
    }
    const dof = window.length * (nLeft - 1);
    const covariance = pooled.map((row) => row.map((v) => v / dof));
    const inv = invertSymmetric(covariance, 1e12);
    if (!inv) return null;
    const diag = covariance.map((row, a) => row[a]);
    const r = covariance.map((row, a) => row.map((v, b) => v / Math.sqrt(diag[a] * diag[b])));
    const logDet = diag.reduce((acc, v) => acc + Math.log(v), 0) + Math.log(determinant(r));
    return Number.isFinite(logDet) ? { mu, inverse: inv.inverse, logDet } : null;
  };

  const counts = Array.from({ length: m }, () => new Float64Array(m));
  const decodedSum = new Float64Array(m);
  const decodedSquares = new Float64Array(m);
  const decodedCount = new Float64Array(m);
  let squaredError = 0;
  let decodedTotal = 0;
  const shared = leaveOneOut ? null : Array.from({ length: m }, (_, j) => candidate(j, null));
  const c = new Float64Array(K);
  for (let i = 0; i < n; i++) {
    const gaussians = shared ?? Array.from({ length: m }, (_, j) => candidate(j, i));
    for (let t = 0; t < m; t++) {
      for (let a = 0; a < K; a++) c[a] = value(a, i, startIndex + t);
      let best = -1;
      let bestLog = -Infinity;
      for (let j = 0; j < m; j++) {
        const g = gaussians[j];
        if (!g) continue;
        let quadratic = 0;
        for (let a = 0; a < K; a++) {
          let s = 0;
          for (let b = 0; b < K; b++) s += g.inverse[a][b] * (c[b] - g.mu[b]);
          quadratic += (c[a] - g.mu[a]) * s;
        }
        // log N(c; μ, C) up to a constant: −½ log det C − ½ (c − μ)ᵀC⁻¹(c − μ).
        const logLikelihood = -0.5 * g.logDet - 0.5 * quadratic;
        if (logLikelihood > bestLog) [bestLog, best] = [logLikelihood, j];
      }
      if (best < 0) continue;
      counts[t][best] += 1;
      const error = positions[best] - positions[t];
      decodedSum[t] += positions[best];
      decodedSquares[t] += positions[best] ** 2;
      decodedCount[t] += 1;
      squaredError += error * error;
      decodedTotal += 1;
    }
  }
  const probability = counts.map((row, t) => Array.from(row, (v) => (decodedCount[t] > 0 ? v / decodedCount[t] : 0)));
  const decodedMean = positions.map((_, t) => (decodedCount[t] > 0 ? decodedSum[t] / decodedCount[t] : null));
  const decodedSd = positions.map((_, t) => {
    const cnt = decodedCount[t];
    if (cnt < 2) return null;
    const mu = decodedSum[t] / cnt;
    return Math.sqrt(Math.max(0, (decodedSquares[t] - cnt * mu * mu) / (cnt - 1)));
  });
  return {
    positions,
    probability,
    decodedMean,
    decodedSd,
    rmsError: decodedTotal > 0 ? Math.sqrt(squaredError / decodedTotal) : null,
    leaveOneOut,
    channels: K,
    embryos: n,
    poolPoints,
  };
}

/** Determinant of a small matrix by Gaussian elimination with partial pivoting. */
function determinant(a: number[][]): number {
  const n = a.length;
  const m = a.map((row) => row.slice());
  let det = 1;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[pivot][col])) pivot = r;
    if (m[pivot][col] === 0) return 0;
    if (pivot !== col) {
      [m[pivot], m[col]] = [m[col], m[pivot]];
      det = -det;
    }
    det *= m[col][col];
    for (let r = col + 1; r < n; r++) {
      const f = m[r][col] / m[col][col];
      for (let c2 = col; c2 < n; c2++) m[r][c2] -= f * m[col][c2];
    }
  }
  return det;
}
