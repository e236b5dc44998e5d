import type { Estimate } from "../estimate.ts";
import { createRandom } from "../random/seededRandom.ts";
import type { HedgesG } from "../stats/hedgesG.ts";
import { holmAdjust } from "../stats/holmAdjust.ts";
import { CompareOptions, type CompareOptionsInput, type GroupExtras, type ResolvedCompareOptions } from "./compareOptions.ts";
import { contrastMeans, type IntervalValue } from "./contrastMeans.ts";
import { deriveSeed } from "./deriveSeed.ts";
import type { EmbryoRecord, ExcludedEmbryo } from "./embryoRecord.ts";
import { compareGroupKeys, groupKey, type GroupKey } from "./groupKey.ts";
import { selectRecords } from "./selectRecords.ts";
import { boundarySpreadRatio, suppliedSpreadRatio, type SpreadRatio } from "./spreadRatio.ts";
import { summarizeGroup, type GroupSummary } from "./summarizeGroup.ts";

/** One comparison between groups a and b for the chosen metric. */
export interface Contrast {
  a: string;
  b: string;
  metric: ResolvedCompareOptions["metric"];
  /** Where the compared values came from: per-embryo values, supplied σ_x, or boundary SDs. */
  source: "embryos" | "supplied_sigma_x" | "boundary_sd" | "supplied_boundary_sd" | null;
  n_a: number;
  n_b: number;
  /** a − b (means, or spreads for sigma_x) with its CI. */
  difference: IntervalValue | null;
  /** a / b with its CI. */
  ratio: IntervalValue | null;
  t_welch: number | null;
  df_welch: number | null;
  p_welch: number | null;
  p_permutation: number | null;
  /** For sigma_x: approximate p for equal spread from the SE of ln(ratio). */
  p_spread: number | null;
  /** Holm-adjusted p across all contrasts of this run (of `holmOn` for means, of p_spread for sigma_x). */
  p_holm: number | null;
  /** Hedges' g for a − b; null for sigma_x. */
  effect_size: HedgesG | null;
  /** Why some fields are null, when they are. */
  note: string | null;
}

/** Equality of spread between two groups. */
export interface SpreadContrast {
  a: string;
  b: string;
  boundary_sd: SpreadRatio | null;
  sigma_x: SpreadRatio | null;
}

export interface CompareResult {
  settings: Omit<ResolvedCompareOptions, "progress" | "extras">;
  groups: GroupSummary[];
  contrasts: Contrast[];
  spread: SpreadContrast[];
  /** Embryos left out before grouping (no value for the grouping field). */
  excluded: ExcludedEmbryo[];
  /** De-duplicated messages about thin or inconsistent input, each saying what to do. */
  warnings: string[];
}

interface Group {
  key: GroupKey;
  records: EmbryoRecord[];
  excluded: ExcludedEmbryo[];
}

/**
 * Compare embryos grouped by genotype (or any field): per-group summaries,
 * contrasts of the chosen metric between every pair of groups (or each group
 * against a reference) with Holm's adjustment across the family, and ratios
 * of spread. Only converged fits are used; every left-out embryo is listed
 * with its reason. Options are validated by {@link CompareOptions}.
 */
