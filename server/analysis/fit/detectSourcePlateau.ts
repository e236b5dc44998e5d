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
 * §1, localized source). So the profile's local slopes are taken from
 * least-squares lines over windows of ~1/12 of the points (at least 7), and
 * a plateau or dip is declared when, in the source half of the profile, the
 * steepest descent lies beyond the first window and the first window falls
 * at under 0.7 of that rate — clearly, by 3 standard errors of the two
 * slopes, since the steepest of many noisy slopes is a selected extreme.
 * The fit then starts at the end of the steepest window: past it the profile
 * has the convex shape of the fitted models, so the fit is unbiased, at the
 * cost of a few points [derived; checked by simulation in
 * test/analysis/fit/detectSourcePlateau.test.ts].
 */
export function detectSourcePlateau(x: ArrayLike<number>, y: ArrayLike<number>): SourcePlateau {
  const n = x.length;
  const none = (steepestSlope = NaN, firstSlope = NaN): SourcePlateau => ({ kind: "none", startUm: n > 0 ? x[0] : NaN, steepestSlope, firstSlope });
  if (n < 15) return none();
  const half = Math.max(3, Math.round(n / 25));
  const width = Math.min(2 * half + 1, n);
  const line = (centre: number): { slope: number; se: number } => {
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
    const slope = sxx > 0 ? sxy / sxx : NaN;
    let rss = 0;
    for (let i = from; i < from + width; i++) rss += (y[i] - my - slope * (x[i] - mx)) ** 2;
    return { slope, se: Math.sqrt(rss / (width - 2) / sxx) };
  };
  const midUm = x[0] + 0.5 * (x[n - 1] - x[0]);
  let steepest = half;
  let best = { slope: Infinity, se: NaN };
  for (let i = half; i < n - half && x[i] <= midUm; i++) {
    const fit = line(i);
    if (fit.slope < best.slope) {
      best = fit;
      steepest = i;
    }
  }
  const first = line(half);
  if (!(best.slope < 0) || !Number.isFinite(first.slope)) return none(best.slope, first.slope);
  // The steepest of many noisy local slopes is selected, so ask for a clear difference (3 SE) besides a halved rate.
  const clearlyFlatter = first.slope - best.slope > 3 * Math.hypot(first.se, best.se);
  if (steepest <= half || first.slope < 0.7 * best.slope || !clearlyFlatter) return none(best.slope, first.slope);
  // A dip: the first window rises, or before the steepest point a running mean over `half` points stands
  // clearly (3 SE) above the first one; the noise SD from second differences (robust to the curvature).
  const secondDifferences: number[] = [];
  for (let i = 1; i + 1 < Math.min(n, steepest + width); i++) secondDifferences.push(Math.abs(y[i + 1] - 2 * y[i] + y[i - 1]));
  secondDifferences.sort((a, b) => a - b);
  const noiseSd = secondDifferences[secondDifferences.length >> 1] / (0.6745 * Math.sqrt(6));
  const runningMean = (from: number) => {
    let sum = 0;
    for (let i = from; i < from + half; i++) sum += y[i];
    return sum / half;
  };
  const start = runningMean(0);
  let peak = start;
  for (let i = 1; i + half <= steepest; i++) peak = Math.max(peak, runningMean(i));
  const dip = first.slope > 0 || peak - start > (3 * noiseSd * Math.SQRT2) / Math.sqrt(half);
  // Start at the end of the steepest window: a broad steepest stretch (a rounded source region) is then passed safely.
  const startIndex = Math.min(steepest + half, n - 1);
  return { kind: dip ? "dip" : "plateau", startUm: x[startIndex], steepestSlope: best.slope, firstSlope: first.slope };
}

