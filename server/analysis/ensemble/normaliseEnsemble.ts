import { acrossEmbryoVariance, varianceStep, type VarianceStep } from "./acrossEmbryoVariance.ts";

/**
 * Per-embryo intensity normalisation:
 * - "none": intensities as measured;
 * - "minmax": each embryo mapped to [0, 1] by its own minimum and maximum on the grid;
 * - "scale-offset": each embryo modelled as c_i(x) = a_i·m(x) + b_i with m the
 *   group mean of the normalised profiles, a_i and b_i by least squares, iterated
 *   to a fixed point with mean(a) = 1 and mean(b) = 0, so the group mean stays put.
 *   Removes imaging-intensity differences (gain, background) but keeps shape differences.
 * Per-embryo normalisation also removes real amplitude variation and can understate
 * σ_x (Gregor et al. 2007, Cell); every result states which method was used.
 */
export type NormalisationMethod = "none" | "minmax" | "scale-offset";

export interface EmbryoNormalisation {
  embryo: string;
  /** Divisor applied to the embryo (a_i, or max − min); 1 for "none". */
  scale: number;
  /** Offset subtracted before dividing (b_i, or the minimum); 0 for "none". */
  offset: number;
  /** RMS deviation of the normalised profile from the normalised group mean. */
  residualRms: number;
}

export interface NormalisationResult {
  method: NormalisationMethod;
  /** False when the method could not be applied; values are then as measured and `reason` says why. */
  applied: boolean;
  reason: string | null;
  values: Float64Array[];
  perEmbryo: EmbryoNormalisation[];
  /** Fixed-point iterations used ("scale-offset" only; 0 otherwise). */
  iterations: number;
  converged: boolean;
  variance: VarianceStep;
}

export interface NormaliseSettings {
  /** Convergence: largest change of any a_i (and of b_i relative to the mean's range) between iterations. */
  tolerance?: number;
  maxIterations?: number;
}

