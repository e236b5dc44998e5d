import type { EmbryoRecord, ImportWarning, ParsedImport, ProfileRecord } from "../server/import/records.ts";
import type { Db } from "./connection.ts";
import { toBlob } from "./floatBlob.ts";
import { applyImportChange, type ImportChange } from "./importChanges.ts";

/**
 * What to store for one parsed file, after it was compared with the database
 * and the user chose what to do with any conflict: the embryos to create, the
 * values to change on stored embryos (each recorded with the import), and the
 * profiles to add.
 */
export interface ImportToStore {
  parsed: ParsedImport;
  /** Resolved options, side file and conflict choice, stored with the import. */
  settings: unknown;
  /** The parser's warnings plus what the comparison with the database found (values kept, profiles left out). */
  warnings: ImportWarning[];
  newEmbryos: EmbryoRecord[];
  /** Labels of stored embryos this file's profiles join, with their ids. */
  storedEmbryoIds: Map<string, number>;
  changes: ImportChange[];
  profiles: ProfileRecord[];
}

export interface StoredImport {
  importId: number;
  embryosAdded: number;
  profilesAdded: number;
  valuesChanged: number;
}

/**
 * Store one import in a single transaction: the import row, its new embryos,
 * its changes to stored embryos (recorded, so deleting the import undoes them)
 * and its profiles. Any failure rolls everything back.
 */
export function storeParsedImport(db: Db, input: ImportToStore, now: () => Date = () => new Date()): StoredImport {
  const { parsed } = input;
  const insertImport = db.prepare(
    `INSERT INTO imports (file_name, sha256, byte_size, format, delimiter, decimal_mark, meta_file_name, meta_sha256, settings_json, warnings_json, imported_at)
     VALUES (@fileName, @sha256, @byteSize, @format, @delimiter, @decimalMark, @metaFileName, @metaSha256, @settings, @warnings, @importedAt)`,
  );
  const insertEmbryo = db.prepare(
    `INSERT INTO embryos (label, genotype, stage, age_s, length_um, dosage, session, metadata_json, first_import_id)
     VALUES (@label, @genotype, @stage, @ageS, @lengthUm, @dosage, @session, @metadata, @importId)`,
  );
  const insertProfile = db.prepare(
    `INSERT INTO profiles (embryo_id, import_id, channel, time_s, position_unit, pixel_size_um, n_points, positions_raw, positions_um, intensities, dropped_points, flipped)
     VALUES (@embryoId, @importId, @channel, @timeS, @positionUnit, @pixelSizeUm, @n, @raw, @um, @y, @dropped, @flipped)`,
  );
  return db.transaction((): StoredImport => {
    const importId = Number(
      insertImport.run({
        fileName: parsed.fileName,
        sha256: parsed.sha256,
        byteSize: parsed.byteSize,
        format: parsed.format,
        delimiter: parsed.delimiter,
        decimalMark: parsed.decimalMark,
        metaFileName: parsed.metaFileName,
        metaSha256: parsed.metaSha256,
        settings: JSON.stringify(input.settings),
        warnings: JSON.stringify(input.warnings),
        importedAt: now().toISOString(),
      }).lastInsertRowid,
    );
    const ids = new Map(input.storedEmbryoIds);
    for (const e of input.newEmbryos) {
      ids.set(e.label, Number(insertEmbryo.run({ ...e, metadata: JSON.stringify(e.metadata), importId }).lastInsertRowid));
    }
    for (const c of input.changes) applyImportChange(db, importId, c);
    for (const p of input.profiles) {
      const embryoId = ids.get(p.embryo);
      if (embryoId === undefined) throw new Error(`storeParsedImport: profile of embryo "${p.embryo}" has no embryo to join`);
      insertProfile.run({
        embryoId,
        importId,
        channel: p.channel,
        timeS: p.timeS,
        positionUnit: p.positionUnit,
        pixelSizeUm: p.pixelSizeUm,
        n: p.positionsUm.length,
        raw: toBlob(p.positionsRaw),
        um: toBlob(p.positionsUm),
        y: toBlob(p.intensities),
        dropped: p.droppedPoints,
        flipped: p.flipped ? 1 : 0,
      });
    }
    return { importId, embryosAdded: input.newEmbryos.length, profilesAdded: input.profiles.length, valuesChanged: input.changes.length };
  })();
}
