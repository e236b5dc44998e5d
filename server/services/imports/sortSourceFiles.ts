import type { ResolvedImportOptions } from "../../import/importOptions.ts";
import type { SourceFile } from "../../import/parseProfileFile.ts";
import { UserError } from "../../userError.ts";
import { listColumns, sniffSourceFile } from "./sniffSourceFile.ts";

export interface SortedFiles {
  profiles: SourceFile[];
  meta: SourceFile | undefined;
  /** How a side file given among the profile files was recognised, to tell the user. */
  notes: string[];
}

/**
 * Files given together for one import: a file with one row per embryo and no
 * position column is the side file of the others. More than one side file,
 * a side file besides --meta, or side files alone are refused before anything
 * is read further, saying what each file is.
 */
export function sortSourceFiles(files: SourceFile[], meta: SourceFile | undefined, options: ResolvedImportOptions): SortedFiles {
  const sniffed = files.map((f) => ({ file: f, s: sniffSourceFile(f, options) }));
  const side = sniffed.filter((x) => x.s.kind === "side-file");
  if (side.length === 0) return { profiles: files, meta, notes: [] };
  const what = (x: (typeof side)[number]) => `${x.file.name} is a side file (one row per embryo, columns ${x.s.kind === "side-file" ? listColumns(x.s.columns) : ""}, no position column)`;
  const profiles = files.filter((f) => !side.some((x) => x.file === f));
  if (profiles.length === 0) {
    throw new UserError("side-file-alone", `${what(side[0])}, and no profile file was given with it; name the profile file it describes too (morphogauge import PROFILES ${side[0].file.name}). Nothing was imported.`);
  }
  if (meta) {
    throw new UserError("two-side-files", `${what(side[0])}, but ${meta.name} is already given as the side file (--meta); give one side file per import. Nothing was imported.`);
  }
  if (side.length > 1) {
    throw new UserError("two-side-files", `${side.map((x) => x.file.name).join(" and ")} are all side files (one row per embryo, no position column); give one side file per import. Nothing was imported.`);
  }
  return {
    profiles,
    meta: side[0].file,
    notes: [`${side[0].file.name}: read as the side file of ${profiles.map((p) => p.name).join(", ")} (one row per embryo, no position column)`],
  };
}
