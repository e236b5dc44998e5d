import { describe, expect, it } from "vitest";
import { correlationMatrix } from "../../../server/analysis/fit/correlationMatrix.ts";

describe("correlationMatrix", () => {
  it("divides each covariance by the product of standard deviations", () => {
    // Source: definition of correlation; by hand −3/√(4·9) = −0.5.
    const c = correlationMatrix({ names: ["a", "b"], matrix: [[4, -3], [-3, 9]] })!;
    expect(c.names).toEqual(["a", "b"]);
    expect(c.matrix).toEqual([[1, -0.5], [-0.5, 1]]);
  });

  it("is null when a variance is zero", () => {
    // common practice, no source
    expect(correlationMatrix({ names: ["a", "b"], matrix: [[0, 0], [0, 1]] })).toBeNull();
  });
});
