import { chartPoints } from "./chartPoints.ts";
import { lineDataset, pointDataset } from "./datasetStyles.ts";
import type { FitFigureInput } from "./figureInputs.ts";
import { formatNumber } from "./figureNumbers.ts";
import { INK, SERIES_COLOURS } from "./palette.ts";
import { profileLabel } from "./profileFitFigure.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/**
 * Residuals (measured − fitted, a.u.) against position with the zero line: a
 * good fit leaves them scattered evenly about zero; a systematic bend means
 * the model misses the shape (e.g. an exponential fitted to a power law).
 */
export function residualFigure(fit: FitFigureInput): FigureConfig {
  const f = fit.result.fit;
  const x = f.xUm ?? [];
  const r = f.residuals ?? [];
  const rms = r.length ? Math.sqrt(r.reduce((s, v) => s + v * v, 0) / r.length) : NaN;
  const ends = x.length ? [x[0], x[x.length - 1]] : [0, 1];
  return scatterConfig({
    title: `${profileLabel(fit)}: residuals of the ${f.model} fit${f.ok ? "" : ` (${f.status}, none)`}`,
    datasets: [
      pointDataset(`residual (RMS ${formatNumber(rms)} a.u.)`, chartPoints(x, r), SERIES_COLOURS[0]),
      lineDataset("zero", chartPoints(ends, [0, 0]), INK, { width: 1, dash: [4, 3] }),
    ],
    x: { title: "position from source (µm)" },
    y: { title: "residual, measured − fitted (a.u.)" },
  });
}
