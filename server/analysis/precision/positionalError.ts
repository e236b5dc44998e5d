/**
 * Why a grid position has no positional error:
 * - "no-variance": σ_c = 0, e.g. a position pinned by min–max normalisation; σ_x = 0 would be an artefact;
 * - "shallow-slope": |dc̄/dx| is below minSlopeSnr standard errors of the data's slope — the data cannot tell the slope from zero;
 * - "imprecise": σ_x exceeds maxSigmaFraction of the grid's span — too large to locate anything.
 */
export type MaskReason = "no-variance" | "shallow-slope" | "imprecise";

export interface MaskRule {
  minSlopeSnr: number;
  maxSigmaFraction: number;
}

export interface PositionalErrorCurve {
  /** σ_x at each grid position in grid units; NaN where masked. */
  sigmaX: Float64Array;
  mask: (MaskReason | null)[];
}

/**
 * Positional error σ_x(x) = σ_c(x)/|dc̄/dx|: how far apart two positions must
 * be for their concentrations to differ by one across-embryo SD.
 * Source: Gregor, Tank, Wieschaus, Bialek 2007, Cell.
 */
export function sigmaXFromSlope(sd: ArrayLike<number>, slope: ArrayLike<number>, out = new Float64Array(sd.length)): Float64Array {
  for (let k = 0; k < sd.length; k++) out[k] = sd[k] / Math.abs(slope[k]);
  return out;
}

/** σ_x with the masking rules applied (see {@link MaskReason}). */
export function positionalErrorCurve(
  gridX: ArrayLike<number>,
  sd: ArrayLike<number>,
  slope: ArrayLike<number>,
  slopeSe: ArrayLike<number>,
  rule: MaskRule,
): PositionalErrorCurve {
  const g = gridX.length;
  const span = gridX[g - 1] - gridX[0];
  const sigmaX = sigmaXFromSlope(sd, slope);
  const mask: (MaskReason | null)[] = new Array(g).fill(null);
  for (let k = 0; k < g; k++) {
    if (!(sd[k] > 0)) mask[k] = "no-variance";
    else if (!(Math.abs(slope[k]) > rule.minSlopeSnr * slopeSe[k]) || slope[k] === 0) mask[k] = "shallow-slope";
    else if (!(sigmaX[k] <= rule.maxSigmaFraction * span)) mask[k] = "imprecise";
    if (mask[k] !== null) sigmaX[k] = NaN;
  }
  return { sigmaX, mask };
}
