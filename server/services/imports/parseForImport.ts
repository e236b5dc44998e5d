import { ImportError } from "../../import/importError.ts";
import type { ResolvedImportOptions } from "../../import/importOptions.ts";
import { parseProfileFile, type SourceFile } from "../../import/parseProfileFile.ts";
import type { ParsedImport } from "../../import/records.ts";
import { listEmbryos } from "../../import/warningCollector.ts";
import { listColumns, POSITION_HEADER_EXAMPLES, sniffSourceFile } from "./sniffSourceFile.ts";

/**
 * Parse a profile file for import, first making sure it is one: a side file
 * given as profiles, or a table with no position column, is refused with what
 * it is; a side file that names none of the file's embryos (the side file of
 * another experiment) is refused rather than leaving every embryo without metadata.
 */
export function parseForImport(file: SourceFile, options: ResolvedImportOptions, meta?: SourceFile): ParsedImport {
  const sniffed = sniffSourceFile(file, options);
  if (sniffed.kind === "side-file") {
    throw new ImportError([
      {
        location: { file: file.name },
        message: `this is a side file (one row per embryo, columns ${listColumns(sniffed.columns)}, no position column), not a profile table; give it together with the profile file it describes (as a second file or with --meta)`,
      },
    ]);
  }
  if (sniffed.kind === "no-position") {
    throw new ImportError([
      { location: { file: file.name }, message: `no position column found (columns seen: ${listColumns(sniffed.columns)}); name the position column with a unit, e.g. ${POSITION_HEADER_EXAMPLES}` },
    ]);
  }
  const parsed = parseProfileFile(file, options, meta);
  if (meta) {
    const side = sniffSourceFile(meta, options);
    if (side.kind === "side-file") {
      const named = new Set(side.labels);
      if (!parsed.embryos.some((e) => named.has(e.label))) {
        throw new ImportError([
          {
            location: { file: meta.name },
            message: `the side file names none of the ${parsed.embryos.length} embryos of ${file.name} (side file: ${listEmbryos(side.labels, 3)}; ${file.name}: ${listEmbryos(parsed.embryos.map((e) => e.label), 3)}); is it the side file of another experiment?`,
          },
        ]);
      }
    }
  }
  return parsed;
}
