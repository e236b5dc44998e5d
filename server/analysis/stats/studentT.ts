import { incompleteBeta } from "../special/incompleteBeta.ts";
import { normalQuantile } from "./normal.ts";

/**
 * Student's t distribution with ν degrees of freedom (ν may be fractional, as
 * in Welch's test). CDF through the regularised incomplete beta function:
 * P(T ≤ t) = 1 − ½ I_{ν/(ν+t²)}(ν/2, ½) for t ≥ 0. Source: Abramowitz & Stegun 26.7.1.
 */
export function studentTCdf(t: number, df: number): number {
  if (!(df > 0)) throw new RangeError(`studentTCdf: degrees of freedom must be > 0, got ${df}`);
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const tail = 0.5 * incompleteBeta(df / (df + t * t), df / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/** Two-sided tail probability P(|T| ≥ |t|), computed directly to keep precision for tiny p. */
export function studentTTwoSidedP(t: number, df: number): number {
  if (!(df > 0)) throw new RangeError(`studentTTwoSidedP: degrees of freedom must be > 0, got ${df}`);
  if (!Number.isFinite(t)) return 0;
  return incompleteBeta(df / (df + t * t), df / 2, 0.5);
}

/** Quantile t_p(ν): bracketing then bisection/secant on the CDF to ~1e-13. */
export function studentTQuantile(p: number, df: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`studentTQuantile: p must be in (0, 1), got ${p}`);
  if (!(df > 0)) throw new RangeError(`studentTQuantile: degrees of freedom must be > 0, got ${df}`);
  if (p === 0.5) return 0;
  if (p < 0.5) return -studentTQuantile(1 - p, df);
  // p > 0.5: the answer is positive; bracket from the normal quantile upwards.
  let lo = 0;
  let hi = Math.max(1, normalQuantile(p));
  while (studentTCdf(hi, df) < p) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) return Infinity;
  }
  const upper = 1 - p;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    // Compare upper tails to avoid cancellation near p → 1.
    const tail = 0.5 * incompleteBeta(df / (df + mid * mid), df / 2, 0.5);
    if (tail > upper) lo = mid;
    else hi = mid;
    if (hi - lo <= 1e-14 * Math.max(1, hi)) break;
  }
  return 0.5 * (lo + hi);
}
