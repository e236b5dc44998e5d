import { cholesky } from "../linalg/cholesky.ts";
import { invertSymmetric } from "../linalg/invertSymmetric.ts";
import type { Matrix } from "../linalg/matrix.ts";
import { gaussHermite } from "../stats/gaussHermite.ts";
import { normalIntervalProbability } from "../stats/normalTail.ts";
import { trapezoidWeights } from "../stats/trapezoid.ts";

/*
 * Direct positional information I(x; g) = ∫dx P(x) ∫dg P(g|x) log₂[P(g|x)/P(g)]
 * (Tkačik, Dubuis, Petkova, Gregor 2015, Genetics; Dubuis et al. 2013, PNAS) for
 * Gaussian conditionals P(g|x) = N(ḡ(x), C(x)) and a uniform prior on the region,
 * with ḡ and C interpolated linearly between grid points. Written as I = H(g) − H(g|x):
 *  - H(g|x) = (1/L)∫ ½ log₂((2πe)^K det C(x)) dx, exact for Gaussians;
 *  - H(g) = −(1/L)∫dx E_{g~P(g|x)}[log₂ P(g)], the inner expectation by Gauss–Hermite quadrature.
 * P(g) = (1/L)∫ N(g; ḡ(x′), C(x′)) dx′ is computed exactly for ḡ linear and C constant (the
 * interval mean) on each grid interval: along the segment the Gaussian's exponent is quadratic
 * in the interval parameter t, so its integral is a normal-CDF difference. This stays exact
 * when σ_x is much smaller than the grid spacing, where summing over grid points would not.
 * The outer x-integral is the trapezoid rule on the grid, refined near the ends of the region
 * where H(g)'s integrand changes over a few σ_x (see outerNodes).
 * Direct estimates from a finite number of embryos are biased upward (Tkačik et al. 2015).
 */

/** Skip an interval whose Gaussian lies more than 6 SDs (Mahalanobis) from g: e^(−18) ≈ 1.5e-8 of its peak. */
const PRUNE_Q = 36;
const LOG2E = Math.LOG2E;
/**
 * Intervals over which the mean changes by less than half an SD use the midpoint density
 * instead of the CDF difference: one exponential instead of two tail evaluations. Summed over
 * the many shallow intervals under one Gaussian bump the midpoint rule is spectrally accurate;
 * against the exact interval formula the information changes by < 1e-5 bits in tests.
 */
const SHALLOW = 0.5;
/** Near the ends of the region the outer integral uses sub-steps of σ_x/8, out to 5 σ_x from each end. */
const EDGE_STEPS_PER_SIGMA = 8;
const EDGE_REACH_SIGMAS = 5;
const MAX_SUBSTEPS = 64;

