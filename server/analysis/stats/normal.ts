import { erfc } from "../special/errorFunction.ts";

/** Standard normal cumulative distribution Φ(z) = ½ erfc(−z/√2). */
export function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

/** Standard normal density φ(z). */
export function normalPdf(z: number): number {
  return Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
}

/**
 * Standard normal quantile Φ⁻¹(p): bisection to a bracket, then Newton steps
 * on Φ(z) − p, which converge to full double precision.
 */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) {
    if (p === 0) return -Infinity;
    if (p === 1) return Infinity;
    throw new RangeError(`normalQuantile: p must be in [0, 1], got ${p}`);
  }
  let lo = -40;
  let hi = 40;
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (normalCdf(mid) < p) lo = mid;
    else hi = mid;
    if (hi - lo < 1e-6) break;
  }
  let z = 0.5 * (lo + hi);
  for (let i = 0; i < 8; i++) {
    // Newton on the smaller tail, which keeps full relative accuracy far from the median.
    const next = p < 0.5
      ? z - (normalCdf(z) - p) / normalPdf(z)
      : z + (normalCdf(-z) - (1 - p)) / normalPdf(z);
    const done = Math.abs(next - z) < 1e-15 * Math.max(1, Math.abs(z));
    z = next;
    if (done) break;
  }
  return z;
}
