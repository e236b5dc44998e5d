import { chartPoints } from "./chartPoints.ts";
import { lineDataset, pointDataset, type FigureDataset } from "./datasetStyles.ts";
import type { BuildUpFigureInput } from "./dynamicsInputs.ts";
import { formatWithError } from "./figureNumbers.ts";
import { sequentialColour } from "./sequentialColour.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/** Time label in the unit that reads best (s, min or h). */
export function timeLabel(tS: number): string {
  if (tS < 120) return `${Number(tS.toPrecision(3))} s`;
  if (tS < 7200) return `${Number((tS / 60).toPrecision(3))} min`;
  return `${Number((tS / 3600).toPrecision(3))} h`;
}

/** i-th of n colours on the sequential ramp, skipping its near-white start. */
export function rampColour(i: number, n: number): string {
  return sequentialColour(0.3 + 0.7 * (n > 1 ? i / (n - 1) : 1));
}

/** Build-up profiles: the observations at each time (points) with the joint fit (lines), coloured early → late. */
export function buildUpFigure(b: BuildUpFigureInput): FigureConfig {
  const times = [...new Set(b.points.map((p) => p.t_s))].sort((a, c) => a - c);
  const datasets: FigureDataset[] = [];
  times.forEach((t, i) => {
    const colour = rampColour(i, times.length);
    const pts = b.points.filter((p) => p.t_s === t);
    datasets.push(pointDataset(`${timeLabel(t)} (n = ${pts.length})`, chartPoints(pts.map((p) => p.x_um), pts.map((p) => p.value)), colour, 1.8));
    const sorted = [...pts].sort((p, q) => p.x_um - q.x_um);
    const seen = new Set<number>();
    const line = sorted.filter((p) => (seen.has(p.x_um) ? false : (seen.add(p.x_um), true)));
    datasets.push(lineDataset("", chartPoints(line.map((p) => p.x_um), line.map((p) => p.fitted)), colour, { width: 1.8 }));
  });
  const d = b.D_um2_per_s;
  const k = b.k_per_s;
  return scatterConfig({
    title: `Build-up of ${b.channel} (${b.genotype}): D = ${d ? formatWithError(d.value, d.se, "µm²/s") : "—"}, k = ${k ? formatWithError(k.value, k.se, "1/s") : "—"}`,
    datasets,
    x: { title: "position from source (µm)" },
    y: { title: "intensity (a.u.)" },
  });
}

/** Residuals of the build-up fit against position, coloured by time. */
export function buildUpResidualFigure(b: BuildUpFigureInput): FigureConfig {
  const times = [...new Set(b.points.map((p) => p.t_s))].sort((a, c) => a - c);
  const datasets = times.map((t, i) => {
    const pts = b.points.filter((p) => p.t_s === t);
    return pointDataset(timeLabel(t), chartPoints(pts.map((p) => p.x_um), pts.map((p) => p.value - p.fitted)), rampColour(i, times.length), 1.8);
  });
  return scatterConfig({ title: `Residuals of the build-up fit (${b.genotype} / ${b.channel})`, datasets, x: { title: "position from source (µm)" }, y: { title: "observed − fitted (a.u.)" } });
}