export function compareGroups(records: readonly EmbryoRecord[], options: CompareOptionsInput = {}): CompareResult {
  const o = CompareOptions.parse(options);
  const warnings = new Set<string>();
  const { used, excluded } = selectRecords(records, o.excludeStatuses);
  const groups = new Map<string, Group>();
  const ungrouped: ExcludedEmbryo[] = [];
  const file = (record: EmbryoRecord, exclusion: ExcludedEmbryo | null): void => {
    const key = groupKey(record, o.by, o.window);
    if (!key) {
      ungrouped.push(exclusion ?? { embryo: record.embryo, reason: `no value for the grouping field "${o.by}"` });
      return;
    }
    let g = groups.get(key.label);
    if (!g) groups.set(key.label, (g = { key, records: [], excluded: [] }));
    if (exclusion) g.excluded.push(exclusion);
    else g.records.push(record);
  };
  for (const r of used) file(r, null);
  for (const e of excluded) file(e.record, { embryo: e.embryo, reason: e.reason });
  const ordered = [...groups.values()].sort((x, y) => compareGroupKeys(x.key, y.key));
  const names = ordered.map((g) => g.key.label);

  if (o.reference !== undefined && !groups.has(o.reference)) {
    throw new RangeError(`compareGroups: reference group "${o.reference}" not found; groups are ${names.map((n) => `"${n}"`).join(", ") || "(none)"}`);
  }
  for (const name of Object.keys(o.extras)) {
    if (!groups.has(name)) warnings.add(`extras were supplied for group "${name}", which has no embryos; check the group labels`);
  }

  const pairs: [Group, Group][] = [];
  if (o.reference !== undefined) {
    const ref = groups.get(o.reference)!;
    for (const g of ordered) if (g !== ref) pairs.push([g, ref]);
  } else {
    for (let i = 0; i < ordered.length; i++) for (let j = i + 1; j < ordered.length; j++) pairs.push([ordered[i], ordered[j]]);
  }

  const totalUnits = Math.max(1, ordered.length + 2 * pairs.length);
  let done = 0;
  const step = (stage: string): void => {
    done++;
    o.progress?.(done / totalUnits, stage);
  };

  const summaries = ordered.map((g) => {
    if (g.records.length < 3) warnings.add(`group "${g.key.label}" has ${g.records.length} usable embryo(s); intervals need at least 3`);
    const s = summarizeGroup(g.key.label, g.records, g.excluded, o.extras[g.key.label], o);
    step("summaries");
    return s;
  });

  const contrasts = pairs.map(([ga, gb]) => {
    const c = contrast(ga, gb, o);
    step("contrasts");
    return c;
  });
  const primary = contrasts.map((c) => (o.metric === "sigma_x" ? c.p_spread : o.holmOn === "welch" ? c.p_welch : c.p_permutation));
  const tested = primary.map((p, i) => (p === null ? -1 : i)).filter((i) => i >= 0);
  const adjusted = holmAdjust(tested.map((i) => primary[i]!));
  tested.forEach((i, k) => (contrasts[i].p_holm = adjusted[k]));

  const spread = pairs.map(([ga, gb]) => {
    const s = spreadContrast(ga, gb, o);
    step("spread");
    return s;
  });
  if (pairs.length === 0) o.progress?.(1, "done");

  const { progress: _progress, extras: _extras, ...settings } = o;
  return { settings, groups: summaries, contrasts, spread, excluded: ungrouped, warnings: [...warnings] };
}

function values(g: Group, metric: "lambda" | "amplitude" | "boundary"): number[] {
  const pick = metric === "lambda" ? (r: EmbryoRecord) => r.lambdaUm : metric === "amplitude" ? (r: EmbryoRecord) => r.amplitude : (r: EmbryoRecord) => r.boundaryUm;
  return g.records.map(pick).filter((v): v is number => v !== undefined && Number.isFinite(v));
}

function emptyContrast(a: string, b: string, o: ResolvedCompareOptions, na: number, nb: number, note: string | null): Contrast {
  return {
    a, b, metric: o.metric, source: null, n_a: na, n_b: nb, difference: null, ratio: null,
    t_welch: null, df_welch: null, p_welch: null, p_permutation: null, p_spread: null, p_holm: null, effect_size: null, note,
  };
}

function contrast(ga: Group, gb: Group, o: ResolvedCompareOptions): Contrast {
  const a = ga.key.label;
  const b = gb.key.label;
  const label = `contrast:${o.metric}:${a}:${b}`;
  if (o.metric === "sigma_x") return spreadAsContrast(ga, gb, o, label);
  const xa = values(ga, o.metric);
  const xb = values(gb, o.metric);
  if (xa.length < 2 || xb.length < 2) {
    return emptyContrast(a, b, o, xa.length, xb.length, `needs at least 2 embryos with a ${o.metric} value in each group`);
  }
  const m = contrastMeans(xa, xb, {
    ...o,
    seeds: {
      difference: deriveSeed(o.seed, `${label}:difference`),
      ratio: deriveSeed(o.seed, `${label}:ratio`),
      permutation: deriveSeed(o.seed, `${label}:permutation`),
    },
  });
  return {
    a, b, metric: o.metric, source: "embryos", n_a: xa.length, n_b: xb.length,
    difference: m.difference, ratio: m.ratio, t_welch: m.t_welch, df_welch: m.df_welch, p_welch: m.p_welch,
    p_permutation: m.p_permutation, p_spread: null, p_holm: null, effect_size: m.effect_size,
    note: m.note === null ? null : m.note.replace("the second group", `"${b}"`),
  };
}

