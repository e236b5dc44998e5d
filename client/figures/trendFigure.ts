import { chartPoints, segmentPoints, type ChartPoint } from "./chartPoints.ts";
import { lineDataset, pointDataset, type FigureDataset } from "./datasetStyles.ts";
import type { DosageTrackInput, LengthTrackInput, TimeSeriesInput, TimeTrackInput, TrackingFigureInput } from "./figureInputs.ts";
import { capitalise, formatInterval, formatWithError } from "./figureNumbers.ts";
import { jitter } from "./groupValuesFigure.ts";
import { SERIES_COLOURS, seriesColour, withAlpha } from "./palette.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

const METRIC_AXIS: Record<string, string> = {
  lambda: "decay length λ (µm)",
  amplitude: "amplitude at the source (a.u.)",
  boundary: "boundary position from source (µm)",
};

const CURVE_POINTS = 60;

/** Evenly spaced values from a to b inclusive. */
function span(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, k) => a + ((b - a) * k) / (n - 1));
}

function trendCurve(s: TimeSeriesInput, t: readonly number[]): { label: string; points: ChartPoint[] } | null {
  const tr = s.trend;
  if (!tr || t.length === 0) return null;
  const lo = Math.min(...t);
  const hi = Math.max(...t);
  if (tr.kind === "linear") {
    const f = (x: number) => tr.intercept.value + tr.slope.value * x;
    return { label: `${s.group}: linear trend, slope ${formatWithError(tr.slope.value, tr.slope.se)} ${formatInterval(tr.slope.ci95)}`, points: chartPoints([lo, hi], [f(lo), f(hi)]) };
  }
  if (!tr.converged || !tr.yInf || !tr.y0 || !tr.tau) return null;
  const [yInf, y0, tau] = [tr.yInf.value, tr.y0.value, tr.tau.value];
  // y(t) = y∞ + (y0 − y∞)·e^(−(t − t0)/τ), the saturating trend's own form.
  const xs = span(lo, hi, CURVE_POINTS);
  return { label: `${s.group}: saturating trend, plateau ${formatWithError(yInf, tr.yInf.se)}`, points: chartPoints(xs, xs.map((x) => yInf + (y0 - yInf) * Math.exp(-(x - tr.timeOrigin) / tau))) };
}

function timeFigure(tracking: TrackingFigureInput, r: TimeTrackInput): FigureConfig {
  const numeric = r.series.every((s) => s.numeric);
  const labels = numeric ? [] : [...new Set(r.series.flatMap((s) => s.bins.map((b) => b.label)))];
  const datasets: FigureDataset[] = [];
  r.series.forEach((s, i) => {
    const colour = seriesColour(i);
    const tOf = (p: TimeSeriesInput["points"][number], k: number) => (numeric ? p.time! : labels.indexOf(p.stage ?? String(p.time)) + jitter(k, 0.25));
    datasets.push(pointDataset(`${s.group} embryos (n = ${s.points.length})`, chartPoints(s.points.map(tOf), s.points.map((p) => p.value)), withAlpha(colour, 0.55), 2));
    const binX = (b: TimeSeriesInput["bins"][number]) => (numeric ? b.meanTime : labels.indexOf(b.label));
    const bins = s.bins.filter((b) => b.summary && binX(b) !== null);
    const means = pointDataset(`${s.group} bin mean ± 95% CI`, chartPoints(bins.map((b) => binX(b)!), bins.map((b) => b.summary!.mean)), colour, 4);
    means.pointStyle = "rect";
    datasets.push(means);
    const bars = bins.filter((b) => b.summary!.ci95).map((b) => [{ x: binX(b)!, y: b.summary!.ci95![0] }, { x: binX(b)!, y: b.summary!.ci95![1] }] as [ChartPoint, ChartPoint]);
    datasets.push(lineDataset("", segmentPoints(bars), colour, { width: 1.5 }));
    const curve = numeric ? trendCurve(s, s.points.map((p) => p.time!)) : null;
    if (curve) datasets.push(lineDataset(curve.label, curve.points, colour, { dash: [6, 3] }));
  });
  const age = r.settings.time === "ageS";
  const metric = METRIC_AXIS[r.settings.metric] ?? `${r.settings.metric} (as measured)`;
  return scatterConfig({
    title: `${capitalise(metric.replace(/ \(.*\)$/, ""))} over ${age ? "age" : "stage"} (${tracking.channel})`,
    datasets,
    x: numeric ? { title: age ? "age (s)" : "stage (stage number)" } : { title: "stage (label)", min: -0.6, max: labels.length - 0.4, categories: labels },
    y: { title: metric },
  });
}

