import type { Db } from "./connection.ts";

/** One row of the exclusion history. */
export interface ExclusionEvent {
  id: number;
  embryoId: number;
  embryo: string;
  genotype: string;
  /** null: the whole embryo. */
  profileId: number | null;
  channel: string | null;
  timeS: number | null;
  action: "exclude" | "include";
  reason: string;
  at: string;
}

const SELECT = `SELECT x.id, x.embryo_id, e.label, e.genotype, x.profile_id, p.channel, p.time_s, x.action, x.reason, x.at
  FROM exclusion_events x JOIN embryos e ON e.id = x.embryo_id LEFT JOIN profiles p ON p.id = x.profile_id`;

function toEvent(r: Record<string, unknown>): ExclusionEvent {
  return {
    id: r.id as number,
    embryoId: r.embryo_id as number,
    embryo: r.label as string,
    genotype: r.genotype as string,
    profileId: (r.profile_id as number | null) ?? null,
    channel: (r.channel as string | null) ?? null,
    timeS: (r.time_s as number | null) ?? null,
    action: r.action as ExclusionEvent["action"],
    reason: r.reason as string,
    at: r.at as string,
  };
}

/** Record that an embryo (profileId null) or one of its profiles is excluded or included again. */
export function recordExclusionEvent(
  db: Db,
  e: { embryoId: number; profileId: number | null; action: "exclude" | "include"; reason: string },
  now: () => Date = () => new Date(),
): ExclusionEvent {
  const id = Number(
    db.prepare("INSERT INTO exclusion_events (embryo_id, profile_id, action, reason, at) VALUES (?, ?, ?, ?, ?)").run(e.embryoId, e.profileId, e.action, e.reason, now().toISOString()).lastInsertRowid,
  );
  return toEvent(db.prepare(`${SELECT} WHERE x.id = ?`).get(id) as Record<string, unknown>);
}

/** Every event, oldest first (optionally of one embryo). */
export function exclusionHistory(db: Db, embryoId?: number): ExclusionEvent[] {
  const rows = embryoId === undefined ? db.prepare(`${SELECT} ORDER BY x.id`).all() : db.prepare(`${SELECT} WHERE x.embryo_id = ? ORDER BY x.id`).all(embryoId);
  return (rows as Record<string, unknown>[]).map(toEvent);
}

/** The exclusions in force: the newest event of each embryo or profile, where it is an exclusion. */
export function currentExclusions(db: Db): ExclusionEvent[] {
  const rows = db
    .prepare(
      `${SELECT} WHERE x.id IN (SELECT MAX(id) FROM exclusion_events GROUP BY embryo_id, IFNULL(profile_id, 0)) AND x.action = 'exclude'
       ORDER BY e.genotype, e.label, x.profile_id`,
    )
    .all() as Record<string, unknown>[];
  return rows.map(toEvent);
}

/** An embryo's id and its profiles, by label. */
export function findEmbryo(db: Db, label: string): { id: number; label: string; genotype: string; profiles: { id: number; channel: string; timeS: number | null }[] } | null {
  const e = db.prepare("SELECT id, label, genotype FROM embryos WHERE label = ?").get(label) as { id: number; label: string; genotype: string } | undefined;
  if (!e) return null;
  const profiles = (db.prepare("SELECT id, channel, time_s FROM profiles WHERE embryo_id = ? ORDER BY channel, time_s").all(e.id) as { id: number; channel: string; time_s: number | null }[]).map((p) => ({
    id: p.id,
    channel: p.channel,
    timeS: p.time_s,
  }));
  return { ...e, profiles };
}
