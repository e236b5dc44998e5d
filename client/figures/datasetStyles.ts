import type { ChartDataset } from "chart.js";
import type { ChartPoint } from "./chartPoints.ts";
import { BAND_ALPHA, withAlpha } from "./palette.ts";

export type FigureDataset = ChartDataset<"scatter", ChartPoint[]>;

/** Measured values as filled markers (no outline, which would double their size in SVG), not joined. */
export function pointDataset(label: string, data: ChartPoint[], colour: string, radius = 2.5): FigureDataset {
  return { label, data, showLine: false, pointRadius: radius, pointBorderWidth: 0, pointHoverRadius: radius + 1, pointBackgroundColor: colour, pointBorderColor: colour, backgroundColor: colour, borderColor: colour };
}

/** A curve (fit, mean, trend): joined, no markers, broken at gaps. */
export function lineDataset(label: string, data: ChartPoint[], colour: string, options: { width?: number; dash?: number[] } = {}): FigureDataset {
  return {
    label, data, showLine: true, spanGaps: false, pointRadius: 0, pointHoverRadius: 0,
    borderWidth: options.width ?? 2, borderDash: options.dash ?? [], borderColor: colour, backgroundColor: colour, fill: false,
    // Shown only in the legend (the curve has no markers): a short line in the curve's own dash.
    pointStyle: "line",
  };
}

/**
 * A shaded band between two bounds (SD, confidence interval): the lower edge
 * has no label (so the legend leaves it out) and the upper edge fills down to
 * it; gaps in the bounds leave gaps in the band.
 */
export function bandDatasets(label: string, lower: ChartPoint[], upper: ChartPoint[], colour: string): FigureDataset[] {
  const edge = { pointStyle: "rect" as const, showLine: true, spanGaps: false, pointRadius: 0, pointHoverRadius: 0, borderWidth: 0, borderColor: withAlpha(colour, BAND_ALPHA), backgroundColor: withAlpha(colour, BAND_ALPHA) };
  return [
    { ...edge, label: "", data: lower, fill: false },
    { ...edge, label, data: upper, fill: "-1" },
  ];
}
