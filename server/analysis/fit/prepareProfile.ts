import type { ProfileExtent } from "../models/steadyStateModel.ts";
import type { ResolvedFitOptions } from "./fitOptions.ts";
import { acquireArrays, releaseArrays } from "./workspacePool.ts";

/** Per-profile facts the fit needs beside positions and intensities. */
export interface ProfileContext {
  /** Embryo length L (µm), needed by the finite model and optional for the source model. */
  lengthUm?: number;
  /** Variance of each intensity (a.u.²), needed for weights "inverse-variance". */
  variance?: ArrayLike<number>;
}

/** A profile reduced to the points a fit uses, ascending in x. */
export interface PreparedProfile {
  x: Float64Array;
  /** Intensities minus any fixed background. */
  y: Float64Array;
  /** Inverse-variance weights, or null for unit weights. */
  weights: Float64Array | null;
  extent: ProfileExtent;
  /** Points skipped because x, y (or the variance) were missing or not finite. */
  droppedNonFinite: number;
  /** Points outside the window. */
  outsideWindow: number;
  /** Every kept intensity is the same. */
  constant: boolean;
  /** The pooled arrays behind x, y and weights; hand them back with {@link releasePreparedProfile}. */
  arrays: Float64Array[];
}

export type PrepareOutcome = { ok: true; profile: PreparedProfile } | { ok: false; message: string };

/**
 * Select the points to fit: finite positions and intensities (and positive
 * finite variances for inverse-variance weights) inside the window, sorted
 * by position, fixed background subtracted. `range` (µm) overrides the
 * options' window, e.g. with ends resolved from the embryo length. Mismatched array lengths are a
 * programmer error and throw; everything a user can cause returns a message.
 */
export function prepareProfile(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  options: ResolvedFitOptions,
  context: ProfileContext = {},
  range: { minUm: number; maxUm: number } = { minUm: options.window?.xMinUm ?? -Infinity, maxUm: options.window?.xMaxUm ?? Infinity },
): PrepareOutcome {
  if (x.length !== y.length) throw new RangeError(`fit: x has ${x.length} values but y has ${y.length}`);
  const variance = context.variance;
  if (variance !== undefined && variance.length !== x.length)
    throw new RangeError(`fit: variance has ${variance.length} values but the profile has ${x.length}`);
  const useVariance = options.weights === "inverse-variance";
  if (useVariance && variance === undefined)
    return { ok: false, message: 'weights "inverse-variance" need a variance for every point, and none was supplied' };
  const lengthUm = context.lengthUm ?? null;
  if (lengthUm !== null && !(lengthUm > 0 && Number.isFinite(lengthUm)))
    return { ok: false, message: `the embryo length must be a positive number of µm, got ${lengthUm}` };

  const lo = range.minUm;
  const hi = range.maxUm;
  const offset = options.fixed.background ?? 0;
  const usable = (i: number) => {
    const v = useVariance && variance ? variance[i] : 1;
    return Number.isFinite(x[i]) && Number.isFinite(y[i]) && v > 0 && Number.isFinite(v);
  };
  const arrayCount = useVariance ? 3 : 2;
  let droppedNonFinite = 0;
  let outsideWindow = 0;

  // Usually every point is usable and already in order: copy in one pass and
  // fall back to selecting and sorting only when that turns out not to hold.
  let arrays = acquireArrays(x.length, arrayCount);
  let n = x.length;
  let clean = true;
  let lastX = -Infinity;
  for (let i = 0; i < x.length; i++) {
    const xi = x[i];
    if (!usable(i) || xi < lo || xi > hi || xi < lastX) {
      clean = false;
      break;
    }
    lastX = xi;
    arrays[0][i] = xi;
    arrays[1][i] = y[i] - offset;
    if (useVariance && variance) arrays[2][i] = 1 / variance[i];
  }
  if (!clean) {
    releaseArrays(arrays);
    const keep: number[] = [];
    let sorted = true;
    lastX = -Infinity;
    for (let i = 0; i < x.length; i++) {
      const xi = x[i];
      if (!usable(i)) droppedNonFinite++;
      else if (xi < lo || xi > hi) outsideWindow++;
      else {
        if (xi < lastX) sorted = false;
        lastX = xi;
        keep.push(i);
      }
    }
    if (!sorted) keep.sort((a, b) => x[a] - x[b] || a - b);
    n = keep.length;
    arrays = acquireArrays(n, arrayCount);
    for (let k = 0; k < n; k++) {
      const i = keep[k];
      arrays[0][k] = x[i];
      arrays[1][k] = y[i] - offset;
      if (useVariance && variance) arrays[2][k] = 1 / variance[i];
    }
  }
  const xs = arrays[0];
  const ys = arrays[1];
  const weights = useVariance ? arrays[2] : null;
  let constant = true;
  for (let k = 1; k < n; k++) if (ys[k] !== ys[0]) constant = false;
  let minSpacingUm = Infinity;
  for (let k = 1; k < n; k++) {
    const d = xs[k] - xs[k - 1];
    if (d > 0 && d < minSpacingUm) minSpacingUm = d;
  }
  if (n >= 2 && minSpacingUm === Infinity) {
    releaseArrays(arrays);
    return { ok: false, message: `all ${n} points share the position x = ${xs[0]} µm; a gradient needs distinct positions` };
  }
  const extent: ProfileExtent = {
    xMinUm: n > 0 ? xs[0] : 0,
    xMaxUm: n > 0 ? xs[n - 1] : 0,
    minSpacingUm: Number.isFinite(minSpacingUm) ? minSpacingUm : 1,
    lengthUm,
  };
  return { ok: true, profile: { x: xs, y: ys, weights, extent, droppedNonFinite, outsideWindow, constant, arrays } };
}

/** Give a prepared profile's arrays back to the pool once nothing reads them any more. */
export function releasePreparedProfile(profile: PreparedProfile): void {
  releaseArrays(profile.arrays);
}
