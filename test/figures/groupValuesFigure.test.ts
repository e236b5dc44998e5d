import { describe, expect, it } from "vitest";
import { groupValuesFigure, jitter } from "../../client/figures/groupValuesFigure.ts";
import { axisTitles, dataset } from "../helpers/figureConfig.ts";
import { comparisonInput, spreadComparison } from "./figureFixtures.ts";

describe("groupValuesFigure", () => {
  it("groupValuesFigure matches its snapshot", () => {
    expect(groupValuesFigure(comparisonInput)).toMatchSnapshot();
  });

  it("jitter is deterministic, stays within its width and does not repeat for the first 50 embryos", () => {
    const offsets = Array.from({ length: 50 }, (_, k) => jitter(k));
    expect(offsets).toEqual(Array.from({ length: 50 }, (_, k) => jitter(k)));
    expect(offsets.every((o) => Math.abs(o) <= 0.15)).toBe(true);
    expect(new Set(offsets.map((o) => o.toFixed(6))).size).toBe(50);
  });

  it("groupValuesFigure draws every embryo once in its group's column", () => {
    const config = groupValuesFigure(comparisonInput);
    const mut = dataset(config, "mut embryos");
    const wt = dataset(config, "wt embryos");
    expect(mut.data.map((p) => p.y)).toEqual([38, 40, 42]);
    expect(wt.data.map((p) => p.y)).toEqual([23, 25, 26, 26]);
    expect(mut.data.every((p) => Math.abs(p.x - 0) < 0.5)).toBe(true);
    expect(wt.data.every((p) => Math.abs(p.x - 1) < 0.5)).toBe(true);
  });

  it("groupValuesFigure marks each group mean with its 95% CI as an error bar", () => {
    const config = groupValuesFigure(comparisonInput);
    expect(dataset(config, "group mean ± 95% CI (t)").data).toEqual([{ x: 0.25, y: 40 }, { x: 1.25, y: 25 }]);
    const bars = config.data.datasets.find((d) => d.label === "" && d.showLine)!;
    expect(bars.data.filter((p) => !Number.isNaN(p.y))).toEqual([{ x: 0.25, y: 37.7 }, { x: 0.25, y: 42.3 }, { x: 1.25, y: 23.5 }, { x: 1.25, y: 26.5 }]);
  });

  it("groupValuesFigure shows the compared spread (boundary SD) when sigma_x is compared", () => {
    const config = groupValuesFigure(spreadComparison);
    expect(dataset(config, "boundary SD ± 95% CI").data.map((p) => p.y)).toEqual([6, 4]);
    expect(axisTitles(config)).toEqual(["genotype (group label)", "boundary SD across embryos (µm)"]);
  });
});
