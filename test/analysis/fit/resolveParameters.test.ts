import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { resolveParameters } from "../../../server/analysis/fit/resolveParameters.ts";
import { sourceModel } from "../../../server/analysis/models/source.ts";

const extent = { xMinUm: 0, xMaxUm: 200, minSpacingUm: 2, lengthUm: null };

describe("resolveParameters", () => {
  it("holds fixed parameters, frees the rest and clamps the guess into the bounds", () => {
    // common practice, no source
    const warnings: string[] = [];
    const r = resolveParameters(sourceModel, FitOptions.parse({ model: "source", fixed: { sourceWidthUm: 25 } }), extent, [1e9, 3], warnings);
    expect(Array.from(r.theta)).toEqual([200_000, 25]);
    expect(r.free).toEqual([0]);
    expect(r.start).toEqual([200_000]);
    expect(warnings).toEqual([]);
  });

  it("starts at the bounds' geometric mean when the guess is not usable, and warns about foreign fixed values", () => {
    // common practice, no source
    const warnings: string[] = [];
    const r = resolveParameters(sourceModel, FitOptions.parse({ model: "source", fixed: { exponent: 2 } }), extent, [NaN, -1], warnings);
    expect(r.start[0]).toBeCloseTo(Math.sqrt(r.lower[0] * r.upper[0]), 9);
    expect(warnings).toEqual(["fixed.exponent is ignored: the source model has no such parameter"]);
  });
});
