import { describe, expect, it } from "vitest";
import { accumulationTimeFigure, buildUpFigure, buildUpResidualFigure, frapRecoveryFigure, frapResidualFigure, profileLikelihoodFigure, simulationFigure } from "../../client/figures/index.ts";
import { axisTitles, dataset, titleOf } from "../helpers/figureConfig.ts";
import { buildUpInput, frapInput, simulationInput } from "./dynamicsFixtures.ts";

describe("dynamics figures", () => {
  it("match their snapshots", () => {
    expect(buildUpFigure(buildUpInput)).toMatchSnapshot();
    expect(profileLikelihoodFigure(buildUpInput)).toMatchSnapshot();
    expect(frapRecoveryFigure(frapInput)).toMatchSnapshot();
    expect(simulationFigure(simulationInput)).toMatchSnapshot();
  });

  it("buildUpFigure draws one point set and one fitted line per time, early times first", () => {
    const c = buildUpFigure(buildUpInput);
    expect(dataset(c, "10 min").data).toHaveLength(3);
    expect(dataset(c, "60 min").data).toHaveLength(3);
    expect(axisTitles(c)).toEqual(["position from source (µm)", "intensity (a.u.)"]);
  });

  it("buildUpResidualFigure plots observed − fitted (1 a.u. everywhere in the fixture)", () => {
    const c = buildUpResidualFigure(buildUpInput);
    for (const ds of c.data.datasets) for (const p of ds.data) expect(p.y).toBeCloseTo(1, 10);
  });

  it("profileLikelihoodFigure draws the χ²₁ 95% threshold 3.84 and names the interval", () => {
    // Source: χ²₁ 0.95 quantile = 3.841 (standard tables).
    const c = profileLikelihoodFigure(buildUpInput);
    expect(dataset(c, "95% threshold").data.map((p) => p.y)).toEqual([3.84146, 3.84146]);
    expect(titleOf(c)).toMatch(/\[0\.000150, 0\.000300\] 1\/s/);
  });

  it("accumulationTimeFigure shows τ in minutes with its interval band", () => {
    const c = accumulationTimeFigure(buildUpInput);
    expect(dataset(c, "τ(x)").data[0]).toEqual({ x: 0, y: Number((2500 / 60).toPrecision(6)) });
    expect(c.data.datasets.some((d) => d.label === "95% interval")).toBe(true);
  });

  it("frapResidualFigure plots observed − fitted (−0.01 in the fixture)", () => {
    for (const p of frapResidualFigure(frapInput).data.datasets[0].data) expect(p.y).toBeCloseTo(-0.01, 10);
  });
});
