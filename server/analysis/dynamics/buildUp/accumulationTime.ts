/**
 * Local accumulation time of an SDD gradient formed by a constant influx at
 * x = 0 on a semi-infinite line: τ(x) = (1 + x/λ)/(2k), λ = √(D/k).
 * Source: Berezhkovskii, Sample & Shvartsman 2010, Biophys J 99:L59.
 */
export function accumulationTime(xUm: number, diffusionUm2PerS: number, degradationPerS: number): number {
  const lambda = Math.sqrt(diffusionUm2PerS / degradationPerS);
  return (1 + xUm / lambda) / (2 * degradationPerS);
}