export function normaliseEnsemble(
  embryos: readonly string[],
  values: readonly Float64Array[],
  method: NormalisationMethod,
  settings: NormaliseSettings = {},
): NormalisationResult {
  if (values.length < 2) throw new RangeError(`normaliseEnsemble: needs at least 2 embryos, got ${values.length}`);
  const before = acrossEmbryoVariance(values);
  const unchanged = (reason: string | null): NormalisationResult => {
    const copy = values.map((v) => Float64Array.from(v));
    return {
      method,
      applied: reason === null,
      reason,
      values: copy,
      perEmbryo: withResiduals(embryos, copy, copy.map(() => 1), copy.map(() => 0)),
      iterations: 0,
      converged: reason === null,
      variance: varianceStep("normalisation", before, before),
    };
  };
  if (method === "none") return unchanged(null);
  if (method === "minmax") {
    const scale: number[] = [];
    const offset: number[] = [];
    for (let i = 0; i < values.length; i++) {
      let lo = Infinity, hi = -Infinity;
      for (const v of values[i]) {
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
      if (!(hi > lo)) return unchanged(`embryo "${embryos[i]}" is constant on the grid, so min–max scaling is undefined`);
      scale.push(hi - lo);
      offset.push(lo);
    }
    const out = values.map((v, i) => Float64Array.from(v, (c) => (c - offset[i]) / scale[i]));
    return finish(embryos, out, scale, offset, 0, true, before, method);
  }
  return scaleOffset(embryos, values, settings, before, unchanged);
}

function scaleOffset(
  embryos: readonly string[],
  values: readonly Float64Array[],
  settings: NormaliseSettings,
  before: ReturnType<typeof acrossEmbryoVariance>,
  unchanged: (reason: string) => NormalisationResult,
): NormalisationResult {
  const tolerance = settings.tolerance ?? 1e-13;
  const maxIterations = settings.maxIterations ?? 1000;
  const n = values.length;
  const g = values[0].length;
  let reference = meanProfile(values);
  let a = new Array<number>(n).fill(1);
  let b = new Array<number>(n).fill(0);
  let normalised = values.map((v) => Float64Array.from(v));
  let converged = false;
  let iterations = 0;
  for (iterations = 1; iterations <= maxIterations; iterations++) {
    let mRef = 0;
    for (let k = 0; k < g; k++) mRef += reference[k];
    mRef /= g;
    let vRef = 0;
    let lo = Infinity, hi = -Infinity;
    for (let k = 0; k < g; k++) {
      vRef += (reference[k] - mRef) ** 2;
      lo = Math.min(lo, reference[k]);
      hi = Math.max(hi, reference[k]);
    }
    if (!(vRef > 0)) return unchanged("the group mean profile is flat, so scale and offset cannot be separated from shape");
    // Least-squares line of each embryo on the reference: c_i ≈ a_i·m + b_i.
    const nextA = new Array<number>(n);
    const nextB = new Array<number>(n);
    for (let i = 0; i < n; i++) {
      let mc = 0;
      for (let k = 0; k < g; k++) mc += values[i][k];
      mc /= g;
      let cov = 0;
      for (let k = 0; k < g; k++) cov += (values[i][k] - mc) * (reference[k] - mRef);
      nextA[i] = cov / vRef;
      nextB[i] = mc - nextA[i] * mRef;
    }
    // Fix the gauge (m → s·m + t leaves the model unchanged): mean(a) = 1 and mean(b) = 0.
    const s = nextA.reduce((p, q) => p + q, 0) / n;
    const t = nextB.reduce((p, q) => p + q, 0) / n;
    if (!(s > 0)) return unchanged("the fitted scales average to ≤ 0: most embryos do not resemble the group mean");
    for (let i = 0; i < n; i++) {
      nextA[i] /= s;
      nextB[i] -= nextA[i] * t;
      if (!(nextA[i] > 0))
        return unchanged(`embryo "${embryos[i]}" has a fitted scale ≤ 0 (it does not resemble the group mean); flip or exclude it`);
    }
    normalised = values.map((v, i) => Float64Array.from(v, (c) => (c - nextB[i]) / nextA[i]));
    const nextReference = meanProfile(normalised);
    const span = hi - lo;
    let change = 0;
    for (let i = 0; i < n; i++) change = Math.max(change, Math.abs(nextA[i] - a[i]), Math.abs(nextB[i] - b[i]) / span);
    a = nextA;
    b = nextB;
    reference = nextReference;
    if (change < tolerance) {
      converged = true;
      break;
    }
  }
  return finish(embryos, normalised, a, b, Math.min(iterations, maxIterations), converged, before, "scale-offset");
}

function finish(
  embryos: readonly string[],
  out: Float64Array[],
  scale: number[],
  offset: number[],
  iterations: number,
  converged: boolean,
  before: ReturnType<typeof acrossEmbryoVariance>,
  method: NormalisationMethod,
): NormalisationResult {
  return {
    method,
    applied: true,
    reason: converged ? null : `the scale–offset fit did not converge in ${iterations} iterations`,
    values: out,
    perEmbryo: withResiduals(embryos, out, scale, offset),
    iterations,
    converged,
    variance: varianceStep("normalisation", before, acrossEmbryoVariance(out)),
  };
}

function meanProfile(values: readonly Float64Array[]): Float64Array {
  const g = values[0].length;
  const m = new Float64Array(g);
  for (const v of values) for (let k = 0; k < g; k++) m[k] += v[k];
  for (let k = 0; k < g; k++) m[k] /= values.length;
  return m;
}

function withResiduals(embryos: readonly string[], out: readonly Float64Array[], scale: number[], offset: number[]): EmbryoNormalisation[] {
  const m = meanProfile(out);
  return embryos.map((embryo, i) => {
    let ss = 0;
    for (let k = 0; k < m.length; k++) ss += (out[i][k] - m[k]) ** 2;
    return { embryo, scale: scale[i], offset: offset[i], residualRms: Math.sqrt(ss / m.length) };
  });
}
