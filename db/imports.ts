import type { Db } from "./connection.ts";
import { revertImportChanges } from "./importChanges.ts";

export interface ImportRow {
  id: number;
  fileName: string;
  sha256: string;
  byteSize: number;
  format: string;
  metaFileName: string | null;
  importedAt: string;
  embryos: number;
  profiles: number;
  /** Values of embryos stored before this import that it filled in or replaced. */
  valuesChanged: number;
  warnings: unknown[];
  settings: unknown;
}

export function listImports(db: Db): ImportRow[] {
  const rows = db
    .prepare(
      `SELECT i.id, i.file_name, i.sha256, i.byte_size, i.format, i.meta_file_name, i.imported_at, i.warnings_json, i.settings_json,
              (SELECT COUNT(*) FROM profiles p WHERE p.import_id = i.id) AS profiles,
              (SELECT COUNT(DISTINCT p.embryo_id) FROM profiles p WHERE p.import_id = i.id) AS embryos,
              (SELECT COUNT(*) FROM import_changes c WHERE c.import_id = i.id) AS values_changed
       FROM imports i ORDER BY i.id`,
    )
    .all() as Record<string, unknown>[];
  return rows.map((r) => ({
    id: r.id as number,
    fileName: r.file_name as string,
    sha256: r.sha256 as string,
    byteSize: r.byte_size as number,
    format: r.format as string,
    metaFileName: r.meta_file_name as string | null,
    importedAt: r.imported_at as string,
    embryos: r.embryos as number,
    profiles: r.profiles as number,
    valuesChanged: r.values_changed as number,
    warnings: JSON.parse(r.warnings_json as string),
    settings: JSON.parse(r.settings_json as string),
  }));
}

export interface DeletedImport {
  profiles: number;
  embryos: number;
  /** Values of embryos stored before this import that it had changed, now put back. */
  valuesRestored: number;
}

/** An earlier import of the same bytes, with the options and side file it was imported with. */
export interface ImportOfBytes {
  id: number;
  fileName: string;
  metaFileName: string | null;
  metaSha256: string | null;
  settings: Record<string, unknown>;
}

export function findImportsOfBytes(db: Db, sha256: string): ImportOfBytes[] {
  const rows = db.prepare("SELECT id, file_name, meta_file_name, meta_sha256, settings_json FROM imports WHERE sha256 = ? ORDER BY id").all(sha256) as Record<string, unknown>[];
  return rows.map((r) => ({
    id: r.id as number,
    fileName: r.file_name as string,
    metaFileName: r.meta_file_name as string | null,
    metaSha256: r.meta_sha256 as string | null,
    settings: JSON.parse(r.settings_json as string),
  }));
}

/**
 * Delete one import and exactly what it did: put back every value it changed on
 * embryos stored before it, remove its profiles (with their fits), then the
 * embryos it created that are left with no profile. Returns null for an unknown id.
 */
export function deleteImport(db: Db, importId: number): DeletedImport | null {
  return db.transaction((): DeletedImport | null => {
    const found = db.prepare("SELECT id FROM imports WHERE id = ?").get(importId);
    if (!found) return null;
    const valuesRestored = revertImportChanges(db, importId);
    const profiles = db.prepare("DELETE FROM profiles WHERE import_id = ?").run(importId).changes;
    // Embryos first created by this import but still holding another import's profiles are handed to that import.
    db.prepare(
      `UPDATE embryos SET first_import_id = (SELECT MIN(p.import_id) FROM profiles p WHERE p.embryo_id = embryos.id)
       WHERE first_import_id = ? AND EXISTS (SELECT 1 FROM profiles p WHERE p.embryo_id = embryos.id)`,
    ).run(importId);
    const embryos = db.prepare("DELETE FROM embryos WHERE first_import_id = ? AND NOT EXISTS (SELECT 1 FROM profiles p WHERE p.embryo_id = embryos.id)").run(importId).changes;
    db.prepare("DELETE FROM imports WHERE id = ?").run(importId);
    return { profiles, embryos, valuesRestored };
  })();
}
