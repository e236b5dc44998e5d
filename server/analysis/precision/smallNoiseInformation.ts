/**
 * Positional information in bits in the small-noise approximation, for a
 * uniform prior over the region [x_start, x_end] of length L:
 *   I ≈ log₂ L − (1/L) ∫ log₂(√(2πe) σ_x(x)) dx,
 * integrated by the trapezoid rule over the grid. σ_x and L share units.
 * Source: Tkačik, Dubuis, Petkova, Gregor 2015, Genetics; Dubuis et al. 2013, PNAS.
 * On a bounded domain it reads slightly low, by a few σ_x/L bits.
 * Returns NaN when σ_x is missing or non-positive anywhere in the region.
 */
export function smallNoiseInformation(gridX: ArrayLike<number>, sigmaX: ArrayLike<number>, startIndex: number, endIndex: number): number {
  const length = gridX[endIndex] - gridX[startIndex];
  if (!(length > 0)) return NaN;
  const c = Math.log2(Math.sqrt(2 * Math.PI * Math.E));
  let integral = 0;
  for (let k = startIndex; k < endIndex; k++) {
    const a = sigmaX[k];
    const b = sigmaX[k + 1];
    if (!(a > 0 && b > 0)) return NaN;
    integral += 0.5 * (gridX[k + 1] - gridX[k]) * (Math.log2(a) + Math.log2(b));
  }
  return Math.log2(length) - c - integral / length;
}
