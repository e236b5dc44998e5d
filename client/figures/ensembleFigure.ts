import { chartPoints } from "./chartPoints.ts";
import { bandDatasets, lineDataset } from "./datasetStyles.ts";
import type { PrecisionFigureInput } from "./figureInputs.ts";
import { SERIES_COLOURS } from "./palette.ts";
import { precisionAxes, precisionLabel } from "./precisionAxes.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/** The group's mean profile with a band of ± one embryo-to-embryo SD: the raw material of σ_x. */
export function ensembleFigure(precision: PrecisionFigureInput): FigureConfig {
  const a = precisionAxes(precision);
  const x = precision.x;
  const mean = precision.mean_intensity;
  const sd = precision.sd_intensity;
  const lower = x.map((_, i) => mean[i] - sd[i]);
  const upper = x.map((_, i) => mean[i] + sd[i]);
  const colour = SERIES_COLOURS[0];
  return scatterConfig({
    title: `Mean profile ± SD across embryos (${precisionLabel(precision)})`,
    datasets: [
      ...bandDatasets("± 1 SD across embryos", chartPoints(x, lower), chartPoints(x, upper), colour),
      lineDataset(`mean intensity${precision.normalisation === "none" ? "" : ` (${precision.normalisation} normalised)`}`, chartPoints(x, mean), colour),
    ],
    x: { title: a.position },
    y: { title: a.intensity },
  });
}
