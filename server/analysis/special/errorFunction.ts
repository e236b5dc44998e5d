import { lowerIncompleteGamma, upperIncompleteGamma } from "./incompleteGamma.ts";

/**
 * erf and erfc through the incomplete gamma function:
 * erf(x) = P(½, x²), erfc(x) = Q(½, x²) for x ≥ 0. Source: Abramowitz & Stegun 7.1.2, 6.5.16.
 */
export function erf(x: number): number {
  if (Number.isNaN(x)) return NaN;
  const v = lowerIncompleteGamma(0.5, x * x);
  return x < 0 ? -v : v;
}

export function erfc(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x < 0) return 2 - upperIncompleteGamma(0.5, x * x);
  return upperIncompleteGamma(0.5, x * x);
}

/**
 * Scaled complementary error function erfcx(x) = e^{x²} erfc(x), finite for large x
 * where erfc underflows. For x > 5 uses the Laplace continued fraction
 * erfc(x) = e^{−x²}/√π · 1/(x + ½/(x + 1/(x + 3/2/(x + …)))) (A&S 7.1.14).
 */
export function erfcx(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x < 5) return Math.exp(x * x) * erfc(x);
  let f = x;
  for (let n = 60; n >= 1; n--) f = x + n / 2 / f;
  return 1 / (Math.sqrt(Math.PI) * f);
}
