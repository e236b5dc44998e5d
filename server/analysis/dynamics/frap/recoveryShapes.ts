import { erf, erfc } from "../../special/errorFunction.ts";
import { i0e, i1e } from "../../special/scaledBessel.ts";

/**
 * Bleach geometry of a FRAP experiment (lengths in µm).
 * - `spot`: a circular spot of radius w in a 2D sheet.
 * - `strip`: a strip of full width w across an infinite line (1D).
 * - `rod`: a strip [x1, x2] in a closed rod [0, L] (e.g. a rod-shaped cell).
 */
export type FrapGeometry =
  | { kind: "spot"; radiusUm: number }
  | { kind: "strip"; widthUm: number }
  | { kind: "rod"; fromUm: number; toUm: number; lengthUm: number };

/**
 * Normalised recovery f(t) of the bleached region for a fully mobile species,
 * 0 just after an instantaneous bleach: the fraction of the pre-bleach signal
 * that has come back. The rod's plateau is 1 − w/L (bleached molecules stay in
 * the cell), the others reach 1.
 */
export function recoveryShape(geometry: FrapGeometry, tS: number, diffusionUm2PerS: number): number {
  if (tS <= 0) return 0;
  switch (geometry.kind) {
    case "spot":
      return spotRecovery(tS, geometry.radiusUm, diffusionUm2PerS);
    case "strip":
      return stripRecovery(tS, geometry.widthUm, diffusionUm2PerS);
    case "rod":
      return 1 - rodStripDeficit(tS, geometry.fromUm, geometry.toUm, geometry.lengthUm, diffusionUm2PerS);
  }
}

/** Where the recovery levels off without degradation. */
export function recoveryPlateau(geometry: FrapGeometry): number {
  return geometry.kind === "rod" ? 1 - (geometry.toUm - geometry.fromUm) / geometry.lengthUm : 1;
}

/**
 * Circular spot, uniform bleach: f = e^(−z)[I0(z) + I1(z)], z = 2τD/t, τD = w²/(4D),
 * evaluated as i0e(z) + i1e(z) so that it stays finite for z > 710.
 * Source: Soumpasis 1983, Biophys J 41:95.
 */
export function spotRecovery(tS: number, radiusUm: number, diffusionUm2PerS: number): number {
  const z = (radiusUm * radiusUm) / (2 * diffusionUm2PerS * tS);
  return i0e(z) + i1e(z);
}

/**
 * Strip of full width w on an infinite line: mean over the strip of the
 * solution of the 1D diffusion equation from a unit deficit on the strip,
 * f = erfc(√(τ/t)) + √(t/(πτ))·(1 − e^(−τ/t)), τ = w²/(4D) (not the often-quoted
 * 1 − [w²/(w² + 4πDt)]^½, which is off by up to 0.056).
 * Source: derived (METHODS.md, FRAP); checked against the solver in the tests.
 */
export function stripRecovery(tS: number, widthUm: number, diffusionUm2PerS: number): number {
  const ratio = (widthUm * widthUm) / (4 * diffusionUm2PerS * tS);
  return erfc(Math.sqrt(ratio)) - Math.expm1(-ratio) / Math.sqrt(Math.PI * ratio);
}

/**
 * Mean deficit ⟨u⟩ over a bleached strip [x1, x2] of a closed rod [0, L] (u = 1
 * on the strip at t = 0, no flux at the ends). For Dt/L² ≥ 0.05 the cosine series
 * ⟨u⟩ = w/L + (L/2w)·Σ aₙ² e^(−Dn²π²t/L²), aₙ = (2/nπ)[sin(nπx2/L) − sin(nπx1/L)];
 * for shorter times the method of images (strip reflected at both ends), whose
 * strip mean has the closed form (1/2w)·Σ [G(x2−a) − G(x1−a) − G(x2−b) + G(x1−b)],
 * G(y) = y·erf(y/s) + (s/√π)e^(−y²/s²), s = √(4Dt).
 * Source: derived (METHODS.md, FRAP: separation of variables and images); checked against the solver.
 */
export function rodStripDeficit(tS: number, x1: number, x2: number, lengthUm: number, diffusionUm2PerS: number): number {
  const w = x2 - x1;
  const dtl = (diffusionUm2PerS * tS) / (lengthUm * lengthUm);
  if (dtl >= 0.05) {
    let sum = 0;
    for (let n = 1; n < 10_000; n++) {
      const decay = Math.exp(-diffusionUm2PerS * n * n * Math.PI * Math.PI * tS / (lengthUm * lengthUm));
      if (decay < 1e-18) break;
      const a = (2 / (n * Math.PI)) * (Math.sin((n * Math.PI * x2) / lengthUm) - Math.sin((n * Math.PI * x1) / lengthUm));
      sum += a * a * decay;
    }
    return w / lengthUm + (lengthUm / (2 * w)) * sum;
  }
  const s = Math.sqrt(4 * diffusionUm2PerS * tS);
  const g = (y: number) => y * erf(y / s) + (s / Math.sqrt(Math.PI)) * Math.exp(-(y * y) / (s * s));
  const images = Math.ceil((8 * s + lengthUm) / (2 * lengthUm)) + 1;
  let total = 0;
  for (let m = -images; m <= images; m++) {
    const shift = 2 * m * lengthUm;
    for (const [a, b] of [[x1 + shift, x2 + shift], [-x2 + shift, -x1 + shift]]) {
      total += g(x2 - a) - g(x1 - a) - g(x2 - b) + g(x1 - b);
    }
  }
  return total / (2 * w);
}
