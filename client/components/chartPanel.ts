import { Chart, registerables, type ChartConfiguration } from "chart.js";
import { FIGURE_SIZE } from "../figures/figureTheme.ts";
import { el } from "./el.ts";

Chart.register(...registerables);

/** Which stored result a figure shows, for the server's PNG/SVG export of the same figure. */
export interface FigureSource {
  kind: string;
  /** `fit=ID` or `analysis=ID`, plus any figure option such as `scale=log`. */
  query: Record<string, string | number>;
}

/** Export link of a figure in one format. */
export function figureUrl(source: FigureSource, format: "png" | "svg"): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(source.query)) params.set(k, String(v));
  params.set("format", format);
  return `api/figures/${source.kind}?${params.toString()}`;
}

/**
 * A figure drawn by Chart.js from a configuration the figure builders made,
 * with download links for the server-rendered PNG (300 dpi) and SVG of the same figure.
 */
export function chartPanel(title: string, config: ChartConfiguration, source: FigureSource, caption?: string): HTMLElement {
  const canvas = el("canvas", { role: "img", "aria-label": title, width: FIGURE_SIZE.width, height: FIGURE_SIZE.height, "data-figure": source.kind });
  const panel = el(
    "figure",
    { class: "chart-panel", "data-figure": source.kind },
    el("div", { class: "chart-box" }, canvas),
    el(
      "figcaption",
      {},
      caption ? el("span", { class: "caption" }, caption) : null,
      el(
        "span",
        { class: "figure-actions" },
        el("a", { class: "btn btn-secondary", href: figureUrl(source, "png"), download: "", "data-role": "png" }, "PNG (300 dpi)"),
        el("a", { class: "btn btn-secondary", href: figureUrl(source, "svg"), download: "", "data-role": "svg" }, "SVG"),
      ),
    ),
  );
  drawWhenShown(canvas, config);
  return panel;
}

/** Frames to wait for a panel to be put in the page before giving up on it. */
const MAX_WAIT_FRAMES = 120;

/** Chart.js measures its canvas, so draw once the panel is in the page. */
function drawWhenShown(canvas: HTMLCanvasElement, config: ChartConfiguration, frames = 0): void {
  if (canvas.isConnected) {
    new Chart(canvas, config);
    return;
  }
  if (frames < MAX_WAIT_FRAMES) requestAnimationFrame(() => drawWhenShown(canvas, config, frames + 1));
}

/** Free the charts inside an element before it is thrown away. */
export function destroyCharts(root: Element): void {
  for (const canvas of root.querySelectorAll("canvas")) Chart.getChart(canvas)?.destroy();
}
