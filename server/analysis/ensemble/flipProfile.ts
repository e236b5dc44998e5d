import type { Profile } from "./profile.ts";

/**
 * The same profile read from the other end: x → L − x with the embryo length
 * when given, otherwise mirrored within its own sampled span
 * (x → x_first + x_last − x), re-sorted so positions ascend.
 */
export function flipProfile(p: Profile): Profile {
  const n = p.positionUm.length;
  const pivot = p.lengthUm ?? p.positionUm[0] + p.positionUm[n - 1];
  const positionUm = new Float64Array(n);
  const intensity = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    positionUm[i] = pivot - p.positionUm[n - 1 - i];
    intensity[i] = p.intensity[n - 1 - i];
  }
  return p.lengthUm === undefined ? { embryo: p.embryo, positionUm, intensity } : { embryo: p.embryo, positionUm, intensity, lengthUm: p.lengthUm };
}
