import type { Db } from "./connection.ts";
import { fromBlob } from "./floatBlob.ts";
import { embryoAttributesOf } from "./embryoAttributesRow.ts";

/** Which profiles to read; every field optional, combined with AND. */
export interface ProfileFilter {
  genotype?: string;
  /** Any of these genotypes. */
  genotypes?: string[];
  channel?: string;
  embryo?: string;
  importId?: number;
  profileIds?: number[];
  /** Match any stored metadata key, e.g. { session: "2026-03-04" } (embryo columns or free-form metadata). */
  metadata?: Record<string, string>;
  limit?: number;
  offset?: number;
}

export interface ProfileSummary {
  profileId: number;
  embryoId: number;
  embryo: string;
  genotype: string;
  stage: string | null;
  ageS: number | null;
  lengthUm: number | null;
  dosage: number | null;
  session: string | null;
  metadata: Record<string, string>;
  channel: string;
  timeS: number | null;
  positionUnit: "um" | "px" | "fraction";
  pixelSizeUm: number | null;
  nPoints: number;
  droppedPoints: number;
  flipped: boolean;
  importId: number;
  fileName: string;
  /** First and last position in µm. */
  rangeUm: [number, number];
}

export interface ProfileData extends ProfileSummary {
  positionsUm: Float64Array;
  positionsRaw: Float64Array;
  intensities: Float64Array;
}

const EMBRYO_COLUMNS = new Set(["genotype", "stage", "session"]);

function whereClause(f: ProfileFilter): { sql: string; params: unknown[] } {
  const conds: string[] = [];
  const params: unknown[] = [];
  if (f.genotype !== undefined) { conds.push("e.genotype = ?"); params.push(f.genotype); }
  if (f.genotypes !== undefined) {
    conds.push("e.genotype IN (SELECT value FROM json_each(?))");
    params.push(JSON.stringify(f.genotypes));
  }
  if (f.channel !== undefined) { conds.push("p.channel = ?"); params.push(f.channel); }
  if (f.embryo !== undefined) { conds.push("e.label = ?"); params.push(f.embryo); }
  if (f.importId !== undefined) { conds.push("p.import_id = ?"); params.push(f.importId); }
  if (f.profileIds !== undefined) {
    // One JSON parameter rather than one per id: SQLite caps bound variables at 32,766.
    conds.push("p.id IN (SELECT value FROM json_each(?))");
    params.push(JSON.stringify(f.profileIds));
  }
  for (const [key, value] of Object.entries(f.metadata ?? {})) {
    if (EMBRYO_COLUMNS.has(key)) conds.push(`e.${key} = ?`);
    else {
      conds.push("json_extract(e.metadata_json, '$.' || json_quote(?)) = ?");
      params.push(key);
    }
    params.push(value);
  }
  return { sql: conds.length ? `WHERE ${conds.join(" AND ")}` : "", params };
}

const COLUMNS = `p.id AS profile_id, e.id AS embryo_id, e.label, e.genotype, e.stage, e.age_s, e.length_um, e.dosage, e.session, e.metadata_json,
  p.channel, p.time_s, p.position_unit, p.pixel_size_um, p.n_points, p.dropped_points, p.flipped, p.import_id, i.file_name`;
const FROM = "FROM profiles p JOIN embryos e ON e.id = p.embryo_id JOIN imports i ON i.id = p.import_id";
const ORDER = "ORDER BY e.genotype, e.label, p.channel, p.time_s";

// The profile arrays live in overflow pages. SQLite sorts whole result rows, so
// a query that sorts also reads every column of every matching row: the order
// (and a page of it) is therefore found from the ids alone, and the arrays are
// read only for the rows returned, once each.
function orderedIds(db: Db, filter: ProfileFilter, paged: boolean): number[] {
  const { sql, params } = whereClause(filter);
  const page = paged && filter.limit !== undefined ? ` LIMIT ${Math.floor(filter.limit)} OFFSET ${Math.floor(filter.offset ?? 0)}` : "";
  return db
    .prepare(`SELECT p.id FROM profiles p JOIN embryos e ON e.id = p.embryo_id ${sql} ${ORDER}${page}`)
    .pluck()
    .all(...params) as number[];
}

