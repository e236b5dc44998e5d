import type { Db } from "../../../db/connection.ts";
import { currentExclusions, exclusionHistory, findEmbryo, recordExclusionEvent, type ExclusionEvent } from "../../../db/exclusions.ts";
import { UserError } from "../../userError.ts";
import type { ExcludeRequest, IncludeRequest } from "./exclusionRequest.ts";

/** An exclusion as results and listings show it. */
export interface LeftOut {
  embryo: string;
  genotype: string;
  /** "embryo": the whole embryo; "profile": only the named channel (and time point). */
  scope: "embryo" | "profile";
  channel: string | null;
  time_s: number | null;
  reason: string;
  since: string;
}

export function leftOutEntry(e: ExclusionEvent): LeftOut {
  return { embryo: e.embryo, genotype: e.genotype, scope: e.profileId === null ? "embryo" : "profile", channel: e.channel, time_s: e.timeS, reason: e.reason, since: e.at };
}

function target(db: Db, r: { embryo: string; channel?: string; timeS?: number }) {
  const embryo = findEmbryo(db, r.embryo);
  if (!embryo) throw new UserError("unknown-embryo", `No embryo labelled "${r.embryo}" is stored.`, { status: 404, issues: [{ path: "embryo", message: "unknown label" }] });
  if (r.channel === undefined) {
    if (r.timeS !== undefined) throw new UserError("bad-option", "A time point (timeS) picks one profile of a channel; give the channel too.", { status: 400 });
    return { embryo, profileIds: [null] as (number | null)[] };
  }
  const profiles = embryo.profiles.filter((p) => p.channel === r.channel && (r.timeS === undefined || p.timeS === r.timeS));
  if (profiles.length === 0) {
    const have = embryo.profiles.map((p) => p.channel + (p.timeS !== null ? ` at ${p.timeS} s` : ""));
    throw new UserError("unknown-profile", `Embryo "${embryo.label}" has no profile of channel "${r.channel}"${r.timeS !== undefined ? ` at ${r.timeS} s` : ""} (it has: ${[...new Set(have)].join(", ")}).`, { status: 404, issues: [{ path: "channel", message: "no such profile" }] });
  }
  return { embryo, profileIds: profiles.map((p) => p.id) as (number | null)[] };
}

const keyOf = (e: { embryoId: number; profileId: number | null }) => `${e.embryoId}|${e.profileId ?? 0}`;

/** Exclude an embryo or some of its profiles; excluding again updates the reason. Returns the events recorded. */
export function excludeEmbryo(db: Db, r: ExcludeRequest, now?: () => Date) {
  const { embryo, profileIds } = target(db, r);
  const events = db.transaction(() => profileIds.map((profileId) => recordExclusionEvent(db, { embryoId: embryo.id, profileId, action: "exclude", reason: r.reason }, now)))();
  return { excluded: events.map(leftOutEntry) };
}

/** Include again what was excluded; refuses when nothing named is excluded, so a typo does not pass silently. */
export function includeEmbryo(db: Db, r: IncludeRequest, now?: () => Date) {
  const { embryo, profileIds } = target(db, r);
  const current = new Map(currentExclusions(db).filter((e) => e.embryoId === embryo.id).map((e) => [keyOf(e), e]));
  const wholeExcluded = current.get(keyOf({ embryoId: embryo.id, profileId: null }));
  const toInclude = profileIds.filter((p) => current.has(keyOf({ embryoId: embryo.id, profileId: p })));
  // Including the whole embryo also lifts the exclusions of its single profiles.
  if (r.channel === undefined) for (const e of current.values()) if (e.profileId !== null) toInclude.push(e.profileId);
  if (toInclude.length === 0) {
    const why = wholeExcluded ? ` The whole embryo is excluded (${wholeExcluded.reason}); include the embryo instead of one channel.` : "";
    throw new UserError("not-excluded", `Embryo "${embryo.label}"${r.channel ? `, channel "${r.channel}",` : ""} is not excluded, so there is nothing to include.${why}`, { status: 409 });
  }
  const events = db.transaction(() => toInclude.map((profileId) => recordExclusionEvent(db, { embryoId: embryo.id, profileId, action: "include", reason: r.reason }, now)))();
  return { included: events.map(leftOutEntry) };
}

/** The exclusions in force and the whole history (oldest first). */
export function exclusionOverview(db: Db) {
  return {
    current: currentExclusions(db).map(leftOutEntry),
    history: exclusionHistory(db).map((e) => ({ ...leftOutEntry(e), action: e.action })),
  };
}

export type ExclusionOverview = ReturnType<typeof exclusionOverview>;

/**
 * Split profiles into those an analysis uses and those left out by an
 * exclusion in force (of the embryo or of that profile), with the reasons.
 * With `includeExcluded`, nothing is left out.
 */
export function applyExclusions<P extends { profileId: number; embryoId: number }>(db: Db, profiles: P[], includeExcluded = false): { kept: P[]; leftOut: LeftOut[] } {
  if (includeExcluded) return { kept: profiles, leftOut: [] };
  const current = currentExclusions(db);
  const byKey = new Map(current.map((e) => [keyOf(e), e]));
  const kept: P[] = [];
  const leftOut = new Map<string, LeftOut>();
  for (const p of profiles) {
    const hit = byKey.get(keyOf({ embryoId: p.embryoId, profileId: null })) ?? byKey.get(keyOf({ embryoId: p.embryoId, profileId: p.profileId }));
    if (!hit) kept.push(p);
    else leftOut.set(keyOf(hit), leftOutEntry(hit));
  }
  return { kept, leftOut: [...leftOut.values()] };
}
