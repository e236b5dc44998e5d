import { classifyHeaders } from "../../import/columnRoles.ts";
import { decodeText } from "../../import/decodeText.ts";
import { readDelimitedTable } from "../../import/delimitedTable.ts";
import type { ResolvedImportOptions } from "../../import/importOptions.ts";
import { looksLikeDecimalComma, readNumericCell } from "../../import/numericCell.ts";
import { isUserError } from "../../userError.ts";

/** Side files hold one row per embryo; of a larger file only the start is read, which tells the header and first column. */
const SNIFF_BYTES = 256 * 1024;

/** What a file given for import holds, judged from its header and first column before anything is parsed in full. */
export type SniffedFile =
  | { kind: "profiles" }
  /** One row per embryo and no position column: per-embryo metadata for the profiles imported with it. */
  | { kind: "side-file"; columns: string[]; labels: string[] }
  /** Neither: no column is read as a position, and the first column holds no numbers. */
  | { kind: "no-position"; columns: string[] };

/**
 * Tell profiles from a side file: a profile table has a position column (long)
 * or positions as numbers in its first column (wide); a side file has neither,
 * and a different embryo label on every row. Of a large file only the first
 * 256 kB are read. Problems of the table itself are
 * left to the parser, which names them by row and column.
 */
export function sniffSourceFile(file: { name: string; bytes: Uint8Array }, options: Pick<ResolvedImportOptions, "delimiter" | "decimalMark" | "labelPrefix">): SniffedFile {
  let bytes = file.bytes;
  if (bytes.length > SNIFF_BYTES) {
    // UTF-16 files are left to the parser; in any other encoding a line ends at byte 0x0A.
    if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) return { kind: "profiles" };
    const end = bytes.subarray(0, SNIFF_BYTES).lastIndexOf(0x0a);
    if (end <= 0) return { kind: "profiles" };
    bytes = bytes.subarray(0, end + 1);
  }
  let table;
  try {
    table = readDelimitedTable(decodeText(bytes, file.name), file.name, options.delimiter);
  } catch (e) {
    if (isUserError(e)) return { kind: "profiles" };
    throw e;
  }
  const columns = classifyHeaders(table.header.cells);
  if (columns.some((c) => c.role === "position")) return { kind: "profiles" };
  const decimalMark = options.decimalMark !== "auto" ? options.decimalMark : table.delimiter !== "," && looksLikeDecimalComma(table.rows.flatMap((r) => r.cells)) ? "," : ".";
  const first = table.rows.map((r) => readNumericCell(r.cells[0] ?? "", decimalMark));
  if (first.some((c) => c.kind === "number") && !first.some((c) => c.kind === "invalid")) return { kind: "profiles" };
  const headers = columns.map((c) => c.header);
  const embryoColumn = columns.find((c) => c.role === "embryo") ?? columns[0];
  const labels = table.rows.map((r) => (r.cells[embryoColumn.index] ?? "").trim());
  const oneRowPerEmbryo = labels.length > 0 && labels.every((l) => l !== "") && new Set(labels).size === labels.length;
  if (oneRowPerEmbryo && !columns.some((c) => c.role === "intensity")) {
    return { kind: "side-file", columns: headers, labels: labels.map((l) => options.labelPrefix + l) };
  }
  return { kind: "no-position", columns: headers };
}

/** "position [µm]", "x (px)" or "x/L": the header names that make a column the position. */
export const POSITION_HEADER_EXAMPLES = `"position [µm]", "x (px)" or "x/L"`;

/** The columns of a file, quoted and listed for a message (at most 12). */
export function listColumns(columns: string[]): string {
  const shown = columns.slice(0, 12).map((c) => `"${c}"`).join(", ");
  return columns.length > 12 ? `${shown} and ${columns.length - 12} more` : shown;
}
