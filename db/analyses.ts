import type { Db } from "./connection.ts";
import { canonicalJson, stableHash } from "./stableHash.ts";

export type AnalysisKind = "global-fit" | "precision" | "comparison" | "tracking" | "plan" | "dynamics" | "frap" | "combine" | "simulation";

export interface AnalysisToStore {
  kind: AnalysisKind;
  /** Which profiles or groups were analysed (filters, group field, …). */
  selection: unknown;
  /** Every setting that shaped the result (grid, normalisation, bootstrap count, seed, …). */
  settings: unknown;
  engineVersion: string;
  result: unknown;
  /** Profiles the result was computed from. */
  profileIds: number[];
}

export interface StoredAnalysis {
  id: number;
  kind: AnalysisKind;
  selection: unknown;
  settings: unknown;
  settingsHash: string;
  engineVersion: string;
  result: unknown;
  createdAt: string;
  profileIds: number[];
}

/**
 * Store a group analysis with its inputs. Running the same kind on the same
 * selection with the same settings replaces the earlier row; anything else adds one.
 */
export function storeAnalysis(db: Db, a: AnalysisToStore, now: () => Date = () => new Date()): number {
  const settingsHash = stableHash({ selection: a.selection, settings: a.settings });
  return db.transaction(() => {
    const old = db.prepare("SELECT id FROM analyses WHERE kind = ? AND settings_hash = ?").all(a.kind, settingsHash) as { id: number }[];
    const drop = db.prepare("DELETE FROM analyses WHERE id = ?");
    for (const o of old) drop.run(o.id);
    const id = Number(
      db
        .prepare(
          `INSERT INTO analyses (kind, selection_json, settings_hash, settings_json, engine_version, result_json, created_at)
           VALUES (?, ?, ?, ?, ?, ?, ?)`,
        )
        .run(a.kind, canonicalJson(a.selection), settingsHash, canonicalJson(a.settings), a.engineVersion, JSON.stringify(a.result), now().toISOString()).lastInsertRowid,
    );
    const link = db.prepare("INSERT OR IGNORE INTO analysis_inputs (analysis_id, profile_id) VALUES (?, ?)");
    for (const p of a.profileIds) link.run(id, p);
    return id;
  })();
}

function toStored(r: Record<string, unknown>, profileIds: number[]): StoredAnalysis {
  return {
    id: r.id as number,
    kind: r.kind as AnalysisKind,
    selection: JSON.parse(r.selection_json as string),
    settings: JSON.parse(r.settings_json as string),
    settingsHash: r.settings_hash as string,
    engineVersion: r.engine_version as string,
    result: JSON.parse(r.result_json as string),
    createdAt: r.created_at as string,
    profileIds,
  };
}

export function getAnalysis(db: Db, id: number): StoredAnalysis | null {
  const r = db.prepare("SELECT * FROM analyses WHERE id = ?").get(id) as Record<string, unknown> | undefined;
  if (!r) return null;
  const inputs = (db.prepare("SELECT profile_id FROM analysis_inputs WHERE analysis_id = ? ORDER BY profile_id").all(id) as { profile_id: number }[]).map((x) => x.profile_id);
  return toStored(r, inputs);
}

/** Newest first; without results (they can be large) unless asked. */
export function listAnalyses(db: Db, kind?: AnalysisKind): Omit<StoredAnalysis, "result" | "profileIds">[] {
  const rows = (kind ? db.prepare("SELECT id, kind, selection_json, settings_hash, settings_json, engine_version, created_at FROM analyses WHERE kind = ? ORDER BY id DESC").all(kind) : db.prepare("SELECT id, kind, selection_json, settings_hash, settings_json, engine_version, created_at FROM analyses ORDER BY id DESC").all()) as Record<string, unknown>[];
  return rows.map((r) => {
    const { result: _r, profileIds: _p, ...rest } = toStored({ ...r, result_json: "null" }, []);
    return rest;
  });
}
