import { describe, expect, it } from "vitest";
import { deltaMethodVariance } from "../../../server/analysis/fit/deltaMethod.ts";

describe("deltaMethodVariance", () => {
  it("is exact for a linear function: Var(aᵀθ) = aᵀΣa", () => {
    // Source: variance of a linear combination; by hand 1·4 + 2·2·1·(−1)·... = 4 + 2·(2·(−3)·1) + 9·2 = 10.
    const covariance = [
      [4, 1],
      [1, 2],
    ];
    // a = (1, −3): aᵀΣa = 4 − 2·3·1 + 9·2 = 16.
    expect(deltaMethodVariance([1, -3], covariance)).toBe(16);
  });

  it("returns null for a non-finite result and clamps rounding below zero", () => {
    // common practice, no source
    expect(deltaMethodVariance([NaN, 1], [[1, 0], [0, 1]])).toBeNull();
    expect(deltaMethodVariance([1, -1], [[1, 1 + 1e-17], [1 + 1e-17, 1]])).toBe(0);
  });
});
