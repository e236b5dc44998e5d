import { describe, expect, it } from "vitest";
import { weightedTotalSumOfSquares } from "../../../server/analysis/fit/weightedTotalSumOfSquares.ts";

describe("weightedTotalSumOfSquares", () => {
  it("sums w(y − ȳ_w)² about the weighted mean", () => {
    // Source: by hand, y = 1, 2, 4 with w = 1, 1, 2: ȳ_w = 11/4, TSS = 49/16 + 9/16 + 2·25/16 = 108/16 = 6.75.
    expect(weightedTotalSumOfSquares([1, 2, 4], [1, 1, 2])).toBeCloseTo(6.75, 14);
    expect(weightedTotalSumOfSquares([3, 3], [1, 5])).toBe(0);
  });
});
