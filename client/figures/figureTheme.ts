import type { ChartConfiguration, Plugin } from "chart.js";
import { BACKGROUND, GRID, INK } from "./palette.ts";

/** The font every figure uses, in the browser and when rendered on the server. */
export const FIGURE_FONT = "DejaVu Sans";

/** Figure size in CSS pixels (at 100 dpi: 6.5 × 4 inches). */
export const FIGURE_SIZE = { width: 650, height: 400 };

/** Paints the background before anything else, so exported PNG/SVG files are not transparent. */
export const backgroundPlugin: Plugin = {
  id: "morphogaugeBackground",
  beforeDraw(chart) {
    const { ctx, width, height } = chart;
    ctx.save();
    ctx.globalCompositeOperation = "destination-over";
    ctx.fillStyle = BACKGROUND;
    ctx.fillRect(0, 0, width, height);
    ctx.restore();
  },
};

/** Options every figure shares: fixed size, no animation, explicit font, readable ink. */
export function baseOptions(title: string) {
  return {
    responsive: false,
    maintainAspectRatio: false,
    animation: false as const,
    font: { family: FIGURE_FONT },
    color: INK,
    plugins: {
      title: { display: true, text: title, color: INK, font: { family: FIGURE_FONT, size: 14, weight: "bold" as const } },
      legend: { display: true, labels: { color: INK, font: { family: FIGURE_FONT, size: 11 } } },
    },
  };
}

/** An axis with a title (which must carry the unit) and the shared styling. */
export function axis(title: string, extra: Record<string, unknown> = {}) {
  return {
    title: { display: true, text: title, color: INK, font: { family: FIGURE_FONT, size: 12 } },
    ticks: { color: INK, font: { family: FIGURE_FONT, size: 10 } },
    grid: { color: GRID },
    ...extra,
  };
}

/** Finish a configuration: attach the background plugin. */
export function finishConfig<T extends ChartConfiguration>(config: T): T {
  return { ...config, plugins: [...(config.plugins ?? []), backgroundPlugin] };
}
