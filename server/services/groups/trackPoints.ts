import type { EmbryoRecord } from "../../analysis/compare/embryoRecord.ts";
import { groupKey } from "../../analysis/compare/groupKey.ts";
import { selectRecords } from "../../analysis/compare/selectRecords.ts";
import type { TrackTaskOutput } from "./trackTask.ts";

/** One embryo of a dosage series or a size-scaling analysis. */
export interface TrackPoint {
  embryo: string;
  group: string;
  dosage: number | null;
  length_um: number | null;
  lambda_um: number | null;
  boundary_um: number | null;
  /** Dosage series: the profile never crossed the threshold — its boundary lies before ('before_start') or beyond ('beyond_end') boundary_limit_um. */
  no_crossing?: "before_start" | "beyond_end" | null;
  boundary_limit_um?: number | null;
}

const finiteOrNull = (v: number | undefined): number | null => (v !== undefined && Number.isFinite(v) ? v : null);

/**
 * The per-embryo values behind a dosage series or a size-scaling analysis,
 * screened as the analysis screened them (selectRecords, then a positive
 * dosage with a boundary or a censored reading, or a positive length). Tracking over stage or age
 * keeps its points in its series, so it has none here.
 */
export function trackPoints(records: readonly EmbryoRecord[], output: TrackTaskOutput): TrackPoint[] | null {
  if (output.over === "time") return null;
  const { used } = selectRecords(records, output.result.settings.excludeStatuses);
  const point = (r: EmbryoRecord, group: string): TrackPoint => ({
    embryo: r.embryo, group, dosage: finiteOrNull(r.dosage), length_um: finiteOrNull(r.lengthUm), lambda_um: finiteOrNull(r.lambdaUm), boundary_um: finiteOrNull(r.boundaryUm),
  });
  if (output.over === "dosage") {
    const crossed = (r: EmbryoRecord) => r.boundaryUm !== undefined && Number.isFinite(r.boundaryUm);
    const censored = (r: EmbryoRecord) => r.boundaryCensored !== undefined && r.boundaryLimitUm !== undefined;
    return used
      .filter((r) => r.dosage !== undefined && r.dosage > 0 && (crossed(r) || censored(r)))
      .map((r) => ({ ...point(r, r.group), no_crossing: r.boundaryCensored ?? null, boundary_limit_um: finiteOrNull(r.boundaryLimitUm) }));
  }
  const by = output.result.settings.by;
  return used.flatMap((r) => {
    const key = groupKey(r, by);
    return r.lengthUm !== undefined && r.lengthUm > 0 && key ? [point(r, key.label)] : [];
  });
}
