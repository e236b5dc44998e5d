import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { prepareProfile } from "../../../server/analysis/fit/prepareProfile.ts";

describe("prepareProfile", () => {
  it("keeps finite points inside the window, sorted by x, with a fixed background subtracted", () => {
    // common practice, no source
    const out = prepareProfile([30, 10, NaN, 20, 50, 40], [3, 1, 9, 2, 5, Infinity], FitOptions.parse({ window: { xMaxUm: 45 }, fixed: { background: 0.5 } }));
    if (!out.ok) throw new Error(out.message);
    expect(Array.from(out.profile.x)).toEqual([10, 20, 30]);
    expect(Array.from(out.profile.y)).toEqual([0.5, 1.5, 2.5]);
    expect(out.profile).toMatchObject({ droppedNonFinite: 2, outsideWindow: 1, constant: false, weights: null });
    expect(out.profile.extent).toEqual({ xMinUm: 10, xMaxUm: 30, minSpacingUm: 10, lengthUm: null });
  });

  it("turns variances into weights 1/σ² and drops points with a non-positive variance", () => {
    // Source: inverse-variance weighting (definition).
    const out = prepareProfile([0, 1, 2, 3], [4, 3, 2, 1], FitOptions.parse({ weights: "inverse-variance" }), { variance: [4, 0, 0.25, 1] });
    if (!out.ok) throw new Error(out.message);
    expect(Array.from(out.profile.weights!)).toEqual([0.25, 4, 1]);
    expect(out.profile.droppedNonFinite).toBe(1);
  });

  it("explains bad lengths and repeated positions", () => {
    // common practice, no source
    expect(prepareProfile([0, 1], [1, 2], FitOptions.parse({}), { lengthUm: -3 })).toEqual({ ok: false, message: "the embryo length must be a positive number of µm, got -3" });
    const same = prepareProfile([5, 5, 5], [1, 2, 3], FitOptions.parse({}));
    expect(same).toEqual({ ok: false, message: "all 3 points share the position x = 5 µm; a gradient needs distinct positions" });
  });
});
