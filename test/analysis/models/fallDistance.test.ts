import { describe, expect, it } from "vitest";
import { fallDistance } from "../../../server/analysis/models/fallDistance.ts";

describe("fallDistance", () => {
  it("finds where a straight falling line reaches half its height, interpolating between samples", () => {
    // Source: arithmetic on y = 10 − x sampled at 0, 3, 6, 9: height above the lowest value 1 is 9,
    // so half height is y = 5.5, crossed at x = 4.5.
    const fall = fallDistance([0, 3, 6, 9], [10, 7, 4, 1], 0.5)!;
    expect(fall.peakUm).toBe(0);
    expect(fall.distanceUm).toBeCloseTo(4.5, 12);
  });

  it("returns null when the profile never falls after its peak", () => {
    // common practice, no source
    expect(fallDistance([0, 1, 2], [1, 2, 3], 0.5)).toBeNull();
    expect(fallDistance([0, 1, 2], [2, 2, 2], 0.5)).toBeNull();
  });
});