/** One channel: mean and across-embryo SD at each grid position. Returns NaN when an SD in the region is not positive. */
export function gaussianInformation(
  gridX: ArrayLike<number>,
  mean: ArrayLike<number>,
  sd: ArrayLike<number>,
  startIndex: number,
  endIndex: number,
  hermiteNodes = 12,
): number {
  const length = gridX[endIndex] - gridX[startIndex];
  if (!(length > 0)) return NaN;
  for (let k = startIndex; k <= endIndex; k++) if (!(sd[k] > 0) || !Number.isFinite(mean[k])) return NaN;
  const m = endIndex - startIndex;
  const lo = new Float64Array(m);
  const hi = new Float64Array(m);
  const mid = new Float64Array(m);
  const sigma = new Float64Array(m);
  const coefficient = new Float64Array(m);
  const steep = new Uint8Array(m);
  const sigmaSteps = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    const a = mean[startIndex + j];
    const b = mean[startIndex + j + 1];
    const s = 0.5 * (sd[startIndex + j] + sd[startIndex + j + 1]);
    const dx = gridX[startIndex + j + 1] - gridX[startIndex + j];
    lo[j] = Math.min(a, b);
    hi[j] = Math.max(a, b);
    mid[j] = 0.5 * (a + b);
    sigma[j] = s;
    sigmaSteps[j] = (hi[j] - lo[j]) / s;
    steep[j] = hi[j] - lo[j] > SHALLOW * s ? 1 : 0;
    coefficient[j] = steep[j] ? dx / (length * (hi[j] - lo[j])) : dx / (length * s * Math.sqrt(2 * Math.PI));
  }
  const reach = Math.sqrt(PRUNE_Q);
  const index = intervalIndex(
    Float64Array.from(lo, (v, j) => v - reach * sigma[j]),
    Float64Array.from(hi, (v, j) => v + reach * sigma[j]),
  );
  const rule = gaussHermite(hermiteNodes);
  const outer = outerNodes(gridX, startIndex, endIndex, sigmaSteps);
  let conditional = 0;
  let marginal = 0;
  for (let node = 0; node < outer.weight.length; node++) {
    const j = outer.interval[node];
    const t = outer.t[node];
    const muK = (1 - t) * mean[startIndex + j] + t * mean[startIndex + j + 1];
    const sK = (1 - t) * sd[startIndex + j] + t * sd[startIndex + j + 1];
    const weightX = outer.weight[node] / length;
    conditional += weightX * Math.log2(Math.sqrt(2 * Math.PI * Math.E) * sK);
    let expectation = 0;
    for (let q = 0; q < rule.nodes.length; q++) {
      const g = muK + Math.SQRT2 * sK * rule.nodes[q];
      let p = 0;
      for (let i = lastReaching(index, g); i >= 0 && index.prefixMaxUpper[i] >= g; i--) {
        if (index.upper[i] < g) continue;
        const jj = index.order[i];
        const s = sigma[jj];
        if (steep[jj]) p += coefficient[jj] * normalIntervalProbability((lo[jj] - g) / s, (hi[jj] - g) / s);
        else {
          const z = (g - mid[jj]) / s;
          p += coefficient[jj] * Math.exp(-0.5 * z * z);
        }
      }
      expectation += (rule.weights[q] / Math.sqrt(Math.PI)) * Math.log(Math.max(p, Number.MIN_VALUE)) * LOG2E;
    }
    marginal -= weightX * expectation;
  }
  return marginal - conditional;
}

/**
 * Several channels measured together: mean vectors ḡ(x) (means[c][k], channel c, grid point k)
 * and covariance matrices C(x) (covariances[k], K×K). Gauss–Hermite nodes form a tensor grid of
 * `nodesPerDimension`^K points mapped through the Cholesky factor of C(x).
 * Returns NaN when a covariance in the region is not positive definite.
 */
