import { erfc, erfcx } from "../../special/errorFunction.ts";

/**
 * Concentration during the build-up of an SDD gradient from c = 0 with a
 * constant influx j0 at x = 0 on a semi-infinite line, ∂c/∂t = D c″ − k c:
 *   c(x,t) = (j0λ/2D)·[e^(−x/λ)·erfc(z₋) − e^(x/λ)·erfc(z₊)],  z± = x/√(4Dt) ± √(kt)
 * (note the minus between the terms). Evaluated without overflow: e^(±x/λ)·erfc(z±)
 * = e^(−x²/4Dt − kt)·erfcx(z±), and the first term directly where z₋ < 0.
 * Source: derived by Laplace transform (METHODS.md, Dynamics) and checked in
 * the tests against the finite-volume solver; the scaled form keeps it finite far from the source.
 */
export function influxBuildUp(xUm: number, tS: number, diffusionUm2PerS: number, degradationPerS: number, influx: number): number {
  if (tS <= 0) return 0;
  const d = diffusionUm2PerS;
  const k = degradationPerS;
  const lambda = Math.sqrt(d / k);
  const a = xUm / Math.sqrt(4 * d * tS);
  const b = Math.sqrt(k * tS);
  const zMinus = a - b;
  const zPlus = a + b;
  const front = (influx * lambda) / (2 * d);
  const common = Math.exp(-a * a - k * tS);
  const second = common * erfcx(zPlus);
  const first = zMinus < 0 ? Math.exp(-xUm / lambda) * erfc(zMinus) : common * erfcx(zMinus);
  return front * (first - second);
}

/**
 * The same build-up with the concentration held at c0 at x = 0:
 *   c(x,t) = (c0/2)·[e^(−x/λ)·erfc(z₋) + e^(x/λ)·erfc(z₊)]  (a plus).
 * Source: derived like {@link influxBuildUp}; checked against the solver in the tests.
 */
export function fixedConcentrationBuildUp(xUm: number, tS: number, diffusionUm2PerS: number, degradationPerS: number, c0: number): number {
  if (tS <= 0) return xUm === 0 ? c0 : 0;
  const d = diffusionUm2PerS;
  const k = degradationPerS;
  const lambda = Math.sqrt(d / k);
  const a = xUm / Math.sqrt(4 * d * tS);
  const b = Math.sqrt(k * tS);
  const zMinus = a - b;
  const common = Math.exp(-a * a - k * tS);
  const second = common * erfcx(a + b);
  const first = zMinus < 0 ? Math.exp(-xUm / lambda) * erfc(zMinus) : common * erfcx(zMinus);
  return (c0 / 2) * (first + second);
}
