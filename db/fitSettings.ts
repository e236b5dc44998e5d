import type { Db } from "./connection.ts";
import { canonicalJson, stableHash } from "./stableHash.ts";

/** A named fit setting: a model with the rest of its resolved fit options. */
export interface StoredFitSetting {
  id: number;
  name: string;
  /** Hash of the resolved fit options (model included): the setting's identity. */
  hash: string;
  model: string;
  options: Record<string, unknown>;
  createdAt: string;
}

/** Keys of a fit's stored options that interpret a fit but do not shape it. */
const INTERPRETATION_KEYS = ["diffusion", "accumulationPositionsUm"];

/** The fit options of a stored fit without the interpretation keys: what its setting is made of. */
export function settingOptionsOf(fitOptions: Record<string, unknown>): Record<string, unknown> {
  const out = { ...fitOptions };
  for (const k of INTERPRETATION_KEYS) delete out[k];
  return out;
}

/** The identity of a fit setting: the hash of its resolved options. */
export function fitSettingHash(options: unknown): string {
  return stableHash(options);
}

function toStored(r: Record<string, unknown>): StoredFitSetting {
  return {
    id: r.id as number,
    name: r.name as string,
    hash: r.options_hash as string,
    model: r.model as string,
    options: JSON.parse(r.options_json as string),
    createdAt: r.created_at as string,
  };
}

export function listFitSettings(db: Db): StoredFitSetting[] {
  return (db.prepare("SELECT * FROM fit_settings ORDER BY id").all() as Record<string, unknown>[]).map(toStored);
}

export function findFitSetting(db: Db, by: { name?: string; hash?: string; id?: number }): StoredFitSetting | null {
  const r =
    by.id !== undefined
      ? db.prepare("SELECT * FROM fit_settings WHERE id = ?").get(by.id)
      : by.hash !== undefined
        ? db.prepare("SELECT * FROM fit_settings WHERE options_hash = ?").get(by.hash)
        : db.prepare("SELECT * FROM fit_settings WHERE name = ?").get(by.name);
  return r ? toStored(r as Record<string, unknown>) : null;
}

/**
 * The stored setting with these options, created under `name` when new. With
 * `rename`, an existing setting takes the new name (the caller has checked the
 * name is free). Returns the setting as stored.
 */
export function ensureFitSetting(
  db: Db,
  s: { name: string; model: string; options: unknown; rename: boolean },
  now: () => Date = () => new Date(),
): StoredFitSetting {
  const hash = fitSettingHash(s.options);
  return db.transaction(() => {
    const existing = findFitSetting(db, { hash });
    if (existing) {
      if (s.rename && existing.name !== s.name) db.prepare("UPDATE fit_settings SET name = ? WHERE id = ?").run(s.name, existing.id);
      return findFitSetting(db, { id: existing.id })!;
    }
    const id = Number(
      db
        .prepare("INSERT INTO fit_settings (name, options_hash, model, options_json, created_at) VALUES (?, ?, ?, ?, ?)")
        .run(s.name, hash, s.model, canonicalJson(s.options), now().toISOString()).lastInsertRowid,
    );
    return findFitSetting(db, { id })!;
  })();
}

/** Fits stored before fit settings existed: id, model and options, to be given their setting. */
export function fitsWithoutSetting(db: Db): { id: number; model: string; options: Record<string, unknown> }[] {
  return (db.prepare("SELECT id, model, options_json FROM fits WHERE setting_id IS NULL ORDER BY id").all() as { id: number; model: string; options_json: string }[]).map((r) => ({
    id: r.id,
    model: r.model,
    options: JSON.parse(r.options_json),
  }));
}

export function assignFitSetting(db: Db, fitIds: number[], settingId: number): void {
  const set = db.prepare("UPDATE fits SET setting_id = ? WHERE id = ?");
  db.transaction(() => {
    for (const id of fitIds) set.run(settingId, id);
  })();
}

/** Per setting and genotype: how many profiles have a fit under it, and how many profiles there are. */
export function fitSettingCoverage(db: Db, filter: { channel?: string } = {}): { settingId: number; genotype: string; fitted: number }[] {
  const channel = filter.channel !== undefined ? "AND p.channel = ?" : "";
  return db
    .prepare(
      `SELECT f.setting_id AS settingId, e.genotype AS genotype, COUNT(DISTINCT f.profile_id) AS fitted
       FROM fits f JOIN profiles p ON p.id = f.profile_id JOIN embryos e ON e.id = p.embryo_id
       WHERE f.setting_id IS NOT NULL AND p.time_s IS NULL ${channel}
       GROUP BY f.setting_id, e.genotype ORDER BY f.setting_id, e.genotype`,
    )
    .all(...(filter.channel !== undefined ? [filter.channel] : [])) as { settingId: number; genotype: string; fitted: number }[];
}

/** Steady-state profiles per genotype (the denominators of the coverage). */
export function profilesPerGenotype(db: Db, filter: { channel?: string } = {}): { genotype: string; profiles: number }[] {
  const channel = filter.channel !== undefined ? "AND p.channel = ?" : "";
  return db
    .prepare(`SELECT e.genotype AS genotype, COUNT(*) AS profiles FROM profiles p JOIN embryos e ON e.id = p.embryo_id WHERE p.time_s IS NULL ${channel} GROUP BY e.genotype ORDER BY e.genotype`)
    .all(...(filter.channel !== undefined ? [filter.channel] : [])) as { genotype: string; profiles: number }[];
}
