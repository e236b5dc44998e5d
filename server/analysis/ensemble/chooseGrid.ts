import { median } from "../stats/descriptive.ts";
import type { Coordinates, Profile } from "./profile.ts";

/** The common grid every profile of a group is resampled onto. */
export interface CommonGrid {
  coords: Coordinates;
  /** Grid positions: µm for absolute coordinates, fraction of length for relative. */
  x: Float64Array;
  /** Spacing in grid units. */
  spacing: number;
  spacingSource: "given" | "median native spacing";
  /** [first, last] position covered by the grid. */
  range: [number, number];
  rangeSource: "given" | "covered by all profiles";
}

export interface GridRequest {
  coords: Coordinates;
  /** Spacing in grid units, or null for the median of the profiles' native spacings. */
  spacing: number | null;
  /** Range in grid units, or null for the range covered by every profile. */
  range: [number, number] | null;
}

/** Smallest useful grid: a Savitzky–Golay slope needs a window of at least 5 points. */
export const MIN_GRID_POINTS = 5;

/** Position of a profile's sample i in the requested coordinates. */
export function profilePosition(p: Profile, i: number, coords: Coordinates): number {
  return coords === "relative" ? p.positionUm[i] / (p.lengthUm as number) : p.positionUm[i];
}

/**
 * Choose the common grid: evenly spaced at the requested spacing (default: the
 * median over embryos of each profile's median native spacing, so the grid is
 * about as fine as the data), over the requested range (default: the range
 * covered by every profile, so no value is extrapolated).
 */
export function chooseGrid(profiles: readonly Profile[], request: GridRequest): CommonGrid {
  if (profiles.length === 0) throw new RangeError("chooseGrid: no profiles");
  const { coords } = request;
  let lo = -Infinity;
  let hi = Infinity;
  let loEmbryo = "";
  let hiEmbryo = "";
  for (const p of profiles) {
    const first = profilePosition(p, 0, coords);
    const last = profilePosition(p, p.positionUm.length - 1, coords);
    if (first > lo) [lo, loEmbryo] = [first, p.embryo];
    if (last < hi) [hi, hiEmbryo] = [last, p.embryo];
  }
  if (!(hi > lo))
    throw new RangeError(`chooseGrid: the profiles share no common range (embryo "${loEmbryo}" starts at ${lo}, embryo "${hiEmbryo}" ends at ${hi})`);
  let range: [number, number] = [lo, hi];
  if (request.range) {
    const [a, b] = request.range;
    const tolerance = 1e-9 * (hi - lo);
    if (!(b > a)) throw new RangeError(`chooseGrid: grid range must have from < to, got [${a}, ${b}]`);
    if (a < lo - tolerance || b > hi + tolerance)
      throw new RangeError(`chooseGrid: grid range [${a}, ${b}] is not covered by every profile (common range is [${lo}, ${hi}])`);
    range = [Math.max(a, lo), Math.min(b, hi)];
  }
  let spacing = request.spacing;
  if (spacing !== null && !(spacing > 0)) throw new RangeError(`chooseGrid: spacing must be > 0, got ${spacing}`);
  if (spacing === null) {
    const native = profiles.map((p) => {
      const steps = new Float64Array(p.positionUm.length - 1);
      for (let i = 0; i < steps.length; i++) steps[i] = profilePosition(p, i + 1, coords) - profilePosition(p, i, coords);
      return median(steps);
    });
    spacing = median(native);
  }
  const count = Math.floor((range[1] - range[0]) / spacing + 1e-9) + 1;
  if (count < MIN_GRID_POINTS)
    throw new RangeError(`chooseGrid: spacing ${spacing} gives only ${count} grid points over [${range[0]}, ${range[1]}]; at least ${MIN_GRID_POINTS} are needed`);
  const x = new Float64Array(count);
  for (let k = 0; k < count; k++) x[k] = range[0] + k * spacing;
  return {
    coords,
    x,
    spacing,
    spacingSource: request.spacing === null ? "median native spacing" : "given",
    range: [x[0], x[count - 1]],
    rangeSource: request.range ? "given" : "covered by all profiles",
  };
}
