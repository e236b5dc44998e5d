import type { Db } from "./connection.ts";

export interface FitTableFilter {
  genotype?: string;
  channel?: string;
  model?: string;
}

/** One row of the fit table: the newest fit of a profile and model with its embryo's labels. */
export interface FitTableRow {
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
  amplitude: { value: number } | null;
  background: { value: number } | null;
  r2: number | null;
  aicc: number | null;
  nPoints: number | null;
  window: { xMinUm?: number; xMaxUm?: number } | null;
  options: unknown;
  engineVersion: string;
  createdAt: string;
}

const json = <T>(v: unknown): T | null => (typeof v === "string" ? (JSON.parse(v) as T) : null);

/** The newest fit of each profile and model, in genotype, embryo, channel and model order, for tables and reports. */
export function listFitTable(db: Db, filter: FitTableFilter = {}): FitTableRow[] {
  const conds = ["f.id = (SELECT f2.id FROM fits f2 WHERE f2.profile_id = f.profile_id AND f2.model = f.model ORDER BY f2.created_at DESC, f2.id DESC LIMIT 1)"];
  const params: unknown[] = [];
  if (filter.genotype !== undefined) { conds.push("e.genotype = ?"); params.push(filter.genotype); }
  if (filter.channel !== undefined) { conds.push("p.channel = ?"); params.push(filter.channel); }
  if (filter.model !== undefined) { conds.push("f.model = ?"); params.push(filter.model); }
  const rows = db
    .prepare(
      `SELECT f.id, f.profile_id, e.label, e.genotype, p.channel, p.time_s, f.model, f.status, f.aicc, f.engine_version, f.options_json, f.created_at,
              json_extract(f.result_json, '$.fit.message') AS message,
              json_extract(f.result_json, '$.fit.parameters.lambdaUm') AS lambda,
              json_extract(f.result_json, '$.fit.parameters.amplitude') AS amplitude,
              json_extract(f.result_json, '$.fit.parameters.background') AS background,
              json_extract(f.result_json, '$.fit.r2') AS r2,
              json_extract(f.result_json, '$.fit.n') AS n,
              json_extract(f.options_json, '$.window') AS window
       FROM fits f JOIN profiles p ON p.id = f.profile_id JOIN embryos e ON e.id = p.embryo_id
       WHERE ${conds.join(" AND ")}
       ORDER BY e.genotype, e.label, p.channel, p.time_s, f.model`,
    )
    .all(...params) as Record<string, unknown>[];
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
    lambdaUm: json(r.lambda),
    amplitude: json(r.amplitude),
    background: json(r.background),
    r2: r.r2 as number | null,
    aicc: r.aicc as number | null,
    nPoints: r.n as number | null,
    window: json(r.window),
    options: JSON.parse(r.options_json as string),
    engineVersion: r.engine_version as string,
    createdAt: r.created_at as string,
  }));
}
