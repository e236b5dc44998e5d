import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";

describe("FitOptions", () => {
  it("fills every default from an empty object", () => {
    // common practice, no source: the schema is the single home of the defaults.
    expect(FitOptions.parse({})).toEqual({
      model: "exponential",
      fixed: {},
      background: true,
      autoWindow: true,
      errorModel: "hc3",
      weights: "intensity",
      robust: { loss: "none" },
      maxIterations: 200,
      maxReweightings: 50,
      tolerance: { step: 1e-10, reduction: 1e-13, gradient: 1e-10 },
    });
  });

  it("a fixed background turns background fitting off in the resolved options", () => {
    // common practice, no source
    expect(FitOptions.parse({ fixed: { background: 3 } })).toMatchObject({ background: false, fixed: { background: 3 } });
  });

  it("rejects unknown options, bad values and an empty window with issues naming the field", () => {
    // common practice, no source
    const unknown = FitOptions.safeParse({ modle: "finite" });
    expect(unknown.success).toBe(false);
    expect(unknown.error!.issues[0]).toMatchObject({ code: "unrecognized_keys", keys: ["modle"] });
    const model = FitOptions.safeParse({ model: "gaussian" });
    expect(model.error!.issues[0].path).toEqual(["model"]);
    const negative = FitOptions.safeParse({ fixed: { sourceWidthUm: -2 } });
    expect(negative.error!.issues[0].path).toEqual(["fixed", "sourceWidthUm"]);
    const window = FitOptions.safeParse({ window: { xMinUm: 50, xMaxUm: 10 } });
    expect(window.error!.issues[0]).toMatchObject({ path: ["window", "xMaxUm"], message: "window.xMinUm must be smaller than window.xMaxUm" });
    expect(FitOptions.safeParse({ maxIterations: 2.5 }).success).toBe(false);
  });
});
