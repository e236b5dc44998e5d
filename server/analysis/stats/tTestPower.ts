import { noncentralTCdf } from "./noncentralT.ts";
import { studentTQuantile } from "./studentT.ts";

/**
 * Power of the two-sided two-sample t-test (pooled variance) with n units per
 * group at level α, for a standardized effect d = δ/σ:
 * power = P(T > t_c) + P(T < −t_c), T ~ noncentral t(ν = 2n − 2, ncp = d·√(n/2)),
 * t_c = t_{1−α/2, ν}. Source: Cohen 1988, Statistical Power Analysis for the
 * Behavioral Sciences, ch. 2; noncentral t by Lenth 1989 (AS 243).
 */
export function twoSampleTTestPower(nPerGroup: number, standardizedEffect: number, alpha: number): number {
  if (!(nPerGroup >= 2)) throw new RangeError(`twoSampleTTestPower: needs at least 2 units per group, got ${nPerGroup}`);
  if (!(alpha > 0 && alpha < 1)) throw new RangeError(`twoSampleTTestPower: alpha must be in (0, 1), got ${alpha}`);
  const df = 2 * nPerGroup - 2;
  const ncp = standardizedEffect * Math.sqrt(nPerGroup / 2);
  const tc = studentTQuantile(1 - alpha / 2, df);
  return 1 - noncentralTCdf(tc, df, ncp) + noncentralTCdf(-tc, df, ncp);
}
