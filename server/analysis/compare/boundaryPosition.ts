import { firstCrossing } from "../precision/boundaryVariability.ts";
import { savitzkyGolay } from "../stats/savitzkyGolay.ts";

/** Points of the smoothing window used before looking for the crossing. */
export const BOUNDARY_SMOOTHING_POINTS = 7;

/**
 * What reading a profile at a threshold gave: a crossing position, or the
 * side on which the boundary lies outside the measured span. 'before_start':
 * the profile starts below the threshold (the boundary, if any, lies before
 * the first position — typically a low-amplitude embryo); 'beyond_end': it
 * never falls below it (the boundary lies beyond the last position).
 */
export type BoundaryReading =
  | { kind: "crossed"; positionUm: number }
  | { kind: "before_start" | "beyond_end"; limitUm: number };

/**
 * Where one measured profile first falls through a fixed intensity threshold,
 * read from the data (not from a model fit): the profile is smoothed with a
 * quadratic Savitzky–Golay filter over 7 points so that single noisy pixels do
 * not decide the crossing, then the first crossing from the source end is
 * interpolated linearly. A profile that never crosses says on which side of
 * the measured span its boundary lies, so that analyses can treat it as
 * censored rather than drop it (dropping the low-amplitude embryos biases the
 * mean boundary). Boundary defined as in Gregor et al. 2007, Cell.
 */
export function readBoundary(xUm: ArrayLike<number>, intensity: ArrayLike<number>, threshold: number): BoundaryReading {
  const smoothed = intensity.length >= BOUNDARY_SMOOTHING_POINTS ? savitzkyGolay(intensity, { windowPoints: BOUNDARY_SMOOTHING_POINTS, polynomialOrder: 2 }) : Float64Array.from(intensity);
  if (smoothed[0] < threshold) return { kind: "before_start", limitUm: xUm[0] };
  const x = firstCrossing(xUm, smoothed, threshold);
  return x === null ? { kind: "beyond_end", limitUm: xUm[xUm.length - 1] } : { kind: "crossed", positionUm: x };
}

/** The crossing position of {@link readBoundary}, or null when the profile never crosses the threshold. */
export function boundaryPosition(xUm: ArrayLike<number>, intensity: ArrayLike<number>, threshold: number): number | null {
  const r = readBoundary(xUm, intensity, threshold);
  return r.kind === "crossed" ? r.positionUm : null;
}

/**
 * Default threshold for comparing boundaries across groups: a quarter of the way
 * from the reference embryos' far-end level to their source-end level (means of the
 * smoothed profiles' last and first points). For an exponential gradient this sits
 * about 1.4 λ from the source, so lines with 0.5× to 4× the dosage all cross it
 * within the profile (Δx = λ·ln f). Common practice, no source.
 */
export function defaultBoundaryThreshold(profiles: readonly { intensity: ArrayLike<number> }[]): number {
  let near = 0;
  let far = 0;
  for (const p of profiles) {
    const s = p.intensity.length >= BOUNDARY_SMOOTHING_POINTS ? savitzkyGolay(p.intensity, { windowPoints: BOUNDARY_SMOOTHING_POINTS, polynomialOrder: 2 }) : Float64Array.from(p.intensity);
    near += s[0];
    far += s[s.length - 1];
  }
  near /= profiles.length;
  far /= profiles.length;
  return far + (near - far) / 4;
}
