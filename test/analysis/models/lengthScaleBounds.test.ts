import { describe, expect, it } from "vitest";
import { lengthScaleBounds } from "../../../server/analysis/models/lengthScaleBounds.ts";

describe("lengthScaleBounds", () => {
  it("spans a twentieth of the sampling to a thousand window widths", () => {
    // common practice, no source
    const [lower, upper] = lengthScaleBounds({ xMinUm: 0, xMaxUm: 200, minSpacingUm: 2, lengthUm: null });
    expect(lower).toBeCloseTo(0.1, 14);
    expect(upper).toBe(200_000);
  });

  it("keeps e^(−x/λ) at the first point inside double range for windows far from the source", () => {
    // Source: e^(−x) underflows for x > ~745 in double precision (IEEE 754).
    const [lower] = lengthScaleBounds({ xMinUm: 7000, xMaxUm: 7100, minSpacingUm: 0.5, lengthUm: null });
    expect(Math.exp(-7000 / lower)).toBeGreaterThan(0);
  });
});
