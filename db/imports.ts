import type { Db } from "./connection.ts";

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
  warnings: unknown[];
  settings: unknown;
}

export function listImports(db: Db): ImportRow[] {
  const rows = db
    .prepare(
      `SELECT i.id, i.file_name, i.sha256, i.byte_size, i.format, i.meta_file_name, i.imported_at, i.warnings_json, i.settings_json,
              (SELECT COUNT(*) FROM profiles p WHERE p.import_id = i.id) AS profiles,
              (SELECT COUNT(DISTINCT p.embryo_id) FROM profiles p WHERE p.import_id = i.id) AS embryos
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
    warnings: JSON.parse(r.warnings_json as string),
    settings: JSON.parse(r.settings_json as string),
  }));
}

export interface DeletedImport {
  profiles: number;
  embryos: number;
}

/**
 * Delete one import and only what it added: its profiles (with their fits),
 * then the embryos left with no profile at all. Returns null for an unknown id.
 */
export function deleteImport(db: Db, importId: number): DeletedImport | null {
  return db.transaction((): DeletedImport | null => {
    const found = db.prepare("SELECT id FROM imports WHERE id = ?").get(importId);
    if (!found) return null;
    const profiles = db.prepare("DELETE FROM profiles WHERE import_id = ?").run(importId).changes;
    // Embryos first created by this import but still holding another import's profiles are handed to that import.
    db.prepare(
      `UPDATE embryos SET first_import_id = (SELECT MIN(p.import_id) FROM profiles p WHERE p.embryo_id = embryos.id)
       WHERE first_import_id = ? AND EXISTS (SELECT 1 FROM profiles p WHERE p.embryo_id = embryos.id)`,
    ).run(importId);
    const embryos = db.prepare("DELETE FROM embryos WHERE first_import_id = ? AND NOT EXISTS (SELECT 1 FROM profiles p WHERE p.embryo_id = embryos.id)").run(importId).changes;
    db.prepare("DELETE FROM imports WHERE id = ?").run(importId);
    return { profiles, embryos };
  })();
}
