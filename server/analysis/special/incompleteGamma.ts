import { logGamma } from "./logGamma.ts";

/**
 * Regularised upper incomplete gamma Q(a, x) = Γ(a, x)/Γ(a): by series for
 * x < a + 1 and by continued fraction otherwise.
 * Source: Abramowitz & Stegun 6.5; Press et al., Numerical Recipes, §6.2.
 */
export function upperIncompleteGamma(a: number, x: number): number {
  if (!(a > 0)) throw new RangeError(`upperIncompleteGamma: a must be > 0, got ${a}`);
  if (!(x >= 0)) throw new RangeError(`upperIncompleteGamma: x must be ≥ 0, got ${x}`);
  if (x === 0) return 1;
  if (x < a + 1) return 1 - lowerSeries(a, x);
  return upperContinuedFraction(a, x);
}

/** Regularised lower incomplete gamma P(a, x) = 1 − Q(a, x). */
export function lowerIncompleteGamma(a: number, x: number): number {
  if (!(a > 0)) throw new RangeError(`lowerIncompleteGamma: a must be > 0, got ${a}`);
  if (!(x >= 0)) throw new RangeError(`lowerIncompleteGamma: x must be ≥ 0, got ${x}`);
  if (x === 0) return 0;
  if (x < a + 1) return lowerSeries(a, x);
  return 1 - upperContinuedFraction(a, x);
}

function lowerSeries(a: number, x: number): number {
  let ap = a;
  let del = 1 / a;
  let s = del;
  for (let n = 0; n < 100000; n++) {
    ap += 1;
    del *= x / ap;
    s += del;
    if (Math.abs(del) < Math.abs(s) * 1e-17) break;
  }
  return s * Math.exp(-x + a * Math.log(x) - logGamma(a));
}

function upperContinuedFraction(a: number, x: number): number {
  const tiny = 1e-300;
  let b = x + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 100000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) break;
  }
  return Math.exp(-x + a * Math.log(x) - logGamma(a)) * h;
}
