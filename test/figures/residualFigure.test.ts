import { describe, expect, it } from "vitest";
import { residualFigure } from "../../client/figures/residualFigure.ts";
import { dataset } from "../helpers/figureConfig.ts";
import { fitInput } from "./figureFixtures.ts";

describe("residualFigure", () => {
  it("residualFigure matches its snapshot", () => {
    expect(residualFigure(fitInput)).toMatchSnapshot();
  });

  it("residualFigure draws a zero line across the fitted range and the RMS of the residuals", () => {
    const config = residualFigure(fitInput);
    expect(dataset(config, "zero").data).toEqual([{ x: 10, y: 0 }, { x: 80, y: 0 }]);
    // RMS of −2, 0.5, 1, −1, 0.5, −0.5, 0.25, −0.25 = √(6.875/8) = 0.927 (worked by hand).
    expect(dataset(config, "residual").label).toBe("residual (RMS 0.927 a.u.)");
  });
});
