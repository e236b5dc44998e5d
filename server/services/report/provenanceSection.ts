import type { ImportRow } from "../../../db/imports.ts";
import { htmlTable } from "./htmlTable.ts";

/** Where the profiles came from: every import behind the reported profiles, with the SHA-256 of its bytes. */
export function provenanceSection(imports: ImportRow[]): string {
  const table = htmlTable(
    ["import", "file", "format", "side file", "SHA-256 of the file", "imported at (UTC)", "embryos", "profiles", "import warnings"],
    imports.map((i) => [i.id, i.fileName, i.format, i.metaFileName, i.sha256, i.importedAt, i.embryos, i.profiles, i.warnings.length]),
    [true, false, false, false, false, false, true, true, true],
  );
  return `<section id="provenance"><h2>Data provenance</h2><p>The profiles in this report were imported from these files. The SHA-256 identifies the exact bytes read; the import settings are stored with each import.</p>${table}</section>`;
}
