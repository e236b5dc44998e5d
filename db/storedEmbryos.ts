import type { Db } from "./connection.ts";
import { embryoAttributesOf } from "./embryoAttributesRow.ts";
import { fromBlob } from "./floatBlob.ts";

/** An embryo as stored, with the profiles it already has, for comparing an incoming file against. */
export interface StoredEmbryo {
  id: number;
  label: string;
  genotype: string;
  stage: string | null;
  ageS: number | null;
  lengthUm: number | null;
  dosage: number | null;
  session: string | null;
  metadata: Record<string, string>;
  /** File that first stored the embryo. */
  firstFile: string;
  profiles: StoredProfileIdentity[];
}

export interface StoredProfileIdentity {
  importId: number;
  fileName: string;
  channel: string;
  timeS: number | null;
  positionsUm: Float64Array;
  intensities: Float64Array;
}

/** The stored embryos among `labels`, by label. */
export function findStoredEmbryos(db: Db, labels: string[]): Map<string, StoredEmbryo> {
  const embryo = db.prepare(
    `SELECT e.id, e.label, e.genotype, e.stage, e.age_s, e.length_um, e.dosage, e.session, e.metadata_json, i.file_name
     FROM embryos e JOIN imports i ON i.id = e.first_import_id WHERE e.label = ?`,
  );
  const profiles = db.prepare(
    `SELECT p.import_id, i.file_name, p.channel, p.time_s, p.positions_um, p.intensities
     FROM profiles p JOIN imports i ON i.id = p.import_id WHERE p.embryo_id = ? ORDER BY p.id`,
  );
  const out = new Map<string, StoredEmbryo>();
  for (const label of new Set(labels)) {
    const r = embryo.get(label) as Record<string, unknown> | undefined;
    if (!r) continue;
    out.set(label, {
      id: r.id as number,
      label,
      ...embryoAttributesOf(r),
      firstFile: r.file_name as string,
      profiles: (profiles.all(r.id) as Record<string, unknown>[]).map((p) => ({
        importId: p.import_id as number,
        fileName: p.file_name as string,
        channel: p.channel as string,
        timeS: p.time_s as number | null,
        positionsUm: fromBlob(p.positions_um as Buffer),
        intensities: fromBlob(p.intensities as Buffer),
      })),
    });
  }
  return out;
}
