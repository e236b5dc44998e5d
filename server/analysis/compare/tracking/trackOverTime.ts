import { createRandom } from "../../random/seededRandom.ts";
import { deriveSeed } from "../deriveSeed.ts";
import type { EmbryoRecord, ExcludedEmbryo } from "../embryoRecord.ts";
import { compareGroupKeys, groupKey, type GroupKey } from "../groupKey.ts";
import { selectRecords } from "../selectRecords.ts";
import { summarizeMetric, type MetricSummary } from "../summarizeMetric.ts";
import { fitLinearTrend, type LinearTrend } from "./linearTrend.ts";
import { fitSaturatingTrend, type SaturatingTrend } from "./saturatingTrend.ts";
import { assessSteadyState, type SteadyStateAssessment } from "./steadyState.ts";
import { TrackOptions, type ResolvedTrackOptions, type TrackOptionsInput } from "./trackOptions.ts";

export interface TimePoint {
  embryo: string;
  /** Numeric time (age in s or numeric stage); null for a stage label. */
  time: number | null;
  /** Stage label for categorical stages. */
  stage: string | null;
  value: number;
}

export interface TimeBin {
  label: string;
  /** Numeric bin edges [from, to); null for a stage label. */
  from: number | null;
  to: number | null;
  /** Mean time of the embryos in the bin; null for a stage label. */
  meanTime: number | null;
  summary: MetricSummary | null;
}

export interface TimeSeries {
  group: string;
  /** Embryos with a value of the metric and a time. */
  n: number;
  /** True when the time axis is numeric (trend and steady-state check possible). */
  numeric: boolean;
  points: TimePoint[];
  bins: TimeBin[];
  trend: LinearTrend | SaturatingTrend | null;
  /** Why there is no trend, when there is none. */
  trendNote: string | null;
  steadyState: SteadyStateAssessment | null;
}

export interface TrackResult {
  settings: ResolvedTrackOptions;
  series: TimeSeries[];
  /** Embryos left out (unconverged, excluded status, no time or no value of the metric). */
  excluded: ExcludedEmbryo[];
}

/**
 * A metric (λ, amplitude, boundary) against developmental time, per group:
 * the per-embryo points, bin means with t intervals (bootstrap CIs resampling embryos beside them),
 * a linear or saturating trend fitted to the points, and a check whether the
 * metric is still changing at the end of the range (see assessSteadyState).
 */
export function trackOverTime(records: readonly EmbryoRecord[], options: TrackOptionsInput = {}): TrackResult {
  const o = TrackOptions.parse(options);
  const { used, excluded } = selectRecords(records, o.excludeStatuses);
  const out: ExcludedEmbryo[] = excluded.map(({ embryo, reason }) => ({ embryo, reason }));
  const groups = new Map<string, { key: GroupKey; points: TimePoint[] }>();
  for (const r of used) {
    const value = metricValue(r, o.metric);
    if (value === undefined || !Number.isFinite(value)) {
      out.push({ embryo: r.embryo, reason: `no ${o.metric} value` });
      continue;
    }
    const raw = o.time === "ageS" ? r.ageS : r.stage;
    const time = typeof raw === "number" && Number.isFinite(raw) ? raw
      : typeof raw === "string" && raw.trim() !== "" && Number.isFinite(Number(raw)) ? Number(raw) : null;
    const stage = time === null && typeof raw === "string" && raw.trim() !== "" ? raw : null;
    if (time === null && stage === null) {
      out.push({ embryo: r.embryo, reason: `no ${o.time === "ageS" ? "age" : "stage"}` });
      continue;
    }
    const key = groupKey(r, o.by);
    if (!key) {
      out.push({ embryo: r.embryo, reason: `no value for the grouping field "${o.by}"` });
      continue;
    }
    let g = groups.get(key.label);
    if (!g) groups.set(key.label, (g = { key, points: [] }));
    g.points.push({ embryo: r.embryo, time, stage, value });
  }
  const series = [...groups.values()]
    .sort((a, b) => compareGroupKeys(a.key, b.key))
    .map((g) => buildSeries(g.key.label, g.points, o));
  return { settings: o, series, excluded: out };
}

function metricValue(r: EmbryoRecord, metric: ResolvedTrackOptions["metric"]): number | undefined {
  return metric === "lambda" ? r.lambdaUm : metric === "amplitude" ? r.amplitude : r.boundaryUm;
}

function buildSeries(group: string, points: TimePoint[], o: ResolvedTrackOptions): TimeSeries {
  // A series is numeric only when every point has a numeric time; mixed labels and numbers are treated as labels.
  const numeric = points.every((p) => p.time !== null);
  const summarize = (label: string, values: number[]) =>
    summarizeMetric(values, { ...o, random: createRandom(deriveSeed(o.seed, `track:${group}:${label}`)) });
  if (!numeric) {
    const labels = new Map<string, number[]>();
    for (const p of points) {
      const label = p.stage ?? String(p.time);
      labels.set(label, [...(labels.get(label) ?? []), p.value]);
    }
    const bins = [...labels.entries()]
      .sort(([a], [b]) => a.localeCompare(b, "en", { numeric: true }))
      .map(([label, values]) => ({ label, from: null, to: null, meanTime: null, summary: summarize(label, values) }));
    return {
      group, n: points.length, numeric, points, bins, trend: null,
      trendNote: "stages are labels, not numbers: no trend or steady-state check", steadyState: null,
    };
  }
  const sorted = [...points].sort((a, b) => a.time! - b.time!);
  const t = sorted.map((p) => p.time!);
  const y = sorted.map((p) => p.value);
  const edges = o.binEdges ?? equalEdges(t[0], t[t.length - 1], o.bins);
  const bins: TimeBin[] = [];
  for (let k = 0; k + 1 < edges.length; k++) {
    const last = k + 2 === edges.length;
    const inBin = sorted.filter((p) => p.time! >= edges[k] && (p.time! < edges[k + 1] || (last && p.time! <= edges[k + 1])));
    const label = `[${fmt(edges[k])}, ${fmt(edges[k + 1])}${last ? "]" : ")"}`;
    bins.push({
      label, from: edges[k], to: edges[k + 1],
      meanTime: inBin.length ? inBin.reduce((s, p) => s + p.time!, 0) / inBin.length : null,
      summary: summarize(label, inBin.map((p) => p.value)),
    });
  }
  let trend: LinearTrend | SaturatingTrend | null = null;
  let trendNote: string | null = null;
  const distinct = new Set(t).size;
  if (o.trend === "linear") {
    if (t.length >= 3 && distinct >= 2) trend = fitLinearTrend(t, y, o.level);
    else trendNote = "a linear trend needs at least 3 embryos at 2 or more distinct times";
  } else if (o.trend === "saturating") {
    trend = fitSaturatingTrend(t, y, { level: o.level, timeOrigin: o.timeOrigin });
    if (!trend.converged) trendNote = trend.reason;
  }
  const steadyState = t.length >= 3 && distinct >= 2
    ? assessSteadyState(t, y, trend?.kind === "saturating" ? trend : null, o)
    : null;
  return { group, n: points.length, numeric, points: sorted, bins, trend, trendNote, steadyState };
}

function equalEdges(lo: number, hi: number, count: number): number[] {
  if (hi === lo) return [lo, hi];
  return Array.from({ length: count + 1 }, (_, k) => (k === count ? hi : lo + ((hi - lo) * k) / count));
}

function fmt(v: number): string {
  return String(Number(v.toPrecision(6)));
}
