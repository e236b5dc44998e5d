import { describe, expect, it } from "vitest";
import { powerFigure } from "../../client/figures/powerFigure.ts";
import { dataset, titleOf } from "../helpers/figureConfig.ts";
import { planInput } from "./figureFixtures.ts";

describe("powerFigure", () => {
  it("powerFigure matches its snapshot", () => {
    expect(powerFigure(planInput)).toMatchSnapshot();
  });

  it("powerFigure plots exact, Welch and permutation power in order of n, with the target line and the required n", () => {
    const config = powerFigure(planInput);
    expect(dataset(config, "exact").data).toEqual([{ x: 3, y: 0.55 }, { x: 4, y: 0.76 }, { x: 5, y: 0.88 }]);
    expect(dataset(config, "simulated, Welch's t").data.map((p) => p.y)).toEqual([0.47, 0.72, 0.86]);
    expect(dataset(config, "simulated, permutation test").data.map((p) => p.y)).toEqual([0, 0.64, 0.87]);
    expect(dataset(config, "target power 0.80").data).toEqual([{ x: 3, y: 0.8 }, { x: 5, y: 0.8 }]);
    expect(dataset(config, "required: 5 embryos per group").data).toEqual([{ x: 5, y: 0.88 }]);
    expect(titleOf(config)).toContain("+15.0% change in mean λ");
  });

  it("powerFigure of a spread plan names the F-test", () => {
    expect(dataset(powerFigure({ ...planInput, quantity: "spread", metric: "sigma_x" }), "exact (F-test)")).toBeTruthy();
  });
});
