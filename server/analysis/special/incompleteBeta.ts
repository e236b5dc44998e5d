import { logGamma } from "./logGamma.ts";

/**
 * Regularised incomplete beta function I_x(a, b), by its continued fraction
 * evaluated with the modified Lentz method, using the symmetry
 * I_x(a,b) = 1 − I_{1−x}(b,a) where the fraction converges slowly.
 * Source: Abramowitz & Stegun 26.5.8; Press et al., Numerical Recipes, §6.4.
 */
export function incompleteBeta(x: number, a: number, b: number): number {
  if (!(a > 0 && b > 0)) throw new RangeError(`incompleteBeta: a and b must be > 0, got a=${a}, b=${b}`);
  if (!(x >= 0 && x <= 1)) throw new RangeError(`incompleteBeta: x must be in [0, 1], got ${x}`);
  if (x === 0 || x === 1) return x;
  const logFront = logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log1p(-x);
  if (x < (a + 1) / (a + b + 2)) {
    return (Math.exp(logFront) * betaContinuedFraction(x, a, b)) / a;
  }
  return 1 - (Math.exp(logFront) * betaContinuedFraction(1 - x, b, a)) / b;
}

const TINY = 1e-300;

function betaContinuedFraction(x: number, a: number, b: number): number {
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 10000; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) return h;
  }
  throw new Error(`incompleteBeta: continued fraction did not converge for x=${x}, a=${a}, b=${b}`);
}
