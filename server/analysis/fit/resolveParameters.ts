import type { ProfileExtent, SteadyStateModel } from "../models/steadyStateModel.ts";
import type { ResolvedFitOptions } from "./fitOptions.ts";

export interface ResolvedParameters {
  /** Full θ: fixed parameters at their value, free ones at the data-driven start. */
  theta: Float64Array;
  /** Indices into θ of the fitted parameters. */
  free: number[];
  /** Bounds of the fitted parameters, in the order of `free`. */
  lower: number[];
  upper: number[];
  /** Start of the fitted parameters, inside the bounds. */
  start: number[];
}

/**
 * Which nonlinear parameters are fitted and where they start: fixed values
 * from the options (a fixed value for a parameter the model lacks adds a
 * warning), bounds from the data's extent, and the model's data-driven guess
 * clamped into the bounds (the bounds' geometric mean when the guess is not finite).
 */
export function resolveParameters(
  model: SteadyStateModel,
  options: ResolvedFitOptions,
  extent: ProfileExtent,
  guess: readonly number[],
  warnings: string[],
): ResolvedParameters {
  const fixed = options.fixed as Record<string, number | undefined>;
  const names = new Set(model.parameters.map((p) => p.name));
  for (const key of Object.keys(fixed)) {
    if (key === "background" || fixed[key] === undefined || names.has(key)) continue;
    warnings.push(`fixed.${key} is ignored: the ${model.name} model has no such parameter`);
  }
  const bounds = model.bounds(extent);
  const theta = new Float64Array(model.parameters.length);
  const free: number[] = [];
  const lower: number[] = [];
  const upper: number[] = [];
  const start: number[] = [];
  model.parameters.forEach((parameter, j) => {
    const value = fixed[parameter.name];
    if (value !== undefined) {
      theta[j] = value;
      return;
    }
    const lo = bounds.lower[j];
    const hi = bounds.upper[j];
    const g = guess[j];
    const s = Number.isFinite(g) && g > 0 ? Math.min(Math.max(g, lo), hi) : Math.sqrt(lo * hi);
    theta[j] = s;
    free.push(j);
    lower.push(lo);
    upper.push(hi);
    start.push(s);
  });
  return { theta, free, lower, upper, start };
}
