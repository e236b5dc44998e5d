import type { TrackResult } from "../../analysis/compare/tracking/trackOverTime.ts";
import type { TrackingResponse } from "../groups/trackingResponse.ts";
import type { CsvTable } from "./csvText.ts";

const METRIC_COLUMN: Record<string, string> = { lambda: "lambda_um", amplitude: "amplitude_au", boundary: "boundary_um" };

/**
 * The per-embryo points of a tracking analysis: the metric against age (s)
 * or stage; boundary against dosage (with ln dosage, the regression's x, and
 * for embryos that never crossed the threshold the side and the limit); or
 * λ and boundary against embryo length.
 */
export function trackingTable(t: TrackingResponse): CsvTable {
  if (t.over === "dosage") {
    return {
      columns: ["group", "embryo", "dosage", "ln_dosage", "boundary_um", "no_crossing", "boundary_limit_um"],
      rows: (t.points ?? []).map((p) => [p.group, p.embryo, p.dosage, p.dosage !== null && p.dosage > 0 ? Math.log(p.dosage) : null, p.boundary_um, p.no_crossing ?? null, p.boundary_limit_um ?? null]),
    };
  }
  if (t.over === "length") {
    return {
      columns: ["group", "embryo", "length_um", "lambda_um", "boundary_um"],
      rows: (t.points ?? []).map((p) => [p.group, p.embryo, p.length_um, p.lambda_um, p.boundary_um]),
    };
  }
  const r = t.result as TrackResult;
  const age = r.settings.time === "ageS";
  return {
    columns: ["group", "embryo", age ? "age_s" : "stage", "stage_label", METRIC_COLUMN[r.settings.metric] ?? r.settings.metric],
    rows: r.series.flatMap((s) => s.points.map((p) => [s.group, p.embryo, p.time, p.stage, p.value])),
  };
}
