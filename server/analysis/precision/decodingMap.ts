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
}

/**
 * Maximum-likelihood decoding: each embryo's concentration(s) at each true
 * position are assigned to the grid position x̂ maximising the Gaussian
 * likelihood P(c|x) = N(c; ḡ(x), C(x)), with ḡ and C estimated across embryos
 * (leaving the decoded embryo out when asked, so it is not judged by its own noise).
 * Source: Dubuis et al. 2013, PNAS; Tkačik, Dubuis, Petkova, Gregor 2015, Genetics.
 * Leave-one-out statistics by rank-one downdates: S₋ᵢ = S − n/(n−1)·d dᵀ with d = cᵢ − ḡ,
 * inverted by Sherman–Morrison and det(S₋ᵢ) = det S·(1 − n/(n−1)·dᵀS⁻¹d).
 * `channels[c][i][k]` is channel c, embryo i, grid point k.
 */
export function decodingMap(
  gridX: ArrayLike<number>,
  channels: readonly (readonly ArrayLike<number>[])[],
  startIndex: number,
  endIndex: number,
  leaveOneOut: boolean,
): DecodingMap {
  const K = channels.length;
  const n = channels[0].length;
  if (n < (leaveOneOut ? K + 3 : K + 2))
    throw new RangeError(`decodingMap: ${n} embryos are too few to estimate a ${K}-channel covariance${leaveOneOut ? " leaving one out" : ""}`);
  const m = endIndex - startIndex + 1;
  const positions = Array.from({ length: m }, (_, k) => gridX[startIndex + k]);
  // Per candidate position: mean, scatter matrix S and its inverse and log-determinant.
  const mean: Float64Array[] = [];
  const scatterInverse: Float64Array[] = [];
  const logDetScatter = new Float64Array(m);
  const usable = new Uint8Array(m);
  for (let j = 0; j < m; j++) {
    const k = startIndex + j;
    const mu = new Float64Array(K);
    for (let c = 0; c < K; c++) {
      for (let i = 0; i < n; i++) mu[c] += channels[c][i][k];
      mu[c] /= n;
    }
    const s = Array.from({ length: K }, () => new Array<number>(K).fill(0));
    for (let i = 0; i < n; i++)
      for (let a = 0; a < K; a++)
        for (let b = 0; b < K; b++) s[a][b] += (channels[a][i][k] - mu[a]) * (channels[b][i][k] - mu[b]);
    const inv = invertSymmetric(s, 1e12);
    mean.push(mu);
    const flat = new Float64Array(K * K);
    if (inv) {
      let logDet = 0;
      const scale = s.map((row, a) => row[a]);
      // log det S from the unit-diagonal scaling used in the inverse: det S = Π S_aa · det(R), R the correlation matrix.
      const r = s.map((row, a) => row.map((v, b) => v / Math.sqrt(scale[a] * scale[b])));
      logDet = scale.reduce((acc, v) => acc + Math.log(v), 0) + Math.log(determinant(r));
      for (let a = 0; a < K; a++) for (let b = 0; b < K; b++) flat[a * K + b] = inv.inverse[a][b];
      logDetScatter[j] = logDet;
      usable[j] = Number.isFinite(logDet) ? 1 : 0;
    }
    scatterInverse.push(flat);
  }
  const counts = Array.from({ length: m }, () => new Float64Array(m));
  const decodedSum = new Float64Array(m);
  const decodedSquares = new Float64Array(m);
  const decodedCount = new Float64Array(m);
  let squaredError = 0;
  let decodedTotal = 0;
  const c = new Float64Array(K);
  const d = new Float64Array(K);
  const u = new Float64Array(K);
  const w = new Float64Array(K);
  const nLeft = leaveOneOut ? n - 1 : n;
  const factor = n / (n - 1);
  for (let i = 0; i < n; i++) {
    for (let t = 0; t < m; t++) {
      for (let a = 0; a < K; a++) c[a] = channels[a][i][startIndex + t];
      let best = -1;
      let bestLog = -Infinity;
      for (let j = 0; j < m; j++) {
        if (!usable[j]) continue;
        const mu = mean[j];
        const p = scatterInverse[j];
        let logDet = logDetScatter[j];
        let quadratic: number;
        if (leaveOneOut) {
          // Mean and scatter without embryo i at candidate j, then the residual of c against them.
          const k = startIndex + j;
          for (let a = 0; a < K; a++) d[a] = channels[a][i][k] - mu[a];
          for (let a = 0; a < K; a++) {
            let s = 0;
            for (let b = 0; b < K; b++) s += p[a * K + b] * d[b];
            u[a] = s;
          }
          let dud = 0;
          for (let a = 0; a < K; a++) dud += d[a] * u[a];
          const shrink = 1 - factor * dud;
          if (!(shrink > 1e-12)) continue;
          logDet += Math.log(shrink);
          // r = c − μ₋ᵢ with μ₋ᵢ = μ − d/(n−1); quadratic rᵀS₋ᵢ⁻¹r by Sherman–Morrison.
          for (let a = 0; a < K; a++) w[a] = c[a] - (mu[a] - d[a] / (n - 1));
          let rPr = 0;
          let uR = 0;
          for (let a = 0; a < K; a++) {
            let s = 0;
            for (let b = 0; b < K; b++) s += p[a * K + b] * w[b];
            rPr += w[a] * s;
            uR += u[a] * w[a];
          }
          quadratic = rPr + (factor * uR * uR) / shrink;
        } else {
          quadratic = 0;
          for (let a = 0; a < K; a++) {
            let s = 0;
            for (let b = 0; b < K; b++) s += p[a * K + b] * (c[b] - mu[b]);
            quadratic += (c[a] - mu[a]) * s;
          }
        }
        // Covariance = S/(nLeft − 1): log N = −½ log det C − ½ rᵀC⁻¹r + const.
        const logLikelihood = -0.5 * (logDet - K * Math.log(nLeft - 1)) - 0.5 * (nLeft - 1) * quadratic;
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
