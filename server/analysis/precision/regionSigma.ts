import { digamma } from "../special/digamma.ts";
import { onNodes, type AnalysisRegion, type RegionNodes } from "./analysisRegion.ts";

/** σ_x on a region's integration nodes, with unreliable positions handled inside the region. */
export interface RegionSigma {
  /** σ_x at each node (grid units), every value finite and positive, or all NaN when nothing is usable. */
  sigma: Float64Array;
  /** Grid positions inside the region counted as carrying no positional information (σ_x set to the cap). */
  capped: number;
  /** Grid positions inside the region without spread across embryos (σ_c = 0), filled from their neighbours. */
  filled: number;
  /** The cap L/√(2πe) in grid units. */
  cap: number;
}

const SQRT_2PI_E = Math.sqrt(2 * Math.PI * Math.E);

/** Share of the region's positions the shared smoothing window must resolve. */
const REGION_RESOLVED_SHARE = 0.9;

export interface RegionSigmaRule {
  /** Slopes below this many standard errors count as unresolved (the mask rule). */
  minSlopeSnr: number;
  /** Number of embryos behind the SD. */
  embryos: number;
}

/** The mean slope and its standard error at one smoothing window (narrowest first). */
export interface SlopeEstimate {
  slope: ArrayLike<number>;
  slopeSe: ArrayLike<number>;
}

/**
 * E[ln s] − ln σ for the SD s of n Gaussian samples: ½[ψ((n−1)/2) − ln((n−1)/2)], since
 * (n−1)s²/σ² follows χ² with n−1 degrees of freedom and E[ln χ²_ν] = ψ(ν/2) + ln 2
 * (Johnson, Kotz, Balakrishnan 1994, Continuous Univariate Distributions, ch. 18). About −1/(2(n−1)):
 * −7% on σ at 8 embryos, −1.7% at 30. The slope's noise works the other way: for a slope estimate
 * with relative SE r, E[ln|ŝ|] ≈ ln|s| − r²/2 (delta method), so ln σ̂ is raised by r²/2; both are removed.
 */
export function logSdBias(embryos: number): number {
  const half = 0.5 * (embryos - 1);
  return 0.5 * (digamma(half) - Math.log(half));
}

/**
 * σ_x = σ_c/|dc̄/dx| (Gregor, Tank, Wieschaus, Bialek 2007, Cell) over the region, never
 * leaving a hole in it:
 * - the slope comes from the narrowest smoothing window that resolves (at least `minSlopeSnr`
 *   standard errors from zero) 90% of the region's positions, and at the remaining positions from
 *   the next wider window that resolves them (see slopeLevels.ts); with a model, the model's slope,
 *   provided some window resolves a slope there;
 * - where no window resolves the slope, or σ_x exceeds L/√(2πe), σ_x is set to L/√(2πe): a Gaussian
 *   of that SD is as uncertain as the uniform prior over the region (equal entropies), so the
 *   position adds no positional information — neither a negative contribution nor a spurious
 *   positive one from a slope that is mostly noise;
 * - where σ_c = 0 (e.g. a point pinned by min–max normalisation) σ_x is interpolated from the
 *   nearest usable neighbours, since σ_x = 0 would mean infinite information.
 * Each usable σ_x is corrected for the small-sample bias of its logarithm, which is what the
 * information integral and the geometric-mean headline average (see logSdBias). Then σ_x is
 * interpolated linearly onto the region's nodes (its exact ends and the grid points inside).
 */
