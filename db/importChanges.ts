import type { Db } from "./connection.ts";

/** A stored embryo value an import changed: a column, or `meta:<key>` for free-form metadata. */
export type EmbryoField = "genotype" | "stage" | "age_s" | "length_um" | "dosage" | "session" | `meta:${string}`;
export type FieldValue = string | number | null;

export interface ImportChange {
  embryoId: number;
  field: EmbryoField;
  oldValue: FieldValue;
  newValue: FieldValue;
  /** filled: the stored value was empty; replaced: the file's value took the place of another. */
  kind: "filled" | "replaced";
}

export interface RecordedChange extends ImportChange {
  id: number;
  importId: number;
  label: string;
}

const COLUMNS = new Set(["genotype", "stage", "age_s", "length_um", "dosage", "session"]);

/** Write one value of an embryo (a column, or a key of its metadata; null removes the key). */
export function writeEmbryoField(db: Db, embryoId: number, field: EmbryoField, value: FieldValue): void {
  if (field.startsWith("meta:")) {
    const key = field.slice("meta:".length);
    const row = db.prepare("SELECT metadata_json FROM embryos WHERE id = ?").get(embryoId) as { metadata_json: string };
    const metadata = JSON.parse(row.metadata_json) as Record<string, string>;
    if (value === null) delete metadata[key];
    else metadata[key] = String(value);
    db.prepare("UPDATE embryos SET metadata_json = ? WHERE id = ?").run(JSON.stringify(metadata), embryoId);
    return;
  }
  if (!COLUMNS.has(field)) throw new Error(`writeEmbryoField: unknown field ${field}`);
  db.prepare(`UPDATE embryos SET ${field} = ? WHERE id = ?`).run(value, embryoId);
}

/** Apply a change to a stored embryo and record it under its import, so deleting the import can undo it. */
export function applyImportChange(db: Db, importId: number, change: ImportChange): void {
  writeEmbryoField(db, change.embryoId, change.field, change.newValue);
  db.prepare("INSERT INTO import_changes (import_id, embryo_id, field, old_json, new_json, kind) VALUES (?, ?, ?, ?, ?, ?)").run(
    importId,
    change.embryoId,
    change.field,
    JSON.stringify(change.oldValue),
    JSON.stringify(change.newValue),
    change.kind,
  );
}

export function listImportChanges(db: Db, importId: number): RecordedChange[] {
  const rows = db
    .prepare(
      `SELECT c.id, c.import_id, c.embryo_id, e.label, c.field, c.old_json, c.new_json, c.kind
       FROM import_changes c JOIN embryos e ON e.id = c.embryo_id WHERE c.import_id = ? ORDER BY c.id`,
    )
    .all(importId) as Record<string, unknown>[];
  return rows.map((r) => ({
    id: r.id as number,
    importId: r.import_id as number,
    embryoId: r.embryo_id as number,
    label: r.label as string,
    field: r.field as EmbryoField,
    oldValue: JSON.parse(r.old_json as string),
    newValue: JSON.parse(r.new_json as string),
    kind: r.kind as "filled" | "replaced",
  }));
}

/**
 * Undo every change an import made, newest first. Where a later import changed
 * the same value again, the later change is left in place but will now undo to
 * the value from before this import, so deleting both, in either order, restores
 * the original. Returns the number of values put back.
 */
export function revertImportChanges(db: Db, importId: number): number {
  const later = db.prepare("SELECT id FROM import_changes WHERE embryo_id = ? AND field = ? AND id > ? ORDER BY id LIMIT 1");
  const handOn = db.prepare("UPDATE import_changes SET old_json = ? WHERE id = ?");
  let reverted = 0;
  for (const c of listImportChanges(db, importId).reverse()) {
    const next = later.get(c.embryoId, c.field, c.id) as { id: number } | undefined;
    if (next) handOn.run(JSON.stringify(c.oldValue), next.id);
    else {
      writeEmbryoField(db, c.embryoId, c.field, c.oldValue);
      reverted++;
    }
  }
  db.prepare("DELETE FROM import_changes WHERE import_id = ?").run(importId);
  return reverted;
}
