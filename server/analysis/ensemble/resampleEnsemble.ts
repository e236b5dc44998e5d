import type { CommonGrid } from "./chooseGrid.ts";
import { interpolateLinear } from "./interpolateLinear.ts";
import type { Profile } from "./profile.ts";

/** A group of profiles on one common grid: values[i][k] is embryo i at grid point k. */
export interface ResampledEnsemble {
  grid: CommonGrid;
  embryos: string[];
  values: Float64Array[];
  /** Embryo lengths in µm, null where not given. */
  lengthsUm: (number | null)[];
}

/** Resample every profile onto the grid by linear interpolation in the grid's coordinates. */
export function resampleEnsemble(profiles: readonly Profile[], grid: CommonGrid): ResampledEnsemble {
  const values = profiles.map((p) => {
    const xs = grid.coords === "relative"
      ? Float64Array.from(p.positionUm, (v) => v / (p.lengthUm as number))
      : p.positionUm;
    return interpolateLinear(xs, p.intensity, grid.x);
  });
  return {
    grid,
    embryos: profiles.map((p) => p.embryo),
    values,
    lengthsUm: profiles.map((p) => p.lengthUm ?? null),
  };
}
