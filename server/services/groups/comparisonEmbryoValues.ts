import type { CompareResult } from "../../analysis/compare/compareGroups.ts";
import type { EmbryoRecord } from "../../analysis/compare/embryoRecord.ts";
import { groupKey } from "../../analysis/compare/groupKey.ts";
import { selectRecords } from "../../analysis/compare/selectRecords.ts";

/** Each group's per-embryo values of the compared metric (the points behind the group means). */
export interface ComparisonEmbryoValues {
  /** Which per-embryo value is listed, with its unit; null for spread comparisons, which have none. */
  quantity: "lambda_um" | "amplitude_au" | "boundary_um" | null;
  groups: { name: string; values: { embryo: string; value: number }[] }[];
}

const QUANTITY = { lambda: "lambda_um", amplitude: "amplitude_au", boundary: "boundary_um" } as const;

/**
 * The embryos the comparison used, grouped as it grouped them: records are
 * screened by the same rule (selectRecords) and grouped by the same key, so
 * each group's values are exactly those its summary was computed from.
 */
export function comparisonEmbryoValues(records: readonly EmbryoRecord[], result: Pick<CompareResult, "settings" | "groups">): ComparisonEmbryoValues {
  const metric = result.settings.metric;
  if (metric === "sigma_x") return { quantity: null, groups: result.groups.map((g) => ({ name: g.name, values: [] })) };
  const { used } = selectRecords(records, result.settings.excludeStatuses);
  const pick = (r: EmbryoRecord) => (metric === "lambda" ? r.lambdaUm : metric === "amplitude" ? r.amplitude : r.boundaryUm);
  const byGroup = new Map<string, { embryo: string; value: number }[]>();
  for (const r of used) {
    const key = groupKey(r, result.settings.by, result.settings.window);
    const value = pick(r);
    if (!key || value === undefined || !Number.isFinite(value)) continue;
    byGroup.set(key.label, [...(byGroup.get(key.label) ?? []), { embryo: r.embryo, value }]);
  }
  return { quantity: QUANTITY[metric], groups: result.groups.map((g) => ({ name: g.name, values: byGroup.get(g.name) ?? [] })) };
}
