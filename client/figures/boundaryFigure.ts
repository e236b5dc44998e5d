import { chartPoints, segmentPoints } from "./chartPoints.ts";
import { lineDataset, pointDataset } from "./datasetStyles.ts";
import type { PrecisionFigureInput } from "./figureInputs.ts";
import { formatNumber } from "./figureNumbers.ts";
import { INK, SERIES_COLOURS } from "./palette.ts";
import { precisionAxes, precisionLabel } from "./precisionAxes.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/**
 * Where each embryo's profile first crosses the common threshold, embryos
 * ranked by that position, with the mean and ± one SD marked: the SD is the
 * boundary's positional variability (for small noise it equals σ_x there).
 */
export function boundaryFigure(precision: PrecisionFigureInput): FigureConfig {
  const a = precisionAxes(precision);
  const b = precision.boundary;
  const crossings = b
    ? Object.entries(b.positions)
        .filter((e): e is [string, number] => e[1] !== null && Number.isFinite(e[1]))
        .sort((p, q) => p[1] - q[1] || p[0].localeCompare(q[0]))
    : [];
  const n = crossings.length;
  const datasets = [pointDataset(`embryo boundary (${n} embryos${b?.never_cross.length ? `; ${b.never_cross.length} never cross` : ""})`, chartPoints(crossings.map((c) => c[1]), crossings.map((_, i) => i + 1)), SERIES_COLOURS[0], 3)];
  const top = n + 1;
  if (b && b.mean_position !== null) {
    const m = b.mean_position;
    datasets.push(lineDataset(`mean ${formatNumber(m)} ${a.lengthUnit}`, segmentPoints([[{ x: m, y: 0 }, { x: m, y: top }]]), INK, { width: 1.5 }));
    if (b.sd !== null) {
      const s = b.sd;
      datasets.push(lineDataset(`± 1 SD = ${formatNumber(s)} ${a.lengthUnit}`, segmentPoints([[{ x: m - s, y: 0 }, { x: m - s, y: top }], [{ x: m + s, y: 0 }, { x: m + s, y: top }]]), SERIES_COLOURS[1], { width: 1.5, dash: [5, 3] }));
    }
  }
  return scatterConfig({
    title: `Boundary positions at ${b ? formatNumber(b.threshold) : "—"} a.u. (${precisionLabel(precision)})`,
    datasets,
    x: { title: a.absolute ? "boundary position from source (µm)" : "boundary position, x/L (fraction of length)" },
    y: { title: "embryo, ranked by boundary position (rank)", min: 0, max: top },
  });
}
