import { chartPoints } from "./chartPoints.ts";
import { lineDataset, pointDataset, type FigureDataset } from "./datasetStyles.ts";
import type { FrapFigureInput } from "./dynamicsInputs.ts";
import { formatWithError } from "./figureNumbers.ts";
import { seriesColour, withAlpha } from "./palette.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/** Normalised FRAP recovery curves (points) with their fitted models (lines), one colour per cell. */
export function frapRecoveryFigure(f: FrapFigureInput): FigureConfig {
  const datasets: FigureDataset[] = [];
  f.curves.forEach((c, i) => {
    const colour = seriesColour(i);
    datasets.push(pointDataset(`${c.name}${c.D_um2_per_s ? `: D = ${formatWithError(c.D_um2_per_s.value, c.D_um2_per_s.se, "µm²/s")}` : ""}`, chartPoints(c.points.map((p) => p.t_s), c.points.map((p) => p.value)), withAlpha(colour, 0.5), 1.8));
    const fitted = c.points.filter((p) => p.fitted !== null);
    if (fitted.length) datasets.push(lineDataset("", chartPoints(fitted.map((p) => p.t_s), fitted.map((p) => p.fitted)), colour, { width: 2 }));
  });
  const d = f.D_um2_per_s;
  return scatterConfig({
    title: `FRAP recovery${d ? `: D = ${formatWithError(d.value, d.se, "µm²/s")}` : ""}`,
    datasets,
    x: { title: "time after bleach (s)" },
    y: { title: "normalised intensity (pre-bleach = 1)" },
  });
}

/** Residuals of the FRAP fits against time. */
export function frapResidualFigure(f: FrapFigureInput): FigureConfig {
  const datasets = f.curves
    .filter((c) => c.points.some((p) => p.fitted !== null))
    .map((c, i) => {
      const pts = c.points.filter((p) => p.fitted !== null);
      return pointDataset(c.name, chartPoints(pts.map((p) => p.t_s), pts.map((p) => p.value - p.fitted!)), withAlpha(seriesColour(i), 0.7), 1.8);
    });
  return scatterConfig({ title: "Residuals of the FRAP fits", datasets, x: { title: "time after bleach (s)" }, y: { title: "observed − fitted (pre-bleach = 1)" } });
}
