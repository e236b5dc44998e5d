import { describe, expect, it } from "vitest";
import { parameterEstimate } from "../../../server/analysis/fit/parameterEstimate.ts";

describe("parameterEstimate", () => {
  it("builds value ± t·se with se = √variance", () => {
    // Source: t-interval for a least-squares parameter (Seber & Wild 1989, §5.1).
    expect(parameterEstimate(10, 4, 2.5, "µm")).toEqual({ value: 10, se: 2, ci95: [5, 15], unit: "µm", fixed: false });
  });

  it("gives null se and interval for fixed, missing, negative or non-finite variances", () => {
    // common practice, no source: NaN must not leak into results.
    for (const v of [null, -1, NaN, Infinity]) expect(parameterEstimate(3, v, 2, "a.u.")).toMatchObject({ se: null, ci95: null });
    expect(parameterEstimate(3, 1, 2, "a.u.", true)).toEqual({ value: 3, se: null, ci95: null, unit: "a.u.", fixed: true });
  });
});
