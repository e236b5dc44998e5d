import type { ParsedImport } from "../server/import/records.ts";
import { UNASSIGNED_GENOTYPE } from "../server/import/parseProfileFile.ts";
import { UserError } from "../server/userError.ts";
import type { Db } from "./connection.ts";
import { toBlob } from "./floatBlob.ts";

export interface StoredImport {
  status: "imported" | "already-imported";
  importId: number;
  fileName: string;
  /** File name under which these bytes were first imported (differs when re-imported under another name). */
  originalFileName: string;
  embryosAdded: number;
  embryosMatched: number;
  profilesAdded: number;
}

interface EmbryoRow {
  id: number;
  label: string;
  genotype: string;
  first_import_id: number;
}

/**
 * Store one parsed file in a single transaction: the import row, new embryos
 * (an embryo already stored under the same label is reused, so a second
 * channel joins its first) and the profiles. Any conflict rolls everything
 * back. The same bytes twice add nothing.
 */
export function storeParsedImport(db: Db, parsed: ParsedImport, settings: unknown, now: () => Date = () => new Date()): StoredImport {
  const existing = db.prepare("SELECT id, file_name FROM imports WHERE sha256 = ?").get(parsed.sha256) as { id: number; file_name: string } | undefined;
  if (existing) {
    return { status: "already-imported", importId: existing.id, fileName: parsed.fileName, originalFileName: existing.file_name, embryosAdded: 0, embryosMatched: 0, profilesAdded: 0 };
  }
  const findEmbryo = db.prepare("SELECT id, label, genotype, first_import_id FROM embryos WHERE label = ?");
  const fileOf = db.prepare("SELECT file_name FROM imports WHERE id = ?");
  const insertImport = db.prepare(
    `INSERT INTO imports (file_name, sha256, byte_size, format, delimiter, decimal_mark, meta_file_name, meta_sha256, settings_json, warnings_json, imported_at)
     VALUES (@fileName, @sha256, @byteSize, @format, @delimiter, @decimalMark, @metaFileName, @metaSha256, @settings, @warnings, @importedAt)`,
  );
  const insertEmbryo = db.prepare(
    `INSERT INTO embryos (label, genotype, stage, age_s, length_um, dosage, session, metadata_json, first_import_id)
     VALUES (@label, @genotype, @stage, @ageS, @lengthUm, @dosage, @session, @metadata, @importId)`,
  );
  const fillGenotype = db.prepare("UPDATE embryos SET genotype = ? WHERE id = ? AND genotype = ?");
  const insertProfile = db.prepare(
    `INSERT INTO profiles (embryo_id, import_id, channel, time_s, position_unit, pixel_size_um, n_points, positions_raw, positions_um, intensities, dropped_points, flipped)
     VALUES (@embryoId, @importId, @channel, @timeS, @positionUnit, @pixelSizeUm, @n, @raw, @um, @y, @dropped, @flipped)`,
  );
  const clash = db.prepare("SELECT 1 FROM profiles WHERE embryo_id = ? AND channel = ? AND IFNULL(time_s, -1e300) = IFNULL(?, -1e300)");

  const run = db.transaction((): StoredImport => {
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
        settings: JSON.stringify(settings),
        warnings: JSON.stringify(parsed.warnings),
        importedAt: now().toISOString(),
      }).lastInsertRowid,
    );
    const ids = new Map<string, number>();
    let added = 0;
    let matched = 0;
    for (const e of parsed.embryos) {
      const stored = findEmbryo.get(e.label) as EmbryoRow | undefined;
      if (!stored) {
        ids.set(e.label, Number(insertEmbryo.run({ ...e, metadata: JSON.stringify(e.metadata), importId }).lastInsertRowid));
        added++;
        continue;
      }
      if (stored.genotype !== e.genotype && e.genotype !== UNASSIGNED_GENOTYPE) {
        if (stored.genotype === UNASSIGNED_GENOTYPE) fillGenotype.run(e.genotype, stored.id, UNASSIGNED_GENOTYPE);
        else {
          const first = (fileOf.get(stored.first_import_id) as { file_name: string }).file_name;
          throw new UserError(
            "embryo-genotype-conflict",
            `${parsed.fileName}: embryo "${e.label}" is already stored with genotype "${stored.genotype}" (from ${first}), but this file gives "${e.genotype}". If these are different embryos, import with a label prefix (--label-prefix). Nothing was imported.`,
            { status: 409, issues: [{ path: `${parsed.fileName}, embryo "${e.label}"`, message: `genotype "${e.genotype}" conflicts with stored "${stored.genotype}"` }] },
          );
        }
      }
      ids.set(e.label, stored.id);
      matched++;
    }
    for (const p of parsed.profiles) {
      const embryoId = ids.get(p.embryo)!;
      if (clash.get(embryoId, p.channel, p.timeS)) {
        throw new UserError(
          "profile-exists",
          `${parsed.fileName}: embryo "${p.embryo}" already has a stored profile for channel "${p.channel}"${p.timeS !== null ? ` at ${p.timeS} s` : ""}. Import it under another channel name (--channel) or label prefix (--label-prefix). Nothing was imported.`,
          { status: 409, issues: [{ path: `${parsed.fileName}, embryo "${p.embryo}"`, message: "profile already stored" }] },
        );
      }
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
    return { status: "imported", importId, fileName: parsed.fileName, originalFileName: parsed.fileName, embryosAdded: added, embryosMatched: matched, profilesAdded: parsed.profiles.length };
  });
  return run();
}
