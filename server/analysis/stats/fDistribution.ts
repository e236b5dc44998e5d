import { incompleteBeta } from "../special/incompleteBeta.ts";

/**
 * CDF of Snedecor's F distribution with (d1, d2) degrees of freedom:
 * P(F ≤ x) = I_{d1·x/(d1·x + d2)}(d1/2, d2/2). Source: Abramowitz & Stegun 26.6.2.
 */
export function fCdf(x: number, d1: number, d2: number): number {
  if (!(d1 > 0 && d2 > 0)) throw new RangeError(`fCdf: degrees of freedom must be > 0, got ${d1} and ${d2}`);
  if (Number.isNaN(x)) throw new RangeError("fCdf: x is NaN");
  if (x <= 0) return 0;
  if (x === Infinity) return 1;
  return incompleteBeta((d1 * x) / (d1 * x + d2), d1 / 2, d2 / 2);
}

/** Quantile of the F distribution by bracketing and bisection on {@link fCdf} to ~1e-13 relative. */
export function fQuantile(p: number, d1: number, d2: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`fQuantile: p must be in (0, 1), got ${p}`);
  let lo = 0;
  let hi = 1;
  while (fCdf(hi, d1, d2) < p) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) return Infinity;
  }
  for (let i = 0; i < 400; i++) {
    const mid = 0.5 * (lo + hi);
    if (fCdf(mid, d1, d2) < p) lo = mid;
    else hi = mid;
    if (hi - lo <= 1e-13 * hi) break;
  }
  return 0.5 * (lo + hi);
}
