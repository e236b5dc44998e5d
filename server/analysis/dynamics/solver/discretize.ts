import type { ReactionDiffusionProblem } from "./reactionDiffusionProblem.ts";

/**
 * The finite-volume form of a problem: dc_i/dt = lower_i·c_{i−1} + diagonal_i·c_i
 * + upper_i·c_{i+1} + constant_i − k·c_iⁿ (the linear term −k·c_i folded into the
 * diagonal when n = 1). Cell i covers [i·h, (i+1)·h]; fluxes through faces are
 * D·area·(difference of neighbouring averages)/h, a fixed end value acts over
 * the half cell h/2 to the face. On a disc the face area is the radius r and a
 * cell's volume ½(r²₊ − r²₋) (per radian), so the centre has no flux.
 * Source: LeVeque 2002, Finite Volume Methods for Hyperbolic Problems, ch. 4 and §18.
 */
export interface Discretization {
  positionsUm: Float64Array;
  volumes: Float64Array;
  lower: Float64Array;
  diagonal: Float64Array;
  upper: Float64Array;
  constant: Float64Array;
  /** k of the nonlinear term; 0 when folded into the diagonal (n = 1). */
  nonlinearK: number;
  order: number;
}

export function discretize(p: ReactionDiffusionProblem): Discretization {
  const n = p.cells;
  if (!Number.isInteger(n) || n < 3) throw new RangeError(`discretize: need at least 3 cells, got ${n}`);
  if (!(p.lengthUm > 0) || !(p.diffusionUm2PerS > 0) || !(p.degradationPerS >= 0) || !(p.degradationOrder > 0))
    throw new RangeError("discretize: length and D must be positive, k ≥ 0 and the order n > 0");
  const h = p.lengthUm / n;
  const disc = p.geometry === "disc";
  const face = (i: number) => (disc ? i * h : 1);
  const positionsUm = new Float64Array(n);
  const volumes = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    positionsUm[i] = (i + 0.5) * h;
    volumes[i] = disc ? 0.5 * (((i + 1) * h) ** 2 - (i * h) ** 2) : h;
  }
  const lower = new Float64Array(n);
  const diagonal = new Float64Array(n);
  const upper = new Float64Array(n);
  const constant = new Float64Array(n);
  const d = p.diffusionUm2PerS;
  for (let i = 1; i < n; i++) {
    const w = (d * face(i)) / h;
    lower[i] += w / volumes[i];
    diagonal[i] -= w / volumes[i];
    upper[i - 1] += w / volumes[i - 1];
    diagonal[i - 1] -= w / volumes[i - 1];
  }
  const ends: [typeof p.left, number, number][] = [[p.left, 0, 0], [p.right, n - 1, n]];
  for (const [b, cell, f] of ends) {
    const area = face(f);
    if (area === 0) continue;
    if (b.kind === "flux") constant[cell] += (area * b.influx) / volumes[cell];
    else {
      const g = (d * area) / (h / 2);
      diagonal[cell] -= g / volumes[cell];
      constant[cell] += (g * b.value) / volumes[cell];
    }
  }
  if (p.source) {
    const { fromUm, toUm, ratePerS } = p.source;
    if (!(toUm > fromUm)) throw new RangeError("discretize: the source region needs fromUm < toUm");
    for (let i = 0; i < n; i++) {
      const a = Math.max(fromUm, i * h);
      const b = Math.min(toUm, (i + 1) * h);
      if (b <= a) continue;
      const overlap = disc ? 0.5 * (b * b - a * a) : b - a;
      constant[i] += (ratePerS * overlap) / volumes[i];
    }
  }
  const linear = p.degradationOrder === 1;
  if (linear) for (let i = 0; i < n; i++) diagonal[i] -= p.degradationPerS;
  return { positionsUm, volumes, lower, diagonal, upper, constant, nonlinearK: linear ? 0 : p.degradationPerS, order: p.degradationOrder };
}
