import { createCanvas, GlobalFonts, SvgExportFlag } from "@napi-rs/canvas";
import { Chart, registerables, type ChartConfiguration } from "chart.js";
import { existsSync } from "node:fs";
import { FIGURE_FONT, FIGURE_SIZE } from "../../client/figures/figureTheme.ts";

Chart.register(...registerables);

const FONT_FILES = ["/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf", "/usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf"];
let fontsReady = false;

function registerFonts(): void {
  if (fontsReady) return;
  for (const f of FONT_FILES) if (existsSync(f)) GlobalFonts.registerFromPath(f, FIGURE_FONT);
  Chart.defaults.font.family = FIGURE_FONT;
  fontsReady = true;
}

export interface RenderOptions {
  format: "png" | "svg";
  /** Raster resolution for PNG; the figure is 6.5 × 4 inches. */
  dpi?: number;
}

/**
 * Render a figure's Chart.js configuration — the same object the browser
 * draws — to PNG (at `dpi`, 300 by default) or SVG (text as paths, so it looks
 * the same without the font installed).
 */
export function renderChart(config: ChartConfiguration, options: RenderOptions): Buffer {
  registerFonts();
  const { width, height } = FIGURE_SIZE;
  const svg = options.format === "svg";
  const svgCanvas = svg ? createCanvas(width, height, SvgExportFlag.ConvertTextToPaths) : null;
  const pngCanvas = svg ? null : createCanvas(width, height);
  const canvas = svgCanvas ?? pngCanvas!;
  const dpr = svg ? 1 : (options.dpi ?? 300) / 100;
  const chart = new Chart(canvas as unknown as HTMLCanvasElement, {
    ...config,
    options: { ...(config.options ?? {}), responsive: false, animation: false, devicePixelRatio: dpr },
  } as ChartConfiguration);
  try {
    return svgCanvas ? Buffer.from(svgCanvas.getContent()) : pngCanvas!.toBuffer("image/png");
  } finally {
    chart.destroy();
  }
}
