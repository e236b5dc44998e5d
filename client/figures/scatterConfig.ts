import type { ChartConfiguration, Plugin } from "chart.js";
import type { ChartPoint } from "./chartPoints.ts";
import type { FigureDataset } from "./datasetStyles.ts";
import { axis, baseOptions, finishConfig } from "./figureTheme.ts";

/** Every figure is a Chart.js scatter chart (lines are scatter datasets with showLine). */
export type FigureConfig = ChartConfiguration<"scatter", ChartPoint[]>;

export interface AxisSpec {
  /** Title with its unit, e.g. "position from source (µm)". */
  title: string;
  type?: "linear" | "logarithmic";
  min?: number;
  max?: number;
  /** Tick labels for categorical positions 0, 1, 2, … on a linear axis. */
  categories?: readonly string[];
}

/** Datasets without a label (band edges) stay out of the legend. */
export function labelledOnly(item: { text: string }): boolean {
  return item.text !== "";
}

function scale(spec: AxisSpec) {
  const categories = spec.categories;
  const extra: Record<string, unknown> = { type: spec.type ?? "linear" };
  if (spec.min !== undefined) extra.min = spec.min;
  if (spec.max !== undefined) extra.max = spec.max;
  const base = axis(spec.title, extra);
  // A fixed end is not a round number; leave it unlabelled rather than print 283.6.
  if (spec.min !== undefined || spec.max !== undefined) base.ticks = { ...base.ticks, includeBounds: false } as typeof base.ticks;
  if (!categories) return base;
  return {
    ...base,
    ticks: { ...base.ticks, stepSize: 1, autoSkip: false, callback: (v: number | string) => categories[Number(v)] ?? "" },
  };
}

export interface FigureSpec {
  title: string;
  datasets: FigureDataset[];
  x: AxisSpec;
  y: AxisSpec;
  /** Space kept free around the chart area, in px (e.g. for a colour legend). */
  padding?: { right?: number };
  /** Plugins drawn with this figure only, with their options under options.plugins[id]. */
  plugins?: { plugin: Plugin<"scatter">; options: Record<string, unknown> }[];
}

/** Assemble a figure from its datasets and axes with the shared theme. */
export function scatterConfig(spec: FigureSpec): FigureConfig {
  const base = baseOptions(spec.title);
  const pluginOptions = Object.fromEntries((spec.plugins ?? []).map((p) => [p.plugin.id, p.options]));
  const config = {
    type: "scatter" as const,
    data: { datasets: spec.datasets },
    options: {
      ...base,
      layout: { padding: { top: 4, left: 4, bottom: 4, right: 8 + (spec.padding?.right ?? 0) } },
      plugins: {
        ...base.plugins,
        legend: { ...base.plugins.legend, labels: { ...base.plugins.legend.labels, filter: labelledOnly, usePointStyle: true, boxHeight: 9 } },
        ...pluginOptions,
      },
      scales: { x: scale(spec.x), y: scale(spec.y) },
    },
    plugins: (spec.plugins ?? []).map((p) => p.plugin),
  };
  return finishConfig(config as unknown as FigureConfig);
}
