import type { EmbryoRecord } from "./embryoRecord.ts";

/** The group an embryo belongs to: a display label and a key that sorts groups naturally. */
export interface GroupKey {
  label: string;
  /** Numeric lower edge for windows and numeric fields, else the label. */
  sortKey: number | string;
}

const RECORD_FIELDS = new Set(["group", "genotype", "channel", "session", "stage", "ageS", "dosage", "lengthUm", "status", "embryo"]);

/**
 * The value of the grouping field `by` for one record: a record field
 * (group, genotype, channel, session, stage, ageS, dosage, …) or, when the
 * record has no such field, a `metadata` key. With `windowWidth`, a numeric value is put into a
 * half-open window [k·w, (k+1)·w) — e.g. stage windows of 600 s of age.
 * Returns null when the record has no usable value.
 */
export function groupKey(record: EmbryoRecord, by: string, windowWidth?: number): GroupKey | null {
  // A record field wins; a metadata key of the same name fills in when the field is absent.
  const field = RECORD_FIELDS.has(by) ? (record as unknown as Record<string, unknown>)[by] : undefined;
  const raw = field ?? record.metadata?.[by];
  if (raw === undefined || raw === null || raw === "") return null;
  // Metadata often arrives as text; a window needs the number.
  const value = typeof raw === "string" && windowWidth !== undefined && raw.trim() !== "" && Number.isFinite(Number(raw))
    ? Number(raw)
    : raw;
  if (typeof value === "number") {
    if (!Number.isFinite(value)) return null;
    if (windowWidth !== undefined) {
      const lo = Math.floor(value / windowWidth) * windowWidth;
      return { label: `[${formatEdge(lo)}, ${formatEdge(lo + windowWidth)})`, sortKey: lo };
    }
    return { label: formatEdge(value), sortKey: value };
  }
  if (typeof value === "string") return { label: value, sortKey: value };
  return null;
}

/** Shortest faithful text for a window edge (no 0.30000000000000004). */
function formatEdge(v: number): string {
  return String(Number(v.toPrecision(12)));
}

/** Natural order: numeric keys ascending, then labels in locale order with embedded numbers compared numerically. */
export function compareGroupKeys(a: GroupKey, b: GroupKey): number {
  if (typeof a.sortKey === "number" && typeof b.sortKey === "number") return a.sortKey - b.sortKey;
  if (typeof a.sortKey === "number") return -1;
  if (typeof b.sortKey === "number") return 1;
  return a.sortKey.localeCompare(b.sortKey, "en", { numeric: true });
}