function dosageFigure(tracking: TrackingFigureInput, r: DosageTrackInput): FigureConfig {
  const datasets: FigureDataset[] = [];
  const points = (tracking.points ?? []).filter((p) => p.dosage && p.dosage > 0 && p.boundary_um !== null && p.boundary_um !== undefined);
  if (points.length) datasets.push(pointDataset(`embryos (n = ${points.length})`, chartPoints(points.map((p, k) => Math.log(p.dosage!) + jitter(k, 0.06)), points.map((p) => p.boundary_um!)), withAlpha(SERIES_COLOURS[7], 0.6), 2));
  const levels = r.dosages.filter((d) => d.boundary_um);
  const means = pointDataset("mean boundary ± 95% CI per dosage", chartPoints(levels.map((d) => Math.log(d.dosage)), levels.map((d) => d.boundary_um!.mean)), SERIES_COLOURS[0], 4);
  means.pointStyle = "rect";
  datasets.push(means);
  datasets.push(lineDataset("", segmentPoints(levels.filter((d) => d.boundary_um!.ci95).map((d) => [{ x: Math.log(d.dosage), y: d.boundary_um!.ci95![0] }, { x: Math.log(d.dosage), y: d.boundary_um!.ci95![1] }])), SERIES_COLOURS[0], { width: 1.5 }));
  const lnD = r.dosages.map((d) => Math.log(d.dosage));
  const ends = lnD.length ? [Math.min(...lnD), Math.max(...lnD)] : [0, 0];
  const b0 = r.boundary_at_unit_dosage_um?.value;
  const shift = r.lambda_from_shift_um;
  const fit = r.lambda_from_fit_um;
  // Boundary x_b = x_b(1) + λ·ln f for an exponential read at a fixed threshold: Driever & Nüsslein-Volhard 1988, Cell; Houchmandzadeh, Wieschaus, Leibler 2002, Nature.
  if (b0 !== undefined && shift) datasets.push(lineDataset(`regression: λ from boundary shift = ${formatWithError(shift.value, shift.se, "µm")}`, chartPoints(ends, ends.map((x) => b0 + shift.value * x)), SERIES_COLOURS[0]));
  if (b0 !== undefined && fit) datasets.push(lineDataset(`slope expected from λ of the profile fits = ${formatWithError(fit.value, fit.se, "µm")}`, chartPoints(ends, ends.map((x) => b0 + fit.value * x)), SERIES_COLOURS[1], { dash: [6, 3] }));
  return scatterConfig({
    title: `Boundary shift with source dosage (${tracking.channel}): ${r.dosages.map((d) => `${d.dosage}×`).join(", ")}`,
    datasets,
    x: { title: "ln(dosage) (dimensionless; 0 = wild-type dose)" },
    y: { title: "boundary position from source (µm)" },
  });
}

function lengthFigure(tracking: TrackingFigureInput, r: LengthTrackInput): FigureConfig {
  const datasets: FigureDataset[] = [];
  r.groups.forEach((g, i) => {
    const colour = seriesColour(i);
    const pts = (tracking.points ?? []).filter((p) => p.group === g.group && p.length_um && p.length_um > 0 && p.lambda_um && p.lambda_um > 0);
    datasets.push(pointDataset(`${g.group} embryos (n = ${pts.length})`, chartPoints(pts.map((p) => p.length_um!), pts.map((p) => p.lambda_um!)), withAlpha(colour, 0.6), 2.5));
    const f = g.lambda;
    if (f && pts.length) {
      const lengths = pts.map((p) => p.length_um!);
      const xs = span(Math.min(...lengths), Math.max(...lengths), 2);
      // ln λ = a + β·ln L, so λ = e^a·L^β: a straight line on log–log axes.
      datasets.push(lineDataset(`${g.group}: log–log slope ${formatWithError(f.slope.value, f.slope.se)} ${formatInterval(f.slope.ci95)} (1 = scaling)`, chartPoints(xs, xs.map((L) => Math.exp(f.intercept.value) * L ** f.slope.value)), colour));
    }
  });
  return scatterConfig({
    title: `Decay length against embryo length (${tracking.channel})`,
    datasets,
    x: { title: "embryo length (µm, log scale)", type: "logarithmic" },
    y: { title: "decay length λ (µm, log scale)", type: "logarithmic" },
  });
}

/**
 * A tracking result as a figure: over stage or age, per-embryo points with
 * bin means ± 95% CI and the fitted trend; over dosage, boundary position
 * against ln(dosage) with the regression line (its slope is λ) beside the
 * slope λ of the profile fits predicts; over length, λ against embryo length
 * on log–log axes with the fitted slope.
 */
export function trendFigure(tracking: TrackingFigureInput): FigureConfig {
  if (tracking.over === "dosage") return dosageFigure(tracking, tracking.result as DosageTrackInput);
  if (tracking.over === "length") return lengthFigure(tracking, tracking.result as LengthTrackInput);
  return timeFigure(tracking, tracking.result as TimeTrackInput);
}

