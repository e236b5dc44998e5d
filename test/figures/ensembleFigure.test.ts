import { describe, expect, it } from "vitest";
import { ensembleFigure } from "../../client/figures/ensembleFigure.ts";
import { axisTitles, dataset } from "../helpers/figureConfig.ts";
import { precisionInput, relativePrecision } from "./figureFixtures.ts";

describe("ensembleFigure", () => {
  it("ensembleFigure matches its snapshot", () => {
    expect(ensembleFigure(precisionInput)).toMatchSnapshot();
  });

  it("ensembleFigure shades mean − SD to mean + SD, the upper edge filling down to the lower", () => {
    const config = ensembleFigure(precisionInput);
    const upper = dataset(config, "± 1 SD");
    const lower = config.data.datasets[config.data.datasets.indexOf(upper) - 1];
    expect(upper.fill).toBe("-1");
    expect(lower.label).toBe("");
    expect(upper.data.map((p) => p.y)).toEqual([110, 74, 50, 33, 22]);
    expect(lower.data.map((p) => p.y)).toEqual([90, 60, 40, 27, 18]);
  });

  it("ensembleFigure names relative coordinates and the normalisation in its axis titles", () => {
    expect(axisTitles(ensembleFigure(relativePrecision))).toEqual(["position from source, x/L (fraction of length)", "intensity, minmax normalised (a.u.)"]);
  });
});
