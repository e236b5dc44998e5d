import { chartPoints } from "./chartPoints.ts";
import { lineDataset } from "./datasetStyles.ts";
import type { PrecisionFigureInput } from "./figureInputs.ts";
import { formatNumber, roundSignificant } from "./figureNumbers.ts";
import { heatmapPlugin, type HeatmapOptions } from "./heatmapPlugin.ts";
import { INK, SERIES_COLOURS } from "./palette.ts";
import { precisionAxes, precisionLabel } from "./precisionAxes.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/**
 * The decoding map: for each true position (x axis), the share of embryos
 * whose concentration there decodes to each position (y axis), as a heat map
 * with its colour legend; a perfect readout would lie on the diagonal
 * (Dubuis et al. 2013, PNAS; Tkačik, Dubuis, Petkova, Gregor 2015, Genetics).
 */
export function decodingMapFigure(precision: PrecisionFigureInput): FigureConfig {
  const a = precisionAxes(precision);
  const d = precision.decoding;
  const positions = d?.positions ?? [];
  const values = (d?.probability ?? []).map((row) => row.map((v) => roundSignificant(v, 4)));
  const max = values.reduce((m, row) => row.reduce((mm, v) => Math.max(mm, v), m), 0);
  const ends = positions.length ? [positions[0], positions[positions.length - 1]] : [0, 1];
  const heat: HeatmapOptions = { x: positions.map((v) => roundSignificant(v)), y: positions.map((v) => roundSignificant(v)), values, max: max > 0 ? max : 1, legendTitle: "probability (fraction of embryos)" };
  const half = positions.length > 1 ? (positions[1] - positions[0]) / 2 : 0.5;
  const rms = d?.rmsError;
  return scatterConfig({
    title: d
      ? `Decoding map (${precisionLabel(precision)}${d.leaveOneOut ? ", leave-one-out" : ""}), RMS error ${rms === null || rms === undefined ? "—" : `${formatNumber(rms)} ${a.lengthUnit}`}`
      : `Decoding map (${precisionLabel(precision)}): not computed`,
    datasets: [
      lineDataset("perfect decoding", chartPoints(ends, ends), INK, { width: 1, dash: [4, 3] }),
      lineDataset("mean decoded position", chartPoints(positions, d?.decodedMean ?? []), SERIES_COLOURS[1], { width: 1.5 }),
    ],
    x: { title: a.absolute ? "true position from source (µm)" : "true position, x/L (fraction of length)", min: roundSignificant(ends[0] - half), max: roundSignificant(ends[1] + half) },
    y: { title: a.absolute ? "decoded position from source (µm)" : "decoded position, x/L (fraction of length)", min: roundSignificant(ends[0] - half), max: roundSignificant(ends[1] + half) },
    padding: { right: 70 },
    plugins: [{ plugin: heatmapPlugin, options: heat as unknown as Record<string, unknown> }],
  });
}
