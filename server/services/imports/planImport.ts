import type { Db } from "../../../db/connection.ts";
import type { EmbryoField, FieldValue } from "../../../db/importChanges.ts";
import { findImportsOfBytes } from "../../../db/imports.ts";
import { canonicalJson } from "../../../db/stableHash.ts";
import { findStoredEmbryos, type StoredEmbryo } from "../../../db/storedEmbryos.ts";
import { UNASSIGNED_GENOTYPE } from "../../import/parseProfileFile.ts";
import type { EmbryoRecord, ParsedImport, ProfileRecord } from "../../import/records.ts";

/** One value of a stored embryo against the file's. */
export interface FieldDifference {
  field: EmbryoField;
  /** The value's name in the user's words ("length (µm)", metadata "mounting"). */
  name: string;
  stored: FieldValue;
  file: FieldValue;
}

/** What a file would do to an embryo that is already stored under the same label. */
export interface StoredEmbryoPlan {
  label: string;
  /** File that first stored the embryo. */
  storedFrom: string;
  embryoId: number;
  /** Values the stored embryo lacks and the file gives: added (and undone when the import is deleted). */
  additions: FieldDifference[];
  /** Values both give, differently: the user chooses. */
  conflicts: FieldDifference[];
  /** Profiles the embryo does not have yet (a new channel or time point). */
  newProfiles: string[];
  /** Profiles stored with exactly the same positions and intensities: nothing to add. */
  unchangedProfiles: string[];
  /** Profiles stored for the same channel and time with other values. */
  clashingProfiles: { profile: string; storedFrom: string }[];
}

/** An import of the same bytes made earlier, and how its options differ from these. */
export interface EarlierImport {
  importId: number;
  fileName: string;
  /** Empty: the same bytes, side file and options. */
  differences: string[];
}

/** The comparison of one parsed file with the open database, before anything is stored. */
export interface ImportPlan {
  /** An import of the same bytes with the same side file and options: importing again would do nothing. */
  sameImport: EarlierImport | null;
  /** Imports of the same bytes with other options or another side file. */
  earlierImports: EarlierImport[];
  newEmbryos: string[];
  stored: StoredEmbryoPlan[];
  newProfiles: number;
  unchangedProfiles: number;
  /** Conflicting values plus clashing profiles, over all stored embryos. */
  conflicts: number;
  additions: number;
}

/** The options that decide what a file's bytes become; the limits and the conflict choice do not. */
const IDENTITY_OPTIONS: [string, string][] = [
  ["format", "table shape"],
  ["delimiter", "separator"],
  ["decimalMark", "decimal mark"],
  ["positionUnit", "position unit"],
  ["pixelSizeUm", "pixel size (µm)"],
  ["lengthUm", "embryo length (µm)"],
  ["genotype", "genotype"],
  ["channel", "channel"],
  ["labelPrefix", "label prefix"],
  ["flip", "flip"],
];

/** Compare a parsed file with what the database holds: earlier imports of its bytes, stored embryos, their values and profiles. */
export function planImport(db: Db, parsed: ParsedImport, options: Record<string, unknown>): ImportPlan {
  const earlierImports = findImportsOfBytes(db, parsed.sha256).map((i): EarlierImport => {
    const differences = IDENTITY_OPTIONS.filter(([k]) => canonicalJson(i.settings[k] ?? null) !== canonicalJson(options[k] ?? null)).map(
      ([k, name]) => `${name} ${show(i.settings[k])} then, ${show(options[k])} now`,
    );
    if (i.metaSha256 !== parsed.metaSha256) {
      differences.push(
        i.metaSha256 === null ? `no side file then, ${parsed.metaFileName} now` : parsed.metaSha256 === null ? `side file ${i.metaFileName} then, none now` : `side file ${i.metaFileName} then, ${parsed.metaFileName} now (other content)`,
      );
    }
    return { importId: i.id, fileName: i.fileName, differences };
  });
  const storedByLabel = findStoredEmbryos(db, parsed.embryos.map((e) => e.label));
  const stored: StoredEmbryoPlan[] = [];
  const newEmbryos: string[] = [];
  let newProfiles = 0;
  let unchangedProfiles = 0;
  for (const e of parsed.embryos) {
    const s = storedByLabel.get(e.label);
    const mine = parsed.profiles.filter((p) => p.embryo === e.label);
    if (!s) {
      newEmbryos.push(e.label);
      newProfiles += mine.length;
      continue;
    }
    const plan = compareEmbryo(e, s, mine);
    newProfiles += plan.newProfiles.length;
    unchangedProfiles += plan.unchangedProfiles.length;
    stored.push(plan);
  }
  return {
    sameImport: earlierImports.find((i) => i.differences.length === 0) ?? null,
    earlierImports: earlierImports.filter((i) => i.differences.length > 0),
    newEmbryos,
    stored,
    newProfiles,
    unchangedProfiles,
    conflicts: stored.reduce((n, s) => n + s.conflicts.length + s.clashingProfiles.length, 0),
    additions: stored.reduce((n, s) => n + s.additions.length, 0),
  };
}

function compareEmbryo(e: EmbryoRecord, s: StoredEmbryo, profiles: ProfileRecord[]): StoredEmbryoPlan {
  const plan: StoredEmbryoPlan = { label: e.label, storedFrom: s.firstFile, embryoId: s.id, additions: [], conflicts: [], newProfiles: [], unchangedProfiles: [], clashingProfiles: [] };
  const compare = (field: EmbryoField, name: string, stored: FieldValue, file: FieldValue, storedIsEmpty = stored === null) => {
    if (file === null || sameValue(stored, file)) return;
    (storedIsEmpty ? plan.additions : plan.conflicts).push({ field, name, stored, file });
  };
  compare("genotype", "genotype", s.genotype, e.genotype === UNASSIGNED_GENOTYPE ? null : e.genotype, s.genotype === UNASSIGNED_GENOTYPE);
  compare("stage", "stage", s.stage, e.stage);
  compare("age_s", "age (s)", s.ageS, e.ageS);
  compare("length_um", "length (µm)", s.lengthUm, e.lengthUm);
  compare("dosage", "dosage", s.dosage, e.dosage);
  compare("session", "session", s.session, e.session);
  for (const [key, value] of Object.entries(e.metadata)) compare(`meta:${key}`, `"${key}"`, s.metadata[key] ?? null, value);
  for (const p of profiles) {
    const name = describeProfile(p.channel, p.timeS);
    const same = s.profiles.find((q) => q.channel === p.channel && q.timeS === p.timeS);
    if (!same) plan.newProfiles.push(name);
    else if (sameArray(same.positionsUm, p.positionsUm) && sameArray(same.intensities, p.intensities)) plan.unchangedProfiles.push(name);
    else plan.clashingProfiles.push({ profile: name, storedFrom: same.fileName });
  }
  return plan;
}

/** "glm", or "glm at 60 s" for a time point. */
export function describeProfile(channel: string, timeS: number | null): string {
  return timeS === null ? channel : `${channel} at ${timeS} s`;
}

/** Numbers agree to 1e-9 relative (a length converted from pixels need not round-trip exactly); text exactly. */
function sameValue(a: FieldValue, b: FieldValue): boolean {
  if (typeof a === "number" && typeof b === "number") return Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
  return a === b;
}

function sameArray(a: Float64Array, b: Float64Array): boolean {
  return a.length === b.length && a.every((v, i) => v === b[i]);
}

function show(v: unknown): string {
  if (v === undefined || v === null || v === "") return "(none)";
  return typeof v === "string" ? `"${v}"` : String(v);
}
