import type { ProfileExtent } from "./steadyStateModel.ts";

/**
 * Bounds for a length-scale parameter (decay length λ, power-law offset x0).
 *
 * Lower: a twentieth of the finest sampling (a shorter scale is invisible in
 * the data) and no less than |xMin|/700 so that e^(−x/λ) at the first point
 * stays inside double range (e^±709 is the limit).
 * Upper: a thousand times the window width; a best fit pressed against it
 * means the profile does not fall off within the window, which the fitter
 * reports as "no decay" instead of printing an absurd λ.
 */
export function lengthScaleBounds(extent: ProfileExtent): [number, number] {
  const widthUm = Math.max(extent.xMaxUm - extent.xMinUm, extent.minSpacingUm);
  const lower = Math.max(extent.minSpacingUm / 20, Math.abs(extent.xMinUm) / 700, 1e-9 * widthUm);
  const upper = Math.max(1000 * widthUm, 10 * lower);
  return [lower, upper];
}
