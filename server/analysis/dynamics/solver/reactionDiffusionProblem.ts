/**
 * What happens at one end of the domain.
 * - `flux`: a given influx j into the domain (concentration·µm/s); 0 is a no-flux (closed) end.
 * - `fixed`: the concentration is held at `value` (an absorbing end when 0).
 */
export type Boundary = { kind: "flux"; influx: number } | { kind: "fixed"; value: number };

/** Constant production ν (concentration/s) in the source region [fromUm, toUm]. */
export interface SourceRegion {
  fromUm: number;
  toUm: number;
  ratePerS: number;
}

/**
 * ∂c/∂t = D·∇²c − k·cⁿ + ν·1[source] on [0, L]: a line (`line`, 1D) or a disc
 * of radius L with radial symmetry (`disc`, 2D, x is the radius; the centre is
 * a symmetry point and `left` is ignored there).
 */
export interface ReactionDiffusionProblem {
  geometry: "line" | "disc";
  lengthUm: number;
  /** Number of finite volumes (cells of width L/cells). */
  cells: number;
  diffusionUm2PerS: number;
  /** k in −k·cⁿ; 1/s for n = 1. */
  degradationPerS: number;
  /** n in −k·cⁿ (1 = linear degradation). */
  degradationOrder: number;
  source: SourceRegion | null;
  left: Boundary;
  right: Boundary;
  /** Cell averages at t = 0 (length `cells`); null for c = 0 everywhere. */
  initial: Float64Array | null;
}

