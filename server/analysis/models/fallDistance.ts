/** Where a decaying profile has fallen to a given fraction of its height. */
export interface FallDistance {
  /** Position of the highest point (µm). */
  peakUm: number;
  /** Distance from the peak to where (y − floor) first drops to `fraction`·(peak − floor) (µm). */
  distanceUm: number;
}

/**
 * Distance from the peak to the first point where the profile, measured
 * above its lowest value, has dropped to `fraction` of its height, linearly
 * interpolated between samples. A rough, noise-sensitive start for the
 * fitter, not an estimate. x must be ascending. Returns null when the
 * profile never falls that far after its peak (flat or rising).
 */
export function fallDistance(x: ArrayLike<number>, y: ArrayLike<number>, fraction: number): FallDistance | null {
  const n = x.length;
  if (n < 2) return null;
  let iPeak = 0;
  let floor = y[0];
  for (let i = 1; i < n; i++) {
    if (y[i] > y[iPeak]) iPeak = i;
    if (y[i] < floor) floor = y[i];
  }
  const height = y[iPeak] - floor;
  if (!(height > 0)) return null;
  const target = floor + fraction * height;
  for (let i = iPeak + 1; i < n; i++) {
    if (y[i] <= target) {
      const t = (y[i - 1] - target) / (y[i - 1] - y[i]);
      const xCross = x[i - 1] + (Number.isFinite(t) ? t : 1) * (x[i] - x[i - 1]);
      const distanceUm = xCross - x[iPeak];
      return distanceUm > 0 ? { peakUm: x[iPeak], distanceUm } : null;
    }
  }
  return null;
}
