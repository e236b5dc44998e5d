import { recoveryPlateau, recoveryShape, type FrapGeometry } from "./recoveryShapes.ts";

/**
 * Shape g(t) of the recovery with turnover: the bleached deficit 1 − f(t)
 * decays by an extra factor e^(−kt) for any geometry, so g = 1 − (1 − f)·e^(−kt)
 * (k = 0: g = f). Source: science notes §3 [derived].
 */
export function recoveryWithTurnover(geometry: FrapGeometry, tS: number, diffusionUm2PerS: number, degradationPerS: number): number {
  const f = recoveryShape(geometry, tS, diffusionUm2PerS);
  return degradationPerS > 0 ? 1 - (1 - f) * Math.exp(-degradationPerS * tS) : f;
}

/** g(∞): 1, or 1 − w/L for the closed rod without turnover. */
export function turnoverPlateau(geometry: FrapGeometry, degradationPerS: number): number {
  return degradationPerS > 0 ? 1 : recoveryPlateau(geometry);
}

/**
 * Recovery half-time: the time at which g reaches half of its plateau
 * (bisection on log t; g increases with t).
 */
export function recoveryHalfTime(geometry: FrapGeometry, diffusionUm2PerS: number, degradationPerS: number): number {
  const target = turnoverPlateau(geometry, degradationPerS) / 2;
  let lo = 1e-12;
  let hi = 1;
  while (recoveryWithTurnover(geometry, hi, diffusionUm2PerS, degradationPerS) < target) {
    hi *= 4;
    if (hi > 1e15) throw new RangeError("recoveryHalfTime: the recovery never reaches half its plateau");
  }
  for (let i = 0; i < 200 && hi / lo > 1 + 1e-12; i++) {
    const mid = Math.sqrt(lo * hi);
    if (recoveryWithTurnover(geometry, mid, diffusionUm2PerS, degradationPerS) < target) lo = mid;
    else hi = mid;
  }
  return Math.sqrt(lo * hi);
}
