import type { Db } from "../../db/connection.ts";
import { storeParsedImport } from "../../db/storeImport.ts";
import type { ResolvedImportOptions } from "../import/importOptions.ts";
import type { SourceFile } from "../import/parseProfileFile.ts";
import type { ImportWarning, ParsedImport } from "../import/records.ts";
import { isUserError, type UserIssue } from "../userError.ts";
import { parseForImport } from "./imports/parseForImport.ts";
import { planImport } from "./imports/planImport.ts";
import { resolveImport, type ConflictChoice } from "./imports/resolveImport.ts";

export type ImportReport =
  | {
      file: string;
      /** already-imported: nothing was stored; the message says precisely why. */
      status: "imported" | "already-imported";
      importId: number | null;
      format: string;
      embryosAdded: number;
      embryosMatched: number;
      profilesAdded: number;
      /** Values of stored embryos this import filled in or replaced (undone when it is deleted). */
      valuesChanged: number;
      embryos: string[];
      warnings: ImportWarning[];
      message: string;
    }
  | { file: string; status: "rejected"; error: { code: string; message: string; issues: UserIssue[] } };

/** The options an import is identified by, stored with it. */
export function importSettings(options: ResolvedImportOptions, meta?: SourceFile): Record<string, unknown> {
  return { ...options, metaFile: meta?.name ?? null };
}

/**
 * Import each file in its own transaction: a file goes in whole or not at all,
 * and one rejected file does not stop the others. Each file is first compared
 * with the database; values that differ from stored embryos are handled as
 * `onConflict` says (refused by default), never overwritten silently.
 */
export function importFiles(db: Db, files: SourceFile[], options: ResolvedImportOptions, meta?: SourceFile, onConflict: ConflictChoice = "refuse"): ImportReport[] {
  return files.map((file) => importOne(db, file, options, meta, onConflict));
}

function importOne(db: Db, file: SourceFile, options: ResolvedImportOptions, meta: SourceFile | undefined, onConflict: ConflictChoice): ImportReport {
  try {
    const parsed = parseForImport(file, options, meta);
    const settings = importSettings(options, meta);
    // Compare and store in one transaction, so the comparison still holds when the file is stored.
    return db.transaction((): ImportReport => {
      const plan = planImport(db, parsed, settings);
      const resolved = resolveImport(parsed, plan, onConflict, settings);
      const base = { file: file.name, format: parsed.format, embryosMatched: plan.stored.length };
      if (resolved.kind === "nothing-new") {
        return { ...base, status: "already-imported", importId: plan.sameImport?.importId ?? null, embryosAdded: 0, profilesAdded: 0, valuesChanged: 0, embryos: [], warnings: [], message: resolved.message };
      }
      const stored = storeParsedImport(db, resolved.toStore);
      return {
        ...base,
        status: "imported",
        importId: stored.importId,
        embryosAdded: stored.embryosAdded,
        profilesAdded: stored.profilesAdded,
        valuesChanged: stored.valuesChanged,
        embryos: parsed.embryos.map((e) => e.label),
        warnings: resolved.toStore.warnings,
        message:
          `${stored.profilesAdded} profile${stored.profilesAdded === 1 ? "" : "s"} from ${parsed.embryos.length} embryo${parsed.embryos.length === 1 ? "" : "s"} (${stored.embryosAdded} new)` +
          joinedNote(plan.stored.map((x) => x.label), resolved.toStore.profiles) +
          resolved.notes.map((n) => `; ${n}`).join(""),
      };
    })();
  } catch (e) {
    if (!isUserError(e)) throw e;
    return { file: file.name, status: "rejected", error: { code: e.code, message: e.message, issues: e.issues } };
  }
}

/**
 * Embryos already stored under the same label are the same embryos: say so,
 * naming the channel(s) the new profiles were added as, so that a file of the
 * same embryos imported twice under another channel name does not go unnoticed.
 */
function joinedNote(storedLabels: string[], added: ParsedImport["profiles"]): string {
  if (storedLabels.length === 0) return "";
  const stored = new Set(storedLabels);
  const joined = added.filter((p) => stored.has(p.embryo));
  const gained = new Set(joined.map((p) => p.embryo)).size;
  const channels = [...new Set(joined.map((p) => p.channel))].map((c) => `"${c}"`).join(", ");
  const n = storedLabels.length;
  return `; ${n} embryo${n === 1 ? " was" : "s were"} already stored under the same label` +
    (gained > 0 ? ` and ${gained === n ? "" : `${gained} of them `}gained profiles of channel ${channels} — if these are different embryos, delete this import and use a label prefix` : "");
}