/** sigma_x has no per-embryo values: compare supplied σ_x, else boundary SDs, as a ratio of spreads. */
function spreadAsContrast(ga: Group, gb: Group, o: ResolvedCompareOptions, label: string): Contrast {
  const a = ga.key.label;
  const b = gb.key.label;
  const random = createRandom(deriveSeed(o.seed, label));
  const ea = o.extras[a];
  const eb = o.extras[b];
  let s: SpreadRatio | null = null;
  let source: Contrast["source"] = null;
  let na = ga.records.length;
  let nb = gb.records.length;
  if (ea?.sigmaXMinUm && eb?.sigmaXMinUm) {
    s = supplied(ea.sigmaXMinUm, ea.sigmaXReplicatesUm, eb.sigmaXMinUm, eb.sigmaXReplicatesUm, o, random);
    source = "supplied_sigma_x";
  } else {
    const ba = values(ga, "boundary");
    const bb = values(gb, "boundary");
    if (ba.length >= 3 && bb.length >= 3) {
      s = boundarySpreadRatio(ba, bb, { ...o, random });
      source = "boundary_sd";
      na = ba.length;
      nb = bb.length;
    } else if (ea?.boundarySdUm && eb?.boundarySdUm) {
      s = supplied(ea.boundarySdUm, ea.boundarySdReplicatesUm, eb.boundarySdUm, eb.boundarySdReplicatesUm, o, random);
      source = "supplied_boundary_sd";
    }
  }
  if (!s) return emptyContrast(a, b, o, na, nb, "no σ_x supplied for both groups and fewer than 3 boundaries in a group");
  return {
    ...emptyContrast(a, b, o, na, nb, null),
    source, difference: s.difference, ratio: s.ratio, p_spread: s.p_spread,
    note: s.p_spread === null ? "no standard errors for the spreads; no p-value" : null,
  };
}

function supplied(
  a: Estimate, repA: number[] | undefined, b: Estimate, repB: number[] | undefined,
  o: ResolvedCompareOptions, random: ReturnType<typeof createRandom>,
): SpreadRatio | null {
  if (!(a.value > 0 && b.value > 0)) return null;
  return suppliedSpreadRatio({ estimate: a, replicates: repA }, { estimate: b, replicates: repB }, { ...o, random });
}

function spreadContrast(ga: Group, gb: Group, o: ResolvedCompareOptions): SpreadContrast {
  const a = ga.key.label;
  const b = gb.key.label;
  const ea: GroupExtras | undefined = o.extras[a];
  const eb: GroupExtras | undefined = o.extras[b];
  const random = (what: string) => createRandom(deriveSeed(o.seed, `spread:${what}:${a}:${b}`));
  const ba = values(ga, "boundary");
  const bb = values(gb, "boundary");
  let boundary: SpreadRatio | null = null;
  if (ba.length >= 3 && bb.length >= 3) boundary = boundarySpreadRatio(ba, bb, { ...o, random: random("boundary") });
  else if (ea?.boundarySdUm && eb?.boundarySdUm) {
    boundary = supplied(ea.boundarySdUm, ea.boundarySdReplicatesUm, eb.boundarySdUm, eb.boundarySdReplicatesUm, o, random("boundary"));
  }
  const sigma = ea?.sigmaXMinUm && eb?.sigmaXMinUm
    ? supplied(ea.sigmaXMinUm, ea.sigmaXReplicatesUm, eb.sigmaXMinUm, eb.sigmaXReplicatesUm, o, random("sigma_x"))
    : null;
  return { a, b, boundary_sd: boundary, sigma_x: sigma };
}
