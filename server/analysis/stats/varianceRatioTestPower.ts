import { fCdf, fQuantile } from "./fDistribution.ts";

/**
 * Power of the two-sided F-test of equal variances with n normal units per
 * group when the true SD ratio is ρ: s²a/s²b ~ ρ²·F(n − 1, n − 1), so
 * power = 1 − F_cdf(F_{1−α/2}/ρ²) + F_cdf(F_{α/2}/ρ²).
 * Source: Snedecor & Cochran 1989, Statistical Methods, 8th ed., §6.12 (section recalled, not re-read).
 * The test is exact only for normal data; it is sensitive to heavy tails.
 */
export function varianceRatioTestPower(nPerGroup: number, sdRatio: number, alpha: number): number {
  if (!(nPerGroup >= 2)) throw new RangeError(`varianceRatioTestPower: needs at least 2 units per group, got ${nPerGroup}`);
  if (!(sdRatio > 0)) throw new RangeError(`varianceRatioTestPower: SD ratio must be > 0, got ${sdRatio}`);
  if (!(alpha > 0 && alpha < 1)) throw new RangeError(`varianceRatioTestPower: alpha must be in (0, 1), got ${alpha}`);
  const d = nPerGroup - 1;
  const r2 = sdRatio * sdRatio;
  const upper = fQuantile(1 - alpha / 2, d, d);
  const lower = fQuantile(alpha / 2, d, d);
  return 1 - fCdf(upper / r2, d, d) + fCdf(lower / r2, d, d);
}
