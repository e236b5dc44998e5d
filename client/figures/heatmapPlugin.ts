import type { Chart, Plugin } from "chart.js";
import { FIGURE_FONT } from "./figureTheme.ts";
import { INK } from "./palette.ts";
import { sequentialColour } from "./sequentialColour.ts";

/** What the heat map draws, kept in options.plugins.morphogaugeHeatmap so it is part of the configuration. */
export interface HeatmapOptions {
  /** Cell centres along x and y (data units). */
  x: readonly number[];
  y: readonly number[];
  /** values[i][j] at (x[i], y[j]). */
  values: readonly (readonly number[])[];
  /** Value drawn darkest; 0 is the background colour. */
  max: number;
  /** Title of the colour legend, with its unit. */
  legendTitle: string;
}

/** Cell edges halfway between neighbouring centres (the outer cells as wide as their neighbour gap). */
function edges(c: readonly number[]): number[] {
  if (c.length === 1) return [c[0] - 0.5, c[0] + 0.5];
  const e = [c[0] - (c[1] - c[0]) / 2];
  for (let i = 0; i + 1 < c.length; i++) e.push((c[i] + c[i + 1]) / 2);
  e.push(c[c.length - 1] + (c[c.length - 1] - c[c.length - 2]) / 2);
  return e;
}

const BAR_STEPS = 64;

function drawColourLegend(chart: Chart, o: HeatmapOptions): void {
  const { ctx, chartArea } = chart;
  const left = chartArea.right + 14;
  const width = 12;
  const h = chartArea.bottom - chartArea.top;
  for (let s = 0; s < BAR_STEPS; s++) {
    ctx.fillStyle = sequentialColour((s + 0.5) / BAR_STEPS);
    const y0 = chartArea.bottom - ((s + 1) * h) / BAR_STEPS;
    ctx.fillRect(left, y0, width, h / BAR_STEPS + 0.5);
  }
  ctx.strokeStyle = INK;
  ctx.lineWidth = 0.5;
  ctx.strokeRect(left, chartArea.top, width, h);
  ctx.fillStyle = INK;
  ctx.font = `10px "${FIGURE_FONT}"`;
  ctx.textAlign = "left";
  ctx.textBaseline = "middle";
  ctx.fillText(String(Number(o.max.toPrecision(2))), left + width + 3, chartArea.top);
  ctx.fillText(String(Number((o.max / 2).toPrecision(2))), left + width + 3, chartArea.top + h / 2);
  ctx.fillText("0", left + width + 3, chartArea.bottom);
  ctx.save();
  ctx.translate(left + width + 34, chartArea.top + h / 2);
  ctx.rotate(-Math.PI / 2);
  ctx.textAlign = "center";
  ctx.font = `11px "${FIGURE_FONT}"`;
  ctx.fillText(o.legendTitle, 0, 0);
  ctx.restore();
}

/**
 * Draws a matrix of values as coloured cells under the datasets, and its
 * colour legend to the right of the chart area (keep ~70 px of right padding).
 */
export const heatmapPlugin: Plugin<"scatter"> = {
  id: "morphogaugeHeatmap",
  beforeDatasetsDraw(chart, _args, options) {
    const o = options as unknown as HeatmapOptions;
    if (!o || !o.values?.length) return;
    const { ctx, chartArea, scales } = chart;
    const ex = edges(o.x);
    const ey = edges(o.y);
    ctx.save();
    ctx.beginPath();
    ctx.rect(chartArea.left, chartArea.top, chartArea.right - chartArea.left, chartArea.bottom - chartArea.top);
    ctx.clip();
    for (let i = 0; i < o.x.length; i++) {
      const x0 = scales.x.getPixelForValue(ex[i]);
      const x1 = scales.x.getPixelForValue(ex[i + 1]);
      for (let j = 0; j < o.y.length; j++) {
        const v = o.values[i]?.[j] ?? 0;
        if (!(v > 0)) continue;
        const y0 = scales.y.getPixelForValue(ey[j]);
        const y1 = scales.y.getPixelForValue(ey[j + 1]);
        ctx.fillStyle = sequentialColour(v / o.max);
        // Half a pixel of overlap so neighbouring cells leave no hairline seams.
        ctx.fillRect(Math.min(x0, x1), Math.min(y0, y1), Math.abs(x1 - x0) + 0.5, Math.abs(y1 - y0) + 0.5);
      }
    }
    ctx.restore();
    ctx.save();
    drawColourLegend(chart, o);
    ctx.restore();
  },
};
