import { describe, expect, it } from "vitest";
import type { ChartConfiguration } from "chart.js";
import { buildFigure, FIGURE_KINDS } from "../../client/figures/figureRegistry.ts";
import { renderChart } from "../../server/figures/renderChart.ts";
import { pngSize } from "../helpers/pngSize.ts";
import { fixtureFor } from "./figureFixturesByKind.ts";

describe("server-side rendering of every figure", () => {
  for (const kind of FIGURE_KINDS) {
    it(`${kind} renders to a 1950 × 1200 PNG at 300 dpi and a 650 × 400 SVG`, () => {
      const config = buildFigure(kind, fixtureFor(kind) as never) as unknown as ChartConfiguration;
      const png = renderChart(config, { format: "png", dpi: 300 });
      // 6.5 × 4 inches at 300 dpi (FIGURE_SIZE at 100 px per inch).
      expect(pngSize(png)).toEqual({ width: 1950, height: 1200 });
      expect(png.length).toBeGreaterThan(10_000);
      const svg = renderChart(config, { format: "svg" }).toString("utf8");
      expect(svg.startsWith("<?xml") || svg.startsWith("<svg")).toBe(true);
      expect(svg).toMatch(/<svg[^>]*width="650"[^>]*height="400"/);
      expect(svg.length).toBeGreaterThan(1000);
    });
  }
});
