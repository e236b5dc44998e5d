import { describe, expect, it } from "vitest";
import { boundaryFigure } from "../../client/figures/boundaryFigure.ts";
import { dataset, titleOf } from "../helpers/figureConfig.ts";
import { precisionInput } from "./figureFixtures.ts";

describe("boundaryFigure", () => {
  it("boundaryFigure matches its snapshot", () => {
    expect(boundaryFigure(precisionInput)).toMatchSnapshot();
  });

  it("boundaryFigure ranks the embryos that cross by position and counts those that never cross", () => {
    const points = dataset(boundaryFigure(precisionInput), "embryo boundary");
    expect(points.data).toEqual([{ x: 19, y: 1 }, { x: 24, y: 2 }, { x: 27, y: 3 }]);
    expect(points.label).toBe("embryo boundary (3 embryos; 1 never cross)");
  });

  it("boundaryFigure marks the mean and mean ± SD as vertical lines", () => {
    const config = boundaryFigure(precisionInput);
    expect(dataset(config, "mean").data.filter((p) => !Number.isNaN(p.y)).map((p) => p.x)).toEqual([23.3333, 23.3333]);
    // 23.333333 ∓ 4.041452 = 19.291881 and 27.374785, rounded to six significant figures.
    expect(dataset(config, "± 1 SD").data.filter((p) => !Number.isNaN(p.y)).map((p) => p.x)).toEqual([19.2919, 19.2919, 27.3748, 27.3748]);
    expect(titleOf(config)).toContain("at 40.0 a.u.");
  });
});