function toSummary(r: Record<string, unknown>, rangeUm: [number, number]): ProfileSummary {
  return {
    profileId: r.profile_id as number,
    embryoId: r.embryo_id as number,
    embryo: r.label as string,
    ...embryoAttributesOf(r),
    channel: r.channel as string,
    timeS: r.time_s as number | null,
    positionUnit: r.position_unit as ProfileSummary["positionUnit"],
    pixelSizeUm: r.pixel_size_um as number | null,
    nPoints: r.n_points as number,
    droppedPoints: r.dropped_points as number,
    flipped: r.flipped === 1,
    importId: r.import_id as number,
    fileName: r.file_name as string,
    rangeUm,
  };
}

/** Profile summaries (no arrays; the first and last position as the range), ordered by genotype, embryo, channel and time. */
export function listProfiles(db: Db, filter: ProfileFilter = {}): ProfileSummary[] {
  const one = db.prepare(`SELECT ${COLUMNS}, substr(p.positions_um, 1, 8) AS first_um, substr(p.positions_um, -8, 8) AS last_um ${FROM} WHERE p.id = ?`);
  return db.transaction(() =>
    orderedIds(db, filter, true).map((id) => {
      const r = one.get(id) as Record<string, unknown>;
      return toSummary(r, [fromBlob(r.first_um as Buffer)[0], fromBlob(r.last_um as Buffer)[0]]);
    }),
  )();
}

export function countProfiles(db: Db, filter: ProfileFilter = {}): number {
  const { sql, params } = whereClause(filter);
  return (db.prepare(`SELECT COUNT(*) AS n FROM profiles p JOIN embryos e ON e.id = p.embryo_id ${sql}`).get(...params) as { n: number }).n;
}

/** Profiles with their data arrays, in the order of `listProfiles` (the filter's limit and offset do not apply). */
export function loadProfiles(db: Db, filter: ProfileFilter = {}): ProfileData[] {
  const { sql, params } = whereClause(filter);
  return db.transaction(() => {
    const ids = orderedIds(db, filter, false);
    // One unsorted pass reads each matching row's arrays once.
    const byId = new Map<number, ProfileData>();
    const rows = db.prepare(`SELECT ${COLUMNS}, p.positions_um, p.positions_raw, p.intensities ${FROM} ${sql}`).iterate(...params) as IterableIterator<Record<string, unknown>>;
    for (const r of rows) {
      const positionsUm = fromBlob(r.positions_um as Buffer);
      byId.set(r.profile_id as number, {
        ...toSummary(r, [positionsUm[0], positionsUm[positionsUm.length - 1]]),
        positionsUm,
        positionsRaw: fromBlob(r.positions_raw as Buffer),
        intensities: fromBlob(r.intensities as Buffer),
      });
    }
    return ids.map((id) => byId.get(id)!);
  })();
}

/** Distinct values of a grouping field among stored embryos (genotype, channel, stage, session or a metadata key). */
export function distinctValues(db: Db, field: string): string[] {
  if (field === "channel") return (db.prepare("SELECT DISTINCT channel AS v FROM profiles ORDER BY 1").all() as { v: string }[]).map((r) => r.v);
  if (EMBRYO_COLUMNS.has(field)) {
    return (db.prepare(`SELECT DISTINCT ${field} AS v FROM embryos WHERE ${field} IS NOT NULL ORDER BY 1`).all() as { v: string }[]).map((r) => r.v);
  }
  return (
    db.prepare("SELECT DISTINCT json_extract(metadata_json, '$.' || json_quote(?)) AS v FROM embryos WHERE v IS NOT NULL ORDER BY 1").all(field) as { v: string }[]
  ).map((r) => r.v);
}
