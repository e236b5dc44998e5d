import { describe, expect, it } from "vitest";
import { decodingMapFigure } from "../../client/figures/decodingMapFigure.ts";
import type { HeatmapOptions } from "../../client/figures/heatmapPlugin.ts";
import { dataset, titleOf } from "../helpers/figureConfig.ts";
import { precisionInput, relativePrecision } from "./figureFixtures.ts";

const heat = (config: ReturnType<typeof decodingMapFigure>) => (config.options?.plugins as Record<string, unknown>).morphogaugeHeatmap as HeatmapOptions;

describe("decodingMapFigure", () => {
  it("decodingMapFigure matches its snapshot", () => {
    expect(decodingMapFigure(precisionInput)).toMatchSnapshot();
  });

  it("decodingMapFigure hands the probability matrix to its heat-map plugin, darkest at the largest probability", () => {
    const config = decodingMapFigure(precisionInput);
    const h = heat(config);
    expect(h.values).toEqual(precisionInput.decoding!.probability);
    expect(h.max).toBe(0.75);
    expect(h.legendTitle).toMatch(/\(.+\)/);
    expect(config.plugins?.some((p) => p.id === "morphogaugeHeatmap")).toBe(true);
  });

  it("decodingMapFigure draws the diagonal of perfect decoding and the mean decoded position", () => {
    const config = decodingMapFigure(precisionInput);
    expect(dataset(config, "perfect decoding").data).toEqual([{ x: 10, y: 10 }, { x: 30, y: 30 }]);
    expect(dataset(config, "mean decoded position").data.map((p) => p.y)).toEqual([12.5, 20, 27.5]);
    expect(titleOf(config)).toContain("RMS error 7.07 µm");
  });

  it("decodingMapFigure says so when no decoding map was computed", () => {
    const config = decodingMapFigure(relativePrecision);
    expect(titleOf(config)).toContain("not computed");
    expect(heat(config).values).toEqual([]);
  });
});
