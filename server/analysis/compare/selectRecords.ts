import type { EmbryoRecord, ExcludedEmbryo } from "./embryoRecord.ts";

export interface RecordSelection {
  /** Records fit for analysis: converged, positive finite λ, status not excluded, label not repeated. */
  used: EmbryoRecord[];
  /** Records left out, each with its reason and the record itself (so callers can file it under its group). */
  excluded: (ExcludedEmbryo & { record: EmbryoRecord })[];
}

/**
 * Keep only embryos whose fit can be trusted. Only converged fits are used: a
 * λ from a fit that stopped early is not a measurement. Repeated labels keep
 * the first record, so no embryo is counted twice in a resample.
 */
export function selectRecords(records: readonly EmbryoRecord[], excludeStatuses: readonly string[]): RecordSelection {
  const used: EmbryoRecord[] = [];
  const excluded: RecordSelection["excluded"] = [];
  const seen = new Set<string>();
  const statuses = new Set(excludeStatuses.map((s) => s.toLowerCase()));
  for (const record of records) {
    const reason = exclusionReason(record, statuses, seen);
    if (reason) excluded.push({ embryo: record.embryo, reason, record });
    else {
      used.push(record);
      seen.add(record.embryo);
    }
  }
  return { used, excluded };
}

function exclusionReason(r: EmbryoRecord, statuses: Set<string>, seen: Set<string>): string | null {
  if (seen.has(r.embryo)) return "repeated embryo label; only its first record is used";
  if (r.status !== undefined && statuses.has(r.status.toLowerCase())) return `status "${r.status}" is excluded`;
  if (!r.converged) return "profile fit did not converge";
  if (!(Number.isFinite(r.lambdaUm) && r.lambdaUm > 0)) return `λ is not a positive finite number (got ${r.lambdaUm})`;
  return null;
}
