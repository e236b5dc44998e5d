import { chartPoints, segmentPoints, type ChartPoint } from "./chartPoints.ts";
import { lineDataset, pointDataset } from "./datasetStyles.ts";
import type { ComparisonFigureInput, EstimateInput, MetricSummaryInput } from "./figureInputs.ts";
import { capitalise } from "./figureNumbers.ts";
import { INK, seriesColour, withAlpha } from "./palette.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/** Deterministic horizontal offset in [−width/2, width/2) of the k-th embryo: the golden-ratio sequence spreads points evenly without randomness. */
export function jitter(k: number, width = 0.3): number {
  return ((((k + 1) * 0.6180339887498949) % 1) - 0.5) * width;
}

type GroupRow = ComparisonFigureInput["groups"][number];

interface MetricView {
  label: string;
  /** Mean (or spread) with its 95% CI for one group. */
  centre: (g: GroupRow) => { value: number; ci95: readonly [number, number] | null } | null;
  centreLabel: string;
}

const fromSummary = (s: MetricSummaryInput | null) => (s ? { value: s.mean, ci95: s.ci95 } : null);
const fromEstimate = (e: EstimateInput | null) => (e ? { value: e.value, ci95: e.ci95 ?? null } : null);

function metricView(c: ComparisonFigureInput): MetricView {
  switch (c.metric) {
    case "amplitude":
      return { label: "amplitude at the source (a.u.)", centre: (g) => fromSummary(g.amplitude_au), centreLabel: "group mean ± 95% CI (t)" };
    case "boundary":
      return { label: "boundary position from source (µm)", centre: (g) => fromSummary(g.boundary_um), centreLabel: "group mean ± 95% CI (t)" };
    case "sigma_x":
      // The comparison contrasts minimal σ_x when every group has one, else boundary SDs.
      return c.groups.every((g) => g.sigma_x_min_um)
        ? { label: "minimal positional error σ_x (µm)", centre: (g) => fromEstimate(g.sigma_x_min_um), centreLabel: "minimal σ_x ± 95% CI" }
        : { label: "boundary SD across embryos (µm)", centre: (g) => fromEstimate(g.boundary_sd_um), centreLabel: "boundary SD ± 95% CI" };
    default:
      return { label: "decay length λ (µm)", centre: (g) => fromSummary(g.lambda_um), centreLabel: "group mean ± 95% CI (t)" };
  }
}

/**
 * Every embryo's value of the compared metric as a point (jittered
 * deterministically within its group's column), beside the group mean with
 * its 95% t interval (the headline interval of a group mean) as an error bar.
 */
export function groupValuesFigure(comparison: ComparisonFigureInput): FigureConfig {
  const view = metricView(comparison);
  const groups = comparison.groups;
  const perEmbryo = new Map((comparison.embryo_values?.groups ?? []).map((g) => [g.name, g.values]));
  const datasets = groups.map((g, i) => {
    const values = perEmbryo.get(g.name) ?? [];
    const xs = values.map((_, k) => i - 0.08 + jitter(k));
    return pointDataset(`${g.name} embryos (n = ${values.length})`, chartPoints(xs, values.map((v) => v.value)), withAlpha(seriesColour(i), 0.7), 2.5);
  }).filter((d) => d.data.length > 0);
  const centres: ChartPoint[] = [];
  const bars: [ChartPoint, ChartPoint][] = [];
  groups.forEach((g, i) => {
    const c = view.centre(g);
    if (!c) return;
    centres.push({ x: i + 0.25, y: c.value });
    if (c.ci95) bars.push([{ x: i + 0.25, y: c.ci95[0] }, { x: i + 0.25, y: c.ci95[1] }]);
  });
  const mean = pointDataset(view.centreLabel, centres, INK, 9);
  // A short horizontal bar marks the mean; it is drawn by its outline.
  mean.pointStyle = "line";
  mean.pointBorderWidth = 2;
  datasets.push(mean, lineDataset("", segmentPoints(bars), INK, { width: 1.5 }));
  return scatterConfig({
    title: `${capitalise(view.label.replace(/ \(.*\)$/, ""))} by ${comparison.by} (${comparison.channel})`,
    datasets,
    x: { title: `${comparison.by} (group label)`, min: -0.6, max: groups.length - 0.4, categories: groups.map((g) => `${g.name} (n = ${g.n})`) },
    y: { title: view.label },
  });
}
