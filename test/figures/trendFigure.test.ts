import { describe, expect, it } from "vitest";
import { trendFigure } from "../../client/figures/trendFigure.ts";
import { axisTitles, dataset } from "../helpers/figureConfig.ts";
import { dosageTracking, lengthTracking, stageTracking, timeTracking } from "./figureFixtures.ts";

describe("trendFigure", () => {
  it("trendFigure matches its snapshots over age, stage, dosage and length", () => {
    expect(trendFigure(timeTracking)).toMatchSnapshot();
    expect(trendFigure(stageTracking)).toMatchSnapshot();
    expect(trendFigure(dosageTracking)).toMatchSnapshot();
    expect(trendFigure(lengthTracking)).toMatchSnapshot();
  });

  it("trendFigure over age draws the linear trend from the first to the last embryo", () => {
    // y = 16 + t/150: 20 at 600 s and 28 at 1800 s (worked by hand).
    expect(dataset(trendFigure(timeTracking), "wt: linear trend").data).toEqual([{ x: 600, y: 20 }, { x: 1800, y: 28 }]);
    expect(axisTitles(trendFigure(timeTracking))).toEqual(["age (s)", "decay length λ (µm)"]);
  });

  it("trendFigure over age draws the saturating trend y∞ + (y0 − y∞)·e^(−(t − t0)/τ)", () => {
    const curve = dataset(trendFigure(timeTracking), "mut: saturating trend").data;
    expect(curve[0]).toEqual({ x: 600, y: Number((20 - 20 * Math.exp(-1)).toPrecision(6)) });
    expect(curve.at(-1)!.x).toBe(2400);
    expect(curve.at(-1)!.y).toBeCloseTo(20 - 20 * Math.exp(-4), 3);
  });

  it("trendFigure over stage labels puts the bins in columns named by their labels", () => {
    const config = trendFigure(stageTracking);
    expect(dataset(config, "wt bin mean").data).toEqual([{ x: 0, y: 50 }, { x: 1, y: 60 }]);
    expect(axisTitles(config)).toEqual(["stage (label)", "boundary position from source (µm)"]);
  });

  it("trendFigure over dosage draws boundary = x_b(1) + λ·ln f with both λ estimates in the legend", () => {
    // The boundary shift Δx = λ·ln f for an exponential read at a fixed threshold (Driever & Nüsslein-Volhard 1988, Cell; Houchmandzadeh, Wieschaus, Leibler 2002, Nature).
    const config = trendFigure(dosageTracking);
    const line = dataset(config, "regression: λ from boundary shift = 25.0 ± 1.0 µm");
    expect(line.data[0].x).toBeCloseTo(Math.log(0.5), 5);
    expect(line.data[0].y).toBeCloseTo(50 + 25 * Math.log(0.5), 3);
    expect(line.data[1].y).toBeCloseTo(50 + 25 * Math.log(2), 3);
    expect(dataset(config, "slope expected from λ of the profile fits = 24.00 ± 0.80 µm").data[1].y).toBeCloseTo(50 + 24 * Math.log(2), 3);
    expect(dataset(config, "embryos (n = 4)").data).toHaveLength(4);
  });

  it("trendFigure over length draws λ = e^a·L^β on log–log axes", () => {
    const config = trendFigure(lengthTracking);
    const line = dataset(config, "wt: log–log slope 1.00 ± 0.10");
    // e^(ln 0.05)·400 = 20 and ·600 = 30.
    expect(line.data[0].y).toBeCloseTo(20, 4);
    expect(line.data[1].y).toBeCloseTo(30, 4);
    expect(Object.values(config.options!.scales!).map((s) => (s as { type: string }).type)).toEqual(["logarithmic", "logarithmic"]);
  });
});
