import { chartPoints } from "./chartPoints.ts";
import { bandDatasets, lineDataset } from "./datasetStyles.ts";
import type { PrecisionFigureInput } from "./figureInputs.ts";
import { formatNumber } from "./figureNumbers.ts";
import { SERIES_COLOURS } from "./palette.ts";
import { precisionAxes, precisionLabel } from "./precisionAxes.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/**
 * Positional error σ_x(x) = σ_c(x)/|dc̄/dx| (Gregor, Tank, Wieschaus, Bialek
 * 2007, Cell) with its bootstrap 95% band; masked positions (flat gradient,
 * no spread) are gaps. The legend states the headline σ_x over the stated region. The joint σ_x of several channels, when present, is
 * drawn beside it.
 */
export function sigmaXFigure(precision: PrecisionFigureInput): FigureConfig {
  const a = precisionAxes(precision);
  const x = precision.x;
  const ci = precision.sigma_x_ci95;
  const colour = SERIES_COLOURS[0];
  const summary = precision.sigma_x_summary;
  const region = precision.information_region;
  const minText = summary && region ? ` (${formatNumber(summary.value)} ${a.lengthUnit} over ${formatNumber(region.from)}–${formatNumber(region.to)} ${a.lengthUnit})` : "";
  const datasets = [
    ...bandDatasets("bootstrap 95% CI", chartPoints(x, ci.map((c) => (c ? c[0] : null))), chartPoints(x, ci.map((c) => (c ? c[1] : null))), colour),
    lineDataset(`σ_x, ${precision.channel}${minText}`, chartPoints(x, precision.sigma_x), colour),
  ];
  const joint = precision.joint;
  if (joint) datasets.push(lineDataset(`joint σ_x, ${joint.channels.join(" + ")}`, chartPoints(joint.x, joint.sigma_x), SERIES_COLOURS[1], { dash: [6, 3] }));
  return scatterConfig({
    title: `Positional error (${precisionLabel(precision)})`,
    datasets,
    x: { title: a.position },
    y: { title: a.absolute ? "positional error σ_x (µm)" : "positional error σ_x (fraction of length)", min: 0 },
  });
}
