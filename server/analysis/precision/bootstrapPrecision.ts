import type { Random } from "../random/seededRandom.ts";
import { resampleIndices } from "../stats/bootstrap.ts";
import type { AnalysisRegion } from "./analysisRegion.ts";
import { ensembleMoments, rowMean } from "./ensembleMoments.ts";
import { gaussianInformation } from "./gaussianInformation.ts";
import { kernelInformation } from "./kernelInformation.ts";
import { sigmaXFromSlope } from "./positionalError.ts";
import type { ProgressCallback } from "./precisionOptions.ts";
import { meanSigma, minimumSigma, sigmaAt } from "./sigmaSummaries.ts";
import { smallNoiseInformation } from "./smallNoiseInformation.ts";

/** Everything one resample needs, fixed from the full-data analysis. */
export interface BootstrapPlan {
  gridX: Float64Array;
  /** Profiles after normalisation, one per embryo. */
  values: readonly Float64Array[];
  /** Per-embryo Savitzky–Golay slopes; the resampled mean slope is their mean. */
  embryoSlopes: readonly Float64Array[];
  /** A model slope held fixed in every resample (its own uncertainty is not included), or null. */
  modelSlope: Float64Array | null;
  /** Positions masked in the full-data analysis stay masked in every resample. */
  masked: readonly boolean[];
  region: AnalysisRegion | null;
  positions: readonly number[];
  /** Each embryo's threshold-crossing position (null if none), and where σ_x is compared with their SD. */
  crossings: readonly (number | null)[] | null;
  boundaryAt: number | null;
  hermiteNodes: number;
  kernelDensity: boolean;
  /** Resamples that also compute the slow kernel-density estimate (the first ones). */
  slowResamples: number;
}

/** Replicate statistics, one entry per resample (NaN where undefined in that resample). */
export interface BootstrapReplicates {
  resamples: number;
  /** sigmaX[k][b]: σ_x at grid point k in resample b. */
  sigmaX: Float64Array[];
  minimum: Float64Array;
  minimumPosition: Float64Array;
  atPositions: Float64Array[];
  meanSigma: Float64Array;
  boundarySd: Float64Array;
  sigmaAtBoundary: Float64Array;
  smallNoise: Float64Array;
  direct: Float64Array;
  kernelDensity: Float64Array;
}

/**
 * Bootstrap over embryos: each resample draws n whole embryos with replacement,
 * so correlations along the axis within an embryo are kept (Efron & Tibshirani 1993, ch. 6),
 * and recomputes σ_x and every summary from them.
 */
export function bootstrapPrecision(plan: BootstrapPlan, resamples: number, random: Random, onProgress?: ProgressCallback, progressSpan: [number, number] = [0, 1]): BootstrapReplicates {
  const g = plan.gridX.length;
  const n = plan.values.length;
  const out: BootstrapReplicates = {
    resamples,
    sigmaX: Array.from({ length: g }, () => new Float64Array(resamples)),
    minimum: new Float64Array(resamples),
    minimumPosition: new Float64Array(resamples),
    atPositions: plan.positions.map(() => new Float64Array(resamples)),
    meanSigma: new Float64Array(resamples),
    boundarySd: new Float64Array(resamples),
    sigmaAtBoundary: new Float64Array(resamples),
    smallNoise: new Float64Array(resamples),
    direct: new Float64Array(resamples),
    kernelDensity: new Float64Array(Math.min(resamples, plan.kernelDensity ? plan.slowResamples : 0)),
  };
  const sigma = new Float64Array(g);
  const every = Math.max(1, Math.floor(resamples / 100));
  for (let b = 0; b < resamples; b++) {
    const idx = resampleIndices(n, random);
    const moments = ensembleMoments(plan.values, idx);
    const slope = plan.modelSlope ?? rowMean(plan.embryoSlopes, idx);
    sigmaXFromSlope(moments.sd, slope, sigma);
    for (let k = 0; k < g; k++) {
      if (plan.masked[k] || !(sigma[k] > 0) || !Number.isFinite(sigma[k])) sigma[k] = NaN;
      out.sigmaX[k][b] = sigma[k];
    }
    const region = plan.region;
    if (region) {
      const min = minimumSigma(sigma, region.startIndex, region.endIndex);
      out.minimum[b] = min.value;
      out.minimumPosition[b] = min.index >= 0 ? plan.gridX[min.index] : NaN;
      out.meanSigma[b] = meanSigma(plan.gridX, sigma, region.startIndex, region.endIndex);
      out.smallNoise[b] = smallNoiseInformation(plan.gridX, sigma, region.startIndex, region.endIndex);
      out.direct[b] = gaussianInformation(plan.gridX, moments.mean, moments.sd, region.startIndex, region.endIndex, plan.hermiteNodes);
      if (b < out.kernelDensity.length) out.kernelDensity[b] = kernelInformation(plan.gridX, plan.values, region.startIndex, region.endIndex, idx);
    } else {
      out.minimum[b] = out.minimumPosition[b] = out.meanSigma[b] = out.smallNoise[b] = out.direct[b] = NaN;
    }
    plan.positions.forEach((x, p) => (out.atPositions[p][b] = sigmaAt(plan.gridX, sigma, x)));
    out.boundarySd[b] = plan.crossings ? crossingSd(plan.crossings, idx) : NaN;
    out.sigmaAtBoundary[b] = plan.boundaryAt === null ? NaN : sigmaAt(plan.gridX, sigma, plan.boundaryAt);
    if (onProgress && (b + 1) % every === 0)
      onProgress(progressSpan[0] + ((progressSpan[1] - progressSpan[0]) * (b + 1)) / resamples, "bootstrap");
  }
  return out;
}

function crossingSd(crossings: readonly (number | null)[], idx: ArrayLike<number>): number {
  let count = 0;
  let sum = 0;
  let squares = 0;
  for (let r = 0; r < idx.length; r++) {
    const v = crossings[idx[r]];
    if (v === null) continue;
    count += 1;
    sum += v;
    squares += v * v;
  }
  if (count < 2) return NaN;
  const mean = sum / count;
  return Math.sqrt(Math.max(0, (squares - count * mean * mean) / (count - 1)));
}
