import { describe, expect, it } from "vitest";
import { sigmaXFigure } from "../../client/figures/sigmaXFigure.ts";
import { axisTitles, dataset } from "../helpers/figureConfig.ts";
import { precisionInput, relativePrecision } from "./figureFixtures.ts";

describe("sigmaXFigure", () => {
  it("sigmaXFigure matches its snapshot", () => {
    expect(sigmaXFigure(precisionInput)).toMatchSnapshot();
  });

  it("sigmaXFigure leaves masked positions as gaps in the curve and in its band", () => {
    const config = sigmaXFigure(precisionInput);
    const sigma = dataset(config, "σ_x, sig").data.map((p) => p.y);
    expect(sigma).toEqual([NaN, 9.5, 10.2, 11, NaN]);
    expect(dataset(config, "bootstrap 95% CI").data.map((p) => p.y)).toEqual([NaN, 12, 13, 14, NaN]);
    // common practice, no source: the legend states the headline σ_x and the region it summarises.
    expect(dataset(config, "σ_x, sig").label).toContain("10.2 µm over 4.00–36.0 µm");
  });

  it("sigmaXFigure draws the joint σ_x of several channels when present", () => {
    expect(dataset(sigmaXFigure(precisionInput), "joint σ_x, sig + other").data.map((p) => p.y)).toEqual([NaN, 7, 7.5, 8, NaN]);
    expect(() => dataset(sigmaXFigure(relativePrecision), "joint")).toThrow();
  });

  it("sigmaXFigure measures σ_x in µm, or as a fraction of length in relative coordinates", () => {
    expect(axisTitles(sigmaXFigure(precisionInput))[1]).toBe("positional error σ_x (µm)");
    expect(axisTitles(sigmaXFigure(relativePrecision))[1]).toBe("positional error σ_x (fraction of length)");
  });
});
