import { describe, expect, it } from "vitest";
import { profileFitFigure } from "../../client/figures/profileFitFigure.ts";
import { dataset, titleOf } from "../helpers/figureConfig.ts";
import { failedFit, fitInput, fitWithZero } from "./figureFixtures.ts";

describe("profileFitFigure", () => {
  it("profileFitFigure matches its snapshot on the linear and the log scale", () => {
    expect(profileFitFigure(fitInput, "linear")).toMatchSnapshot();
    expect(profileFitFigure(fitInput, "log")).toMatchSnapshot();
  });

  it("profileFitFigure states λ ± SE in the legend with the SE's two significant figures", () => {
    // 25.04 ± 1.23 → two significant figures of the SE give one decimal (common practice, no source).
    expect(dataset(profileFitFigure(fitInput), "exponential fit").label).toContain("λ = 25.0 ± 1.2 µm");
  });

  it("profileFitFigure on the log scale draws the exponential fit as a straight line of slope −1/λ", () => {
    // ln(A·e^(−x/λ)) = ln A − x/λ (textbook): the log of the curve falls linearly with slope −1/25 per µm.
    const config = profileFitFigure(fitInput, "log");
    expect((config.options?.scales?.y as { type: string }).type).toBe("logarithmic");
    const curve = dataset(config, "exponential fit").data;
    for (let i = 1; i < curve.length; i++) {
      const slope = (Math.log(curve[i].y) - Math.log(curve[i - 1].y)) / (curve[i].x - curve[i - 1].x);
      expect(slope).toBeCloseTo(-1 / 25, 5);
    }
  });

  it("profileFitFigure leaves non-positive intensities off the log scale and says how many", () => {
    const config = profileFitFigure(fitWithZero, "log");
    const measured = dataset(config, "measured intensity");
    expect(measured.label).toContain("1 point(s) ≤ 0 not shown");
    expect(measured.data.every((p) => p.y > 0)).toBe(true);
    const linear = profileFitFigure(fitWithZero, "linear");
    expect(dataset(linear, "measured intensity").data.length + dataset(linear, "outside the fit window").data.length).toBe(9);
  });

  it("profileFitFigure shows points outside the fit window apart from those fitted", () => {
    // The fit used x ≥ 10 µm, so the point at 0 µm lies outside its window.
    expect(dataset(profileFitFigure(fitInput), "outside the fit window").data).toEqual([{ x: 0, y: 101.5 }]);
  });

  it("profileFitFigure of a failed fit shows the data, the status and why, and no curve", () => {
    const config = profileFitFigure(failedFit);
    expect(titleOf(config)).toContain("no-decay");
    expect(config.data.datasets).toHaveLength(1);
    expect(config.data.datasets[0].label).toContain("the profile does not decay");
  });
});
