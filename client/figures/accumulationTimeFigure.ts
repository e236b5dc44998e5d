import { chartPoints } from "./chartPoints.ts";
import { bandDatasets, lineDataset, pointDataset, type FigureDataset } from "./datasetStyles.ts";
import type { EstimateInput } from "./figureInputs.ts";
import { SERIES_COLOURS } from "./palette.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/** Anything that reports τ(x): a build-up fit, a combination or a simulation. */
export interface AccumulationFigureInput {
  genotype?: string;
  channel?: string;
  accumulation_time_s: readonly (EstimateInput & { x_um: number })[];
}

/** Local accumulation time τ(x) (minutes) with its 95% interval: far from the source the gradient forms later. */
export function accumulationTimeFigure(a: AccumulationFigureInput): FigureConfig {
  const t = a.accumulation_time_s;
  const x = t.map((p) => p.x_um);
  const datasets: FigureDataset[] = [];
  const withCi = t.filter((p) => p.ci95);
  if (withCi.length === t.length && t.length > 0)
    datasets.push(...bandDatasets("95% interval", chartPoints(x, t.map((p) => p.ci95![0] / 60)), chartPoints(x, t.map((p) => p.ci95![1] / 60)), SERIES_COLOURS[0]));
  datasets.push(lineDataset("τ(x)", chartPoints(x, t.map((p) => p.value / 60)), SERIES_COLOURS[0]));
  datasets.push(pointDataset("", chartPoints(x, t.map((p) => p.value / 60)), SERIES_COLOURS[0], 3));
  const who = a.genotype ? ` (${a.genotype}${a.channel ? ` / ${a.channel}` : ""})` : "";
  return scatterConfig({ title: `Local accumulation time τ(x)${who}`, datasets, x: { title: "position from source (µm)" }, y: { title: "accumulation time τ (min)" } });
}
