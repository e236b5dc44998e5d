import type { Db } from "../../db/connection.ts";
import { storeParsedImport } from "../../db/storeImport.ts";
import type { ResolvedImportOptions } from "../import/importOptions.ts";
import { parseProfileFile, type SourceFile } from "../import/parseProfileFile.ts";
import type { ImportWarning, ParsedImport } from "../import/records.ts";
import { isUserError, type UserIssue } from "../userError.ts";
import { boundedUserError, checkParsedImport } from "./uploadChecks.ts";

export type ImportReport =
  | {
      file: string;
      status: "imported" | "already-imported";
      importId: number;
      format: string;
      embryosAdded: number;
      embryosMatched: number;
      profilesAdded: number;
      embryos: string[];
      warnings: ImportWarning[];
      message: string;
    }
  | { file: string; status: "rejected"; error: { code: string; message: string; issues: UserIssue[] } };

/**
 * Import each file in its own transaction: a file goes in whole or not at all,
 * and one rejected file does not stop the others. The same bytes twice add nothing.
 */
export function importFiles(db: Db, files: SourceFile[], options: ResolvedImportOptions, meta?: SourceFile, parse: ParseFile = parseProfileFile): ImportReport[] {
  return files.map((file) => importOne(db, file, options, meta, parse));
}

/** How a file becomes records: the parser itself, or (in the server) the result of parsing it in a worker thread. */
export type ParseFile = (file: SourceFile, options: ResolvedImportOptions, meta?: SourceFile) => ParsedImport;

function importOne(db: Db, file: SourceFile, options: ResolvedImportOptions, meta: SourceFile | undefined, parse: ParseFile): ImportReport {
  let parsed: ParsedImport;
  try {
    parsed = parse(file, options, meta);
    checkParsedImport(parsed);
    const stored = storeParsedImport(db, parsed, { ...options, metaFile: meta?.name ?? null });
    const again = stored.status === "already-imported";
    return {
      file: file.name,
      status: stored.status,
      importId: stored.importId,
      format: parsed.format,
      embryosAdded: stored.embryosAdded,
      embryosMatched: stored.embryosMatched,
      profilesAdded: stored.profilesAdded,
      embryos: again ? [] : parsed.embryos.map((e) => e.label),
      warnings: again ? [] : parsed.warnings,
      message: again
        ? `already imported${stored.originalFileName !== file.name ? ` as ${stored.originalFileName}` : ""} (import #${stored.importId}); nothing added`
        : `${stored.profilesAdded} profile${stored.profilesAdded === 1 ? "" : "s"} from ${parsed.embryos.length} embryo${parsed.embryos.length === 1 ? "" : "s"} (${stored.embryosAdded} new)` + joinedNote(stored.embryosMatched, parsed),
    };
  } catch (caught) {
    if (!isUserError(caught)) throw caught;
    const e = boundedUserError(caught);
    return { file: file.name, status: "rejected", error: { code: e.code, message: e.message, issues: e.issues } };
  }
}

/**
 * Embryos already stored under the same label are the same embryos: say so,
 * naming the channel(s) the new profiles were added as, so that a file of the
 * same embryos imported twice under another channel name does not go unnoticed.
 */
function joinedNote(matched: number, parsed: ParsedImport): string {
  if (matched === 0) return "";
  const channels = [...new Set(parsed.profiles.map((p) => p.channel))].map((c) => `"${c}"`).join(", ");
  return `; ${matched} embryo${matched === 1 ? " was" : "s were"} already stored under the same label and gained profiles of channel ${channels} — if these are different embryos, delete this import and use a label prefix`;
}
