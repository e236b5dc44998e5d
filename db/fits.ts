import type { Db } from "./connection.ts";
import { packNumbers, unpackNumbers } from "./packedNumbers.ts";
import { canonicalJson, stableHash } from "./stableHash.ts";

export interface FitToStore {
  profileId: number;
  model: string;
  /** The resolved fit options (after defaults): their hash identifies the fit. */
  options: unknown;
  engineVersion: string;
  status: string;
  lambdaUm: number | null;
  lambdaSeUm: number | null;
  aicc: number | null;
  result: unknown;
  /** The fit setting the fit belongs to (db/fitSettings.ts). */
  settingId: number;
}

export interface StoredFit {
  id: number;
  profileId: number;
  model: string;
  optionsHash: string;
  options: unknown;
  engineVersion: string;
  status: string;
  lambdaUm: number | null;
  lambdaSeUm: number | null;
  aicc: number | null;
  result: unknown;
  createdAt: string;
  /** null only for fits stored before fit settings existed, until settings are next read. */
  settingId: number | null;
}

/**
 * Store fits in one transaction. The same profile, model and options replace
 * the earlier fit; other options add a new one, so every stored number keeps
 * the settings that produced it. Long number arrays in the result (positions,
 * fitted curve, residuals) are stored packed (db/packedNumbers.ts); readers
 * here unpack them.
 */
export function storeFits(db: Db, fits: FitToStore[], now: () => Date = () => new Date()): number[] {
  const upsert = db.prepare(
    `INSERT INTO fits (profile_id, model, options_hash, options_json, engine_version, status, lambda_um, lambda_se_um, aicc, result_json, created_at, setting_id)
     VALUES (@profileId, @model, @optionsHash, @options, @engineVersion, @status, @lambdaUm, @lambdaSeUm, @aicc, @result, @createdAt, @settingId)
     ON CONFLICT (profile_id, model, options_hash) DO UPDATE SET
       options_json = excluded.options_json, engine_version = excluded.engine_version, status = excluded.status,
       lambda_um = excluded.lambda_um, lambda_se_um = excluded.lambda_se_um, aicc = excluded.aicc,
       result_json = excluded.result_json, created_at = excluded.created_at, setting_id = excluded.setting_id
     RETURNING id`,
  );
  // A batch usually shares one set of options: canonicalise and hash each distinct set once.
  const hashes = new Map<string, string>();
  const createdAt = now().toISOString();
  return db.transaction(() =>
    fits.map((f) => {
      const options = canonicalJson(f.options);
      let optionsHash = hashes.get(options);
      if (optionsHash === undefined) hashes.set(options, (optionsHash = stableHash(f.options)));
      return (upsert.get({ ...f, optionsHash, options, result: JSON.stringify(packNumbers(f.result)), createdAt }) as { id: number }).id;
    }),
  )();
}

export interface FitFilter {
  profileIds?: number[];
  model?: string;
  optionsHash?: string;
  ids?: number[];
  settingId?: number;
}

function toStored(r: Record<string, unknown>): StoredFit {
  return {
    id: r.id as number,
    profileId: r.profile_id as number,
    model: r.model as string,
    optionsHash: r.options_hash as string,
    options: JSON.parse(r.options_json as string),
    engineVersion: r.engine_version as string,
    status: r.status as string,
    lambdaUm: r.lambda_um as number | null,
    lambdaSeUm: r.lambda_se_um as number | null,
    aicc: r.aicc as number | null,
    result: unpackNumbers(JSON.parse(r.result_json as string)),
    createdAt: r.created_at as string,
    settingId: (r.setting_id as number | null) ?? null,
  };
}

export function listFits(db: Db, filter: FitFilter = {}): StoredFit[] {
  const conds: string[] = [];
  const params: unknown[] = [];
  if (filter.profileIds) {
    conds.push("profile_id IN (SELECT value FROM json_each(?))");
    params.push(JSON.stringify(filter.profileIds));
  }
  if (filter.ids) {
    conds.push("id IN (SELECT value FROM json_each(?))");
    params.push(JSON.stringify(filter.ids));
  }
  if (filter.model !== undefined) { conds.push("model = ?"); params.push(filter.model); }
  if (filter.optionsHash !== undefined) { conds.push("options_hash = ?"); params.push(filter.optionsHash); }
  if (filter.settingId !== undefined) { conds.push("setting_id = ?"); params.push(filter.settingId); }
  const where = conds.length ? `WHERE ${conds.join(" AND ")}` : "";
  return (db.prepare(`SELECT * FROM fits ${where} ORDER BY profile_id, model, created_at DESC`).all(...params) as Record<string, unknown>[]).map(toStored);
}

export { stableHash as fitOptionsHash };

