import { describe, expect, it } from "vitest";
import { holmAdjust } from "../../../server/analysis/stats/holmAdjust.ts";

describe("holmAdjust", () => {
  it("holmAdjust reproduces the four-hypothesis worked example", () => {
    // Worked example (value from memory; standard illustration of Holm 1979, Scand J Stat):
    // p = (0.01, 0.04, 0.03, 0.005), m = 4. Sorted: 0.005, 0.01, 0.03, 0.04.
    // 0.005 ≤ 0.05/4 reject; 0.01 ≤ 0.05/3 reject; 0.03 > 0.05/2 stop → H1 and H4 rejected.
    // Adjusted: 4·0.005 = 0.02; 3·0.01 = 0.03; 2·0.03 = 0.06; max(1·0.04, 0.06) = 0.06.
    const adjusted = holmAdjust([0.01, 0.04, 0.03, 0.005]);
    [0.03, 0.06, 0.06, 0.02].forEach((v, i) => expect(adjusted[i]).toBeCloseTo(v, 14));
    expect(adjusted.map((p) => p <= 0.05)).toEqual([true, false, false, true]);
  });

  it("holmAdjust enforces monotonicity and caps at 1", () => {
    // Hand-worked from the definition in Holm 1979, Scand J Stat:
    // sorted 0.02, 0.021, 0.5, 0.6 → 4·0.02 = 0.08; 3·0.021 = 0.063 → raised to 0.08;
    // 2·0.5 = 1.0; 1·0.6 = 0.6 → raised to 1.0.
    const adjusted = holmAdjust([0.5, 0.02, 0.6, 0.021]);
    [1, 0.08, 1, 0.08].forEach((v, i) => expect(adjusted[i]).toBeCloseTo(v, 14));
  });

  it("holmAdjust leaves a single test unchanged and rejects values outside [0, 1]", () => {
    // Source: Holm 1979, Scand J Stat — with m = 1 the procedure is the unadjusted test.
    expect(holmAdjust([0.037])).toEqual([0.037]);
    expect(holmAdjust([])).toEqual([]);
    expect(() => holmAdjust([0.2, Number.NaN])).toThrow(/p-value 1 must be in \[0, 1\], got NaN/);
  });
});
