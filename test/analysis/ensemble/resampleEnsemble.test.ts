import { describe, expect, it } from "vitest";
import { chooseGrid } from "../../../server/analysis/ensemble/chooseGrid.ts";
import { interpolateLinear } from "../../../server/analysis/ensemble/interpolateLinear.ts";
import type { Profile } from "../../../server/analysis/ensemble/profile.ts";
import { resampleEnsemble } from "../../../server/analysis/ensemble/resampleEnsemble.ts";
import { runPython } from "../../helpers/python.ts";

const profiles: Profile[] = [
  { embryo: "a", positionUm: [0, 1.5, 3, 4.5, 6, 7.5, 9, 10.5, 12], intensity: [9, 8, 6, 5, 4, 3, 2.5, 2, 1.8], lengthUm: 12 },
  { embryo: "b", positionUm: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11], intensity: [8.5, 7.9, 6.8, 5.9, 5, 4.2, 3.4, 3, 2.7, 2.2, 2], lengthUm: 11 },
  { embryo: "c", positionUm: [0.5, 2.5, 4.5, 6.5, 8.5, 10.5, 12.5], intensity: [9.2, 7.3, 5.4, 4.1, 3.2, 2.5, 2.1], lengthUm: 13 },
];

describe("common grid and resampling", () => {
  it("chooseGrid defaults to the median native spacing over the range every profile covers", () => {
    // common practice, no source: native spacings 1.5, 1, 2 → median 1.5; common range [1, 10.5].
    const grid = chooseGrid(profiles, { coords: "absolute", spacing: null, range: null });
    expect(grid.spacing).toBe(1.5);
    expect(grid.spacingSource).toBe("median native spacing");
    expect(Array.from(grid.x)).toEqual([1, 2.5, 4, 5.5, 7, 8.5, 10]);
    expect(grid.range).toEqual([1, 10]);
  });

  it("resampleEnsemble interpolates linearly exactly as numpy.interp", async () => {
    const grid = chooseGrid(profiles, { coords: "absolute", spacing: 0.7, range: [1.2, 10.3] });
    const ensemble = resampleEnsemble(profiles, grid);
    // Source: numpy.interp as reference.
    const ref = await runPython<number[][]>(
      `result = [np.interp(data["x"], p["positionUm"], p["intensity"]).tolist() for p in data["profiles"]]`,
      { x: Array.from(grid.x), profiles },
    );
    ensemble.values.forEach((row, i) => row.forEach((v, k) => expect(v).toBeCloseTo(ref[i][k], 13)));
    expect(ensemble.embryos).toEqual(["a", "b", "c"]);
  });

  it("relative coordinates divide each embryo's positions by its length", () => {
    // Source: definition of relative position x/L.
    const grid = chooseGrid(profiles, { coords: "relative", spacing: 0.1, range: null });
    expect(grid.range[0]).toBeCloseTo(1 / 11, 14);
    const ensemble = resampleEnsemble(profiles, grid);
    const x = grid.x[2];
    expect(ensemble.values[2][2]).toBeCloseTo(interpolateLinear([0.5, 2.5, 4.5, 6.5, 8.5, 10.5, 12.5].map((v) => v / 13), profiles[2].intensity, [x])[0], 14);
  });

  it("chooseGrid explains why no grid is possible", () => {
    // common practice, no source.
    const apart: Profile[] = [
      { embryo: "p", positionUm: [0, 1, 2], intensity: [1, 1, 1] },
      { embryo: "q", positionUm: [5, 6, 7], intensity: [1, 1, 1] },
    ];
    expect(() => chooseGrid(apart, { coords: "absolute", spacing: null, range: null })).toThrow(/share no common range \(embryo "q" starts at 5, embryo "p" ends at 2\)/);
    expect(() => chooseGrid(profiles, { coords: "absolute", spacing: 4, range: null })).toThrow(/gives only 3 grid points/);
    expect(() => chooseGrid(profiles, { coords: "absolute", spacing: null, range: [0, 10] })).toThrow(/is not covered by every profile/);
  });
});
