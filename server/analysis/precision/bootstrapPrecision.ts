import type { Random } from "../random/seededRandom.ts";
import { resampleIndices } from "../stats/bootstrap.ts";
import { onNodes, type AnalysisRegion, type RegionNodes } from "./analysisRegion.ts";
import { ensembleMoments } from "./ensembleMoments.ts";
import { gaussianInformation } from "./gaussianInformation.ts";
import { kernelInformation } from "./kernelInformation.ts";
import { positionalErrorCurve, type MaskRule } from "./positionalError.ts";
import type { ProgressCallback } from "./precisionOptions.ts";
import { effectiveSigma, regionSigma } from "./regionSigma.ts";
import { sigmaAt } from "./sigmaSummaries.ts";
import { levelEstimate, type SlopeLevel } from "./slopeLevels.ts";
import { smallNoiseInformation } from "./smallNoiseInformation.ts";

/** Everything one resample needs. Only the grid and the region are fixed; every quantity that depends on the data is recomputed. */
export interface BootstrapPlan {
  gridX: Float64Array;
  /** Profiles after normalisation, one per embryo. */
  values: readonly Float64Array[];
  /** Per-embryo Savitzky–Golay slopes at the base window (first) and wider ones; a resample's mean slope is their mean, their spread the slope's SE. */
  levels: readonly SlopeLevel[];
  /** Model slope: refitted to each resample's mean (`refit`), or held fixed (`fixed`); null for the Savitzky–Golay slope. */
  model: { refit: ((gridX: number[], mean: number[]) => ArrayLike<number> | null) | null; fixed: Float64Array } | null;
  mask: MaskRule;
  region: AnalysisRegion;
  nodes: RegionNodes;
  /** Each embryo's profile on the region's nodes (for the kernel-density estimate). */
  regionValues: readonly Float64Array[];
  positions: readonly number[];
  /** Each embryo's threshold-crossing position (null if none), and where σ_x is compared with their SD. */
  crossings: readonly (number | null)[] | null;
  boundaryAt: number | null;
  hermiteNodes: number;
  kernelDensity: boolean;
  /** Resamples that also compute the slow estimates, raw direct and kernel-density information (the first ones). */
  slowResamples: number;
}

/** Replicate statistics, one entry per resample (NaN where undefined in that resample). */
export interface BootstrapReplicates {
  resamples: number;
  /** sigmaX[k][b]: σ_x at grid point k in resample b (NaN where that resample masks it). */
  sigmaX: Float64Array[];
  /** Geometric mean of σ_x over the region (the headline). */
  effectiveSigma: Float64Array;
  atPositions: Float64Array[];
  boundarySd: Float64Array;
  sigmaAtBoundary: Float64Array;
  smallNoise: Float64Array;
  direct: Float64Array;
  kernelDensity: Float64Array;
}

/**
 * Bootstrap over embryos: each resample draws n whole embryos with replacement,
 * so correlations along the axis within an embryo are kept (Efron & Tibshirani 1993, ch. 6),
 * and recomputes the mean, SD, slope (refitting a model slope when a refit is given), the slope's
 * standard error, the mask and σ_x, and every summary from them, on the same stated region.
 */
export function bootstrapPrecision(plan: BootstrapPlan, resamples: number, random: Random, onProgress?: ProgressCallback, progressSpan: [number, number] = [0, 1]): BootstrapReplicates {
  const g = plan.gridX.length;
  const n = plan.values.length;
  const out: BootstrapReplicates = {
    resamples,
    sigmaX: Array.from({ length: g }, () => new Float64Array(resamples)),
    effectiveSigma: new Float64Array(resamples),
    atPositions: plan.positions.map(() => new Float64Array(resamples)),
    boundarySd: new Float64Array(resamples),
    sigmaAtBoundary: new Float64Array(resamples),
    smallNoise: new Float64Array(resamples),
    direct: new Float64Array(Math.min(resamples, plan.slowResamples)),
    kernelDensity: new Float64Array(Math.min(resamples, plan.kernelDensity ? plan.slowResamples : 0)),
  };
  const last = plan.nodes.x.length - 1;
  const gridList = Array.from(plan.gridX);
  const every = Math.max(1, Math.floor(resamples / 100));
  for (let b = 0; b < resamples; b++) {
    const idx = resampleIndices(n, random);
    const moments = ensembleMoments(plan.values, idx);
    const estimates = plan.levels.map((l) => levelEstimate(l, idx));
    const slopeSe = estimates[0].slopeSe;
    let slope: ArrayLike<number> | null = estimates[0].slope;
    if (plan.model) slope = plan.model.refit ? plan.model.refit(gridList, Array.from(moments.mean)) : plan.model.fixed;
    if (slope === null) {
      fillNaN(out, b);
      continue;
    }
    const curve = positionalErrorCurve(plan.gridX, moments.sd, slope, slopeSe, plan.mask);
    for (let k = 0; k < g; k++) out.sigmaX[k][b] = curve.sigmaX[k];
    const sigma = regionSigma(moments.sd, estimates, plan.model ? slope : null, { minSlopeSnr: plan.mask.minSlopeSnr, embryos: n }, plan.region, plan.nodes).sigma;
    out.effectiveSigma[b] = effectiveSigma(plan.nodes.x, sigma);
    out.smallNoise[b] = smallNoiseInformation(plan.nodes.x, sigma, 0, last);
    if (b < out.direct.length) out.direct[b] = gaussianInformation(plan.nodes.x, onNodes(plan.nodes, moments.mean), onNodes(plan.nodes, moments.sd), 0, last, plan.hermiteNodes);
    if (b < out.kernelDensity.length)
      out.kernelDensity[b] = kernelInformation(plan.nodes.x, plan.regionValues, 0, last, idx);
    plan.positions.forEach((x, p) => (out.atPositions[p][b] = sigmaAt(plan.gridX, curve.sigmaX, x)));
    out.boundarySd[b] = plan.crossings ? crossingSd(plan.crossings, idx) : NaN;
    out.sigmaAtBoundary[b] = plan.boundaryAt === null ? NaN : sigmaAt(plan.gridX, curve.sigmaX, plan.boundaryAt);
    if (onProgress && (b + 1) % every === 0)
      onProgress(progressSpan[0] + ((progressSpan[1] - progressSpan[0]) * (b + 1)) / resamples, "bootstrap");
  }
  return out;
}

function fillNaN(out: BootstrapReplicates, b: number): void {
  for (const row of out.sigmaX) row[b] = NaN;
  for (const row of out.atPositions) row[b] = NaN;
  out.effectiveSigma[b] = out.smallNoise[b] = out.boundarySd[b] = out.sigmaAtBoundary[b] = NaN;
  if (b < out.direct.length) out.direct[b] = NaN;
  if (b < out.kernelDensity.length) out.kernelDensity[b] = NaN;
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