export function jointGaussianInformation(
  gridX: ArrayLike<number>,
  means: readonly ArrayLike<number>[],
  covariances: readonly Matrix[],
  startIndex: number,
  endIndex: number,
  nodesPerDimension: number,
): number {
  const K = means.length;
  const length = gridX[endIndex] - gridX[startIndex];
  if (!(length > 0) || K === 0) return NaN;
  const m = endIndex - startIndex;
  for (let k = startIndex; k <= endIndex; k++) if (!cholesky(covariances[k])) return NaN;
  // Per interval: start mean, direction d, precision P of the mean covariance, constant factor.
  const start: Float64Array[] = [];
  const precision: Float64Array[] = [];
  const dirPrecision: Float64Array[] = [];
  const quadA = new Float64Array(m);
  const coefficient = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    const a = startIndex + j;
    const cbar: Matrix = covariances[a].map((row, r) => row.map((v, c) => 0.5 * (v + covariances[a + 1][r][c])));
    const inv = invertSymmetric(cbar);
    const l = cholesky(cbar);
    if (!inv || !l) return NaN;
    let ld = 0;
    for (let i = 0; i < K; i++) ld += 2 * Math.log(l[i][i]);
    const p = new Float64Array(K * K);
    for (let r = 0; r < K; r++) for (let c = 0; c < K; c++) p[r * K + c] = inv.inverse[r][c];
    const s0 = new Float64Array(K);
    const d = new Float64Array(K);
    for (let c = 0; c < K; c++) {
      s0[c] = means[c][a];
      d[c] = means[c][a + 1] - means[c][a];
    }
    const dp = new Float64Array(K);
    for (let c = 0; c < K; c++) for (let r = 0; r < K; r++) dp[c] += d[r] * p[r * K + c];
    let A = 0;
    for (let c = 0; c < K; c++) A += dp[c] * d[c];
    start.push(s0);
    precision.push(p);
    dirPrecision.push(dp);
    quadA[j] = A;
    const dx = gridX[a + 1] - gridX[a];
    coefficient[j] = Math.exp(Math.log(dx / length) - 0.5 * (K * Math.log(2 * Math.PI) + ld));
  }
  // Index on the first channel: the Mahalanobis distance is at least the distance in any one
  // channel over that channel's SD, so intervals beyond the reach there can be skipped.
  const reach = Math.sqrt(PRUNE_Q);
  const lower = new Float64Array(m);
  const upperBound = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    const a = means[0][startIndex + j];
    const b = means[0][startIndex + j + 1];
    const s = Math.sqrt(0.5 * (covariances[startIndex + j][0][0] + covariances[startIndex + j + 1][0][0]));
    lower[j] = Math.min(a, b) - reach * s;
    upperBound[j] = Math.max(a, b) + reach * s;
  }
  const index = intervalIndex(lower, upperBound);
  const rule = gaussHermite(nodesPerDimension);
  const q1 = rule.nodes.length;
  const total = q1 ** K;
  const outer = outerNodes(gridX, startIndex, endIndex, Float64Array.from(quadA, Math.sqrt));
  const r = new Float64Array(K);
  const g = new Float64Array(K);
  const t = new Float64Array(K);
  const mu = new Float64Array(K);
  let conditional = 0;
  let marginal = 0;
  for (let node = 0; node < outer.weight.length; node++) {
    const j = outer.interval[node];
    const u = outer.t[node];
    const a = startIndex + j;
    const cov: Matrix = covariances[a].map((row, rr) => row.map((v, c) => (1 - u) * v + u * covariances[a + 1][rr][c]));
    const l = cholesky(cov) as Matrix;
    let logDet = 0;
    for (let i = 0; i < K; i++) logDet += 2 * Math.log(l[i][i]);
    for (let c = 0; c < K; c++) mu[c] = (1 - u) * means[c][a] + u * means[c][a + 1];
    const weightX = outer.weight[node] / length;
    conditional += weightX * 0.5 * (K * Math.log2(2 * Math.PI * Math.E) + logDet * LOG2E);
    let expectation = 0;
    for (let tensor = 0; tensor < total; tensor++) {
      let rest = tensor;
      let weight = 1;
      for (let c = 0; c < K; c++) {
        const digit = rest % q1;
        rest = Math.floor(rest / q1);
        t[c] = Math.SQRT2 * rule.nodes[digit];
        weight *= rule.weights[digit] / Math.sqrt(Math.PI);
      }
      for (let c = 0; c < K; c++) {
        let s = mu[c];
        for (let e = 0; e <= c; e++) s += l[c][e] * t[e];
        g[c] = s;
      }
      let p = 0;
      for (let i = lastReaching(index, g[0]); i >= 0 && index.prefixMaxUpper[i] >= g[0]; i--) {
        if (index.upper[i] < g[0]) continue;
        const jj = index.order[i];
        const s0 = start[jj];
        const pj = precision[jj];
        for (let c = 0; c < K; c++) r[c] = g[c] - s0[c];
        let B = 0;
        let C = 0;
        for (let c = 0; c < K; c++) {
          B += dirPrecision[jj][c] * r[c];
          let pr = 0;
          for (let e = 0; e < K; e++) pr += pj[c * K + e] * r[e];
          C += r[c] * pr;
        }
        const A = quadA[jj];
        const t0 = A > 0 ? B / A : 0;
        const tStar = Math.min(1, Math.max(0, t0));
        const qMin = A * tStar * tStar - 2 * B * tStar + C;
        if (qMin > PRUNE_Q) continue;
        const rootA = Math.sqrt(A);
        let integral: number;
        if (rootA < 1e-3) integral = Math.exp(-0.5 * (A / 4 - B + C));
        else {
          const base = Math.max(0, C - B * t0);
          integral = Math.exp(-0.5 * base) * (Math.sqrt(2 * Math.PI) / rootA) * normalIntervalProbability(-rootA * t0, rootA * (1 - t0));
        }
        p += coefficient[jj] * integral;
      }
      expectation += weight * Math.log(Math.max(p, Number.MIN_VALUE)) * LOG2E;
    }
    marginal -= weightX * expectation;
  }
  return marginal - conditional;
}

