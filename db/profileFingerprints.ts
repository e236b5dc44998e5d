import { createHash } from "node:crypto";
import type { Db } from "./connection.ts";

/** A profile as a job saw it: its id and a hash of everything a result depends on. */
export interface ProfileIdentity {
  profileId: number;
  hash: string;
}

/**
 * Fingerprints of the given profiles: SHA-256 over the embryo (label,
 * genotype, length), the channel and time, the import it came from and the
 * stored positions and intensities. Profiles that no longer exist are absent
 * from the map.
 */
export function profileFingerprints(db: Db, profileIds: readonly number[]): Map<number, string> {
  const rows = db
    .prepare(
      `SELECT p.id, p.import_id, p.channel, p.time_s, p.positions_um, p.intensities, p.flipped, e.label, e.genotype, e.length_um
       FROM profiles p JOIN embryos e ON e.id = p.embryo_id
       WHERE p.id IN (SELECT value FROM json_each(?))`,
    )
    .all(JSON.stringify([...new Set(profileIds)])) as Record<string, unknown>[];
  const out = new Map<number, string>();
  for (const r of rows) {
    const h = createHash("sha256");
    h.update(JSON.stringify([r.id, r.import_id, r.channel, r.time_s, r.flipped, r.label, r.genotype, r.length_um]));
    h.update(r.positions_um as Buffer);
    h.update(r.intensities as Buffer);
    out.set(r.id as number, h.digest("hex").slice(0, 32));
  }
  return out;
}

/** The identities of profiles as they are stored now (ids that do not exist are left out). */
export function profileIdentities(db: Db, profileIds: readonly number[]): ProfileIdentity[] {
  const prints = profileFingerprints(db, profileIds);
  return [...prints].map(([profileId, hash]) => ({ profileId, hash }));
}

/** What changed among the given profiles since their identities were taken: deleted ids and changed ids. */
export function changedProfiles(db: Db, identities: readonly ProfileIdentity[]): { deleted: number[]; changed: number[] } {
  const now = profileFingerprints(db, identities.map((i) => i.profileId));
  const deleted: number[] = [];
  const changed: number[] = [];
  for (const i of identities) {
    const h = now.get(i.profileId);
    if (h === undefined) deleted.push(i.profileId);
    else if (h !== i.hash) changed.push(i.profileId);
  }
  return { deleted, changed };
}
