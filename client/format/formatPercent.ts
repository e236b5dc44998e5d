/** A fraction in [0, 1] as a whole percentage: 0.4342 → "43%". */
export function formatPercent(fraction: number | null | undefined, decimals = 0): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return "\u2014";
  return `${(fraction * 100).toFixed(decimals)}%`;
}