/** Nodes of the outer x-integral: interval index, fraction t within it, trapezoid weight (grid units). */
interface OuterNodes {
  interval: Int32Array;
  t: Float64Array;
  weight: Float64Array;
}

/**
 * Trapezoid nodes for the outer integral over x: every grid point, plus sub-steps of σ_x/8 in
 * the intervals within 5 σ_x of either end of the region. There P(g) falls off over a few σ_x
 * and the integrand changes faster than a coarse grid resolves. `sigmaSteps[j]` is the change
 * of the mean over interval j in units of its SD (Mahalanobis for several channels), so σ_x is
 * the interval width divided by it.
 */
function outerNodes(gridX: ArrayLike<number>, startIndex: number, endIndex: number, sigmaSteps: Float64Array): OuterNodes {
  const m = endIndex - startIndex;
  const from = gridX[startIndex];
  const to = gridX[endIndex];
  const interval: number[] = [];
  const t: number[] = [];
  const position: number[] = [];
  for (let j = 0; j < m; j++) {
    const a = gridX[startIndex + j];
    const b = gridX[startIndex + j + 1];
    const steps = sigmaSteps[j];
    let sub = 1;
    if (steps > 0) {
      const sigmaX = (b - a) / steps;
      const nearEnd = a - from < EDGE_REACH_SIGMAS * sigmaX || to - b < EDGE_REACH_SIGMAS * sigmaX;
      if (nearEnd) sub = Math.min(MAX_SUBSTEPS, Math.max(1, Math.ceil(EDGE_STEPS_PER_SIGMA * steps)));
    }
    for (let i = 0; i < sub; i++) {
      interval.push(j);
      t.push(i / sub);
      position.push(a + ((b - a) * i) / sub);
    }
  }
  interval.push(m - 1);
  t.push(1);
  position.push(to);
  return { interval: Int32Array.from(interval), t: Float64Array.from(t), weight: trapezoidWeights(position) };
}

/**
 * Intervals [lower_j, upper_j] sorted by lower end, with the running maximum of the upper
 * ends: the intervals containing g are among those sorted before the first lower end above g,
 * and scanning them backwards can stop once the running maximum falls below g. For monotone
 * profiles this visits only the intervals near g.
 */
interface IntervalIndex {
  order: Int32Array;
  lower: Float64Array;
  upper: Float64Array;
  prefixMaxUpper: Float64Array;
}

function intervalIndex(lower: Float64Array, upper: Float64Array): IntervalIndex {
  const m = lower.length;
  const order = Int32Array.from({ length: m }, (_, j) => j).sort((a, b) => lower[a] - lower[b]);
  const sortedLower = Float64Array.from(order, (j) => lower[j]);
  const sortedUpper = Float64Array.from(order, (j) => upper[j]);
  const prefixMaxUpper = new Float64Array(m);
  let running = -Infinity;
  for (let i = 0; i < m; i++) {
    running = Math.max(running, sortedUpper[i]);
    prefixMaxUpper[i] = running;
  }
  return { order, lower: sortedLower, upper: sortedUpper, prefixMaxUpper };
}

/** Index of the last interval whose lower end is ≤ g (−1 if none), by binary search. */
function lastReaching(index: IntervalIndex, g: number): number {
  let lo = 0;
  let hi = index.lower.length;
  while (lo < hi) {
    const midpoint = (lo + hi) >> 1;
    if (index.lower[midpoint] <= g) lo = midpoint + 1;
    else hi = midpoint;
  }
  return lo - 1;
}
