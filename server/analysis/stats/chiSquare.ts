import { lowerIncompleteGamma, upperIncompleteGamma } from "../special/incompleteGamma.ts";

/** Chi-square CDF with ν degrees of freedom: P(ν/2, x/2). Source: Abramowitz & Stegun 26.4.19. */
export function chiSquareCdf(x: number, df: number): number {
  if (!(df > 0)) throw new RangeError(`chiSquareCdf: degrees of freedom must be > 0, got ${df}`);
  if (x <= 0) return 0;
  if (x === Infinity) return 1;
  return lowerIncompleteGamma(df / 2, x / 2);
}

/**
 * Chi-square quantile: bracket, then bisection on whichever tail is smaller
 * (keeps precision for p near 0 or 1), to ~1e-13 relative.
 */
export function chiSquareQuantile(p: number, df: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`chiSquareQuantile: p must be in (0, 1), got ${p}`);
  if (!(df > 0)) throw new RangeError(`chiSquareQuantile: degrees of freedom must be > 0, got ${df}`);
  const upper = p > 0.5;
  const target = upper ? 1 - p : p;
  const tail = (x: number): number => (upper ? upperIncompleteGamma(df / 2, x / 2) : lowerIncompleteGamma(df / 2, x / 2));
  let lo = 0;
  let hi = Math.max(1, df);
  // The lower tail grows and the upper tail shrinks with x: expand until the target is bracketed.
  while (upper ? tail(hi) > target : tail(hi) < target) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) return Infinity;
  }
  for (let i = 0; i < 400; i++) {
    const mid = 0.5 * (lo + hi);
    const below = upper ? tail(mid) > target : tail(mid) < target;
    if (below) lo = mid;
    else hi = mid;
    if (hi - lo <= 1e-14 * hi) break;
  }
  return 0.5 * (lo + hi);
}