export function regionSigma(
  sd: ArrayLike<number>,
  levels: readonly SlopeEstimate[],
  modelSlope: ArrayLike<number> | null,
  rule: RegionSigmaRule,
  region: AnalysisRegion,
  nodes: RegionNodes,
): RegionSigma {
  const sdFactor = Math.exp(-logSdBias(rule.embryos));
  const local = new Float64Array(sd.length).fill(NaN);
  const resolvedAt = (level: SlopeEstimate, k: number) => Math.abs(level.slope[k]) > rule.minSlopeSnr * level.slopeSe[k] && level.slope[k] !== 0;
  // One window for the whole region — the narrowest resolving 90% of it — so the choice hardly
  // depends on any one position's noise (choosing per position would favour slopes that came out steep).
  let first = levels.findIndex((level) => {
    let resolved = 0;
    for (let k = region.startIndex; k <= region.endIndex; k++) if (resolvedAt(level, k)) resolved++;
    return resolved >= REGION_RESOLVED_SHARE * (region.endIndex - region.startIndex + 1);
  });
  if (first < 0) first = levels.length - 1;
  for (let k = 0; k < sd.length; k++) {
    if (!(sd[k] > 0)) continue;
    local[k] = Infinity;
    for (const level of levels.slice(first)) {
      const s = Math.abs(level.slope[k]);
      if (!resolvedAt(level, k)) continue;
      if (modelSlope) local[k] = (sdFactor * sd[k]) / Math.abs(modelSlope[k]);
      else local[k] = (sdFactor * sd[k] * Math.exp(-0.5 * (level.slopeSe[k] / s) ** 2)) / s;
      break;
    }
  }
  return sigmaOnRegion(local, region, nodes);
}

/**
 * σ_x on the grid (Infinity where the slope is not resolved, NaN where there is no spread)
 * onto the region's nodes with the rules of regionSigma: capped at L/√(2πe), gaps filled.
 */
export function sigmaOnRegion(local: Float64Array, region: AnalysisRegion, nodes: RegionNodes): RegionSigma {
  const cap = region.length / SQRT_2PI_E;
  const lo = nodes.lower[0];
  const hi = Math.min(local.length - 1, nodes.lower[nodes.lower.length - 1] + 1);
  let capped = 0;
  let filled = 0;
  for (let k = lo; k <= hi; k++) {
    const inside = k >= region.startIndex && k <= region.endIndex;
    if (Number.isNaN(local[k])) {
      if (inside) filled++;
    } else if (local[k] >= cap) {
      local[k] = cap;
      if (inside) capped++;
    }
  }
  if (filled > 0 && !fillGaps(local, lo, hi)) return { sigma: new Float64Array(nodes.x.length).fill(NaN), capped, filled, cap };
  return { sigma: onNodes(nodes, local), capped, filled, cap };
}

/** Linear interpolation across NaN runs in [lo, hi]; ends take the nearest value. False when all are NaN. */
function fillGaps(v: Float64Array, lo: number, hi: number): boolean {
  let previous = -1;
  for (let k = lo; k <= hi; k++) {
    if (Number.isNaN(v[k])) continue;
    if (previous < 0) for (let j = lo; j < k; j++) v[j] = v[k];
    else for (let j = previous + 1; j < k; j++) v[j] = v[previous] + ((v[k] - v[previous]) * (j - previous)) / (k - previous);
    previous = k;
  }
  if (previous < 0) return false;
  for (let j = previous + 1; j <= hi; j++) v[j] = v[previous];
  return true;
}

/**
 * The headline positional error: the geometric mean of σ_x over the region,
 * exp((1/L)∫ln σ_x dx) by the trapezoid rule. It is the constant σ_x that carries the same
 * small-noise positional information over the region, I = log₂(L/(√(2πe)·σ)) (Tkačik, Dubuis,
 * Petkova, Gregor 2015, Genetics), so the two headline numbers always agree.
 */
export function effectiveSigma(x: ArrayLike<number>, sigma: ArrayLike<number>): number {
  const length = x[x.length - 1] - x[0];
  let integral = 0;
  for (let j = 0; j + 1 < x.length; j++) integral += 0.5 * (x[j + 1] - x[j]) * (Math.log(sigma[j]) + Math.log(sigma[j + 1]));
  return Math.exp(integral / length);
}
