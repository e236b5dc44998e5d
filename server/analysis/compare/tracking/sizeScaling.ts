import type { Estimate } from "../../estimate.ts";
import type { EmbryoRecord, ExcludedEmbryo } from "../embryoRecord.ts";
import { compareGroupKeys, groupKey, type GroupKey } from "../groupKey.ts";
import { selectRecords } from "../selectRecords.ts";
import { fitLinearTrend } from "./linearTrend.ts";
import { ScalingOptions, type ResolvedScalingOptions, type ScalingOptionsInput } from "./scalingOptions.ts";

/** Log–log regression of a length-like quantity on embryo length. */
export interface ScalingFit {
  /** Exponent β in y ∝ L^β: 1 is perfect scaling, 0 no scaling. */
  slope: Estimate;
  /** ln of the prefactor. */
  intercept: Estimate;
  r2: number;
  n: number;
  df: number;
  /** CI of β contains 1. */
  consistent_with_scaling: boolean;
  /** CI of β contains 0. */
  consistent_with_no_scaling: boolean;
}

export interface ScalingGroup {
  group: string;
  /** Embryos with a positive length. */
  n: number;
  lambda: ScalingFit | null;
  boundary: ScalingFit | null;
  note: string | null;
}

export interface ScalingResult {
  settings: ResolvedScalingOptions;
  groups: ScalingGroup[];
  excluded: ExcludedEmbryo[];
}

/**
 * Scaling with size: within each group, the slope of ln λ (and ln x_b) on
 * ln L with a t-based CI from ordinary least squares. A gradient that scales
 * with the embryo has λ ∝ L (slope 1); one set by fixed D and k has slope 0.
 * The CI answers both questions; with few embryos or a narrow range of
 * lengths it may contain both.
 */
export function sizeScaling(records: readonly EmbryoRecord[], options: ScalingOptionsInput = {}): ScalingResult {
  const o = ScalingOptions.parse(options);
  const { used, excluded } = selectRecords(records, o.excludeStatuses);
  const out: ExcludedEmbryo[] = excluded.map(({ embryo, reason }) => ({ embryo, reason }));
  const groups = new Map<string, { key: GroupKey; records: EmbryoRecord[] }>();
  for (const r of used) {
    if (!(r.lengthUm !== undefined && Number.isFinite(r.lengthUm) && r.lengthUm > 0)) {
      out.push({ embryo: r.embryo, reason: "no positive length" });
      continue;
    }
    const key = groupKey(r, o.by);
    if (!key) {
      out.push({ embryo: r.embryo, reason: `no value for the grouping field "${o.by}"` });
      continue;
    }
    let g = groups.get(key.label);
    if (!g) groups.set(key.label, (g = { key, records: [] }));
    g.records.push(r);
  }
  const result = [...groups.values()].sort((a, b) => compareGroupKeys(a.key, b.key)).map((g) => {
    const lambda = logLogFit(g.records.map((r) => [r.lengthUm!, r.lambdaUm]), o.level);
    const boundary = logLogFit(g.records.filter((r) => r.boundaryUm !== undefined).map((r) => [r.lengthUm!, r.boundaryUm!]), o.level);
    return {
      group: g.key.label,
      n: g.records.length,
      lambda,
      boundary,
      note: lambda === null ? "needs at least 3 embryos with positive values and 2 distinct lengths" : null,
    };
  });
  return { settings: o, groups: result, excluded: out };
}

function logLogFit(pairs: [number, number][], level: number): ScalingFit | null {
  const ok = pairs.filter(([l, v]) => l > 0 && Number.isFinite(v) && v > 0);
  if (ok.length < 3 || new Set(ok.map(([l]) => l)).size < 2) return null;
  const fit = fitLinearTrend(ok.map(([l]) => Math.log(l)), ok.map(([, v]) => Math.log(v)), level);
  const [lo, hi] = fit.slope.ci95!;
  return {
    slope: fit.slope,
    intercept: fit.intercept,
    r2: fit.r2,
    n: fit.n,
    df: fit.df,
    consistent_with_scaling: lo <= 1 && hi >= 1,
    consistent_with_no_scaling: lo <= 0 && hi >= 0,
  };
}