export interface FitListFilter {
  genotype?: string;
  channel?: string;
  model?: string;
  profileId?: number;
  /** Only fits of this named fit setting. */
  setting?: string;
  /** Only the newest fit of each profile and model (default true). */
  latestOnly?: boolean;
}

export interface FitListItem {
  fitId: number;
  profileId: number;
  embryo: string;
  genotype: string;
  channel: string;
  timeS: number | null;
  model: string;
  status: string;
  message: string;
  lambdaUm: { value: number; se: number | null; ci95: [number, number] | null } | null;
  amplitude: { value: number; se: number | null; ci95: [number, number] | null } | null;
  background: { value: number; se: number | null; ci95: [number, number] | null } | null;
  r2: number | null;
  aicc: number | null;
  nPoints: number | null;
  window: { xMinUm?: number; xMaxUm?: number } | null;
  /** The positions actually fitted (µm) and how they were chosen; null for fits stored before it was recorded. */
  fittedWindow: { fromUm: number; toUm: number; startRule: string; endRule: string; description: string } | null;
  options: unknown;
  engineVersion: string;
  createdAt: string;
  /** Name of the fit setting the fit belongs to. */
  setting: string | null;
}

const parsed = <T>(v: unknown): T | null => (typeof v === "string" ? (JSON.parse(v) as T) : null);

/**
 * Fits with their embryo's labels and headline numbers, without the bulky
 * arrays; by default only the newest fit of each profile and model. Ordered by
 * genotype, embryo, channel, time and model, for tables and reports.
 */
export function listFitItems(db: Db, filter: FitListFilter = {}): FitListItem[] {
  const conds: string[] = [];
  const params: unknown[] = [];
  if (filter.genotype !== undefined) { conds.push("e.genotype = ?"); params.push(filter.genotype); }
  if (filter.channel !== undefined) { conds.push("p.channel = ?"); params.push(filter.channel); }
  if (filter.model !== undefined) { conds.push("f.model = ?"); params.push(filter.model); }
  if (filter.profileId !== undefined) { conds.push("f.profile_id = ?"); params.push(filter.profileId); }
  if (filter.setting !== undefined) { conds.push("s.name = ?"); params.push(filter.setting); }
  if (filter.latestOnly ?? true) {
    conds.push("f.id = (SELECT f2.id FROM fits f2 WHERE f2.profile_id = f.profile_id AND f2.model = f.model ORDER BY f2.created_at DESC, f2.id DESC LIMIT 1)");
  }
  const rows = db
    .prepare(
      `SELECT f.id, f.profile_id, e.label, e.genotype, p.channel, p.time_s, f.model, f.status, f.aicc, f.engine_version, f.options_json, f.created_at,
              json_extract(f.result_json, '$.fit.message') AS message,
              json_extract(f.result_json, '$.fit.parameters.lambdaUm') AS lambda,
              json_extract(f.result_json, '$.fit.parameters.amplitude') AS amplitude,
              json_extract(f.result_json, '$.fit.parameters.background') AS background,
              json_extract(f.result_json, '$.fit.r2') AS r2,
              json_extract(f.result_json, '$.fit.n') AS n,
              json_extract(f.options_json, '$.window') AS window,
              json_extract(f.result_json, '$.fit.window') AS fitted_window, s.name AS setting_name
       FROM fits f JOIN profiles p ON p.id = f.profile_id JOIN embryos e ON e.id = p.embryo_id LEFT JOIN fit_settings s ON s.id = f.setting_id
       ${conds.length ? `WHERE ${conds.join(" AND ")}` : ""}
       ORDER BY e.genotype, e.label, p.channel, p.time_s, f.model`,
    )
    .all(...params) as Record<string, unknown>[];
  const estimate = (v: unknown) => {
    const e = parsed<{ value: number; se: number | null; ci95: [number, number] | null }>(v);
    return e ? { value: e.value, se: e.se, ci95: e.ci95 } : null;
  };
  return rows.map((r) => ({
    fitId: r.id as number,
    profileId: r.profile_id as number,
    embryo: r.label as string,
    genotype: r.genotype as string,
    channel: r.channel as string,
    timeS: r.time_s as number | null,
    model: r.model as string,
    status: r.status as string,
    message: (r.message as string | null) ?? "",
    lambdaUm: estimate(r.lambda),
    amplitude: estimate(r.amplitude),
    background: estimate(r.background),
    r2: r.r2 as number | null,
    aicc: r.aicc as number | null,
    nPoints: r.n as number | null,
    window: parsed(r.window),
    fittedWindow: parsed(r.fitted_window),
    options: JSON.parse(r.options_json as string),
    engineVersion: r.engine_version as string,
    createdAt: r.created_at as string,
    setting: (r.setting_name as string | null) ?? null,
  }));
}
