/** What the start of a profile looks like near the source. */
export interface SourcePlateau {
  /** "plateau": flat start; "dip": the intensity first rises, then falls; "none": it falls from the first point. */
  kind: "plateau" | "dip" | "none";
  /** Where a fit of a decaying model should start (µm); the first position when kind is "none". */
  startUm: number;
  /** Steepest local slope (a.u./µm, negative) and the slope at the first position, from local line fits. */
  steepestSlope: number;
  firstSlope: number;
}

/**
 * Detect a source plateau or dip: a start of the profile (x ascending) that is
 * flat or rising before the decay. Every decaying steady state fitted here
 * (exponential, finite, power law) is convex and falls most steeply at its
 * first point; a producing region of width s makes the profile concave for
 * x < s and turns it convex at x = s, where it falls most steeply (science.md
 * §1, localized source). So the start is taken at the steepest descent in the
 * source half of the profile, found from local least-squares line fits over a
 * window of ~1/12 of the points, and a plateau is declared only when that
 * point lies beyond the first window and the profile at its start falls at
 * less than half that rate. Beyond the steepest point the profile has the
 * shape of the fitted models, so the fit past it is unbiased [derived; checked
 * by simulation in test/analysis/fit/detectSourcePlateau.test.ts].
 */
export function detectSourcePlateau(x: ArrayLike<number>, y: ArrayLike<number>): SourcePlateau {
  const n = x.length;
  const none = (steepestSlope = NaN, firstSlope = NaN): SourcePlateau => ({ kind: "none", startUm: n > 0 ? x[0] : NaN, steepestSlope, firstSlope });
  if (n < 15) return none();
  const half = Math.max(2, Math.round(n / 24));
  const width = 2 * half + 1;
  const slopeAt = (centre: number): number => {
    const from = Math.min(Math.max(centre - half, 0), n - width);
    let sx = 0;
    let sy = 0;
    for (let i = from; i < from + width; i++) {
      sx += x[i];
      sy += y[i];
    }
    const mx = sx / width;
    const my = sy / width;
    let sxx = 0;
    let sxy = 0;
    for (let i = from; i < from + width; i++) {
      sxx += (x[i] - mx) ** 2;
      sxy += (x[i] - mx) * (y[i] - my);
    }
    return sxx > 0 ? sxy / sxx : NaN;
  };
  const midUm = x[0] + 0.5 * (x[n - 1] - x[0]);
  let steepest = half;
  let steepestSlope = Infinity;
  for (let i = half; i < n - half && x[i] <= midUm; i++) {
    const s = slopeAt(i);
    if (s < steepestSlope) {
      steepestSlope = s;
      steepest = i;
    }
  }
  const firstSlope = slopeAt(half);
  if (!(steepestSlope < 0) || !Number.isFinite(firstSlope)) return none(steepestSlope, firstSlope);
  if (steepest <= 2 * half || firstSlope < 0.5 * steepestSlope) return none(steepestSlope, firstSlope);
  // A dip: somewhere before the steepest point the profile stands above its first level.
  let peak = 0;
  for (let i = 0; i < steepest; i++) if (y[i] > y[peak]) peak = i;
  const kind = firstSlope > 0 || peak > half ? "dip" : "plateau";
  return { kind, startUm: x[steepest], steepestSlope, firstSlope };
}
