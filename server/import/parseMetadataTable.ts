import { classifyHeaders } from "./columnRoles.ts";
import { readDelimitedTable } from "./delimitedTable.ts";
import { EmbryoAttributeReader } from "./embryoAttributes.ts";
import { IssueCollector } from "./importError.ts";
import { looksLikeDecimalComma } from "./numericCell.ts";
import type { RawEmbryoAttributes } from "./rawTables.ts";
import type { WarningCollector } from "./warningCollector.ts";

/**
 * A metadata side file: one row per embryo (the embryo column, or else the
 * first column), with genotype, stage, age, length, dosage, session, pixel
 * size and any other columns, which are kept as free-form metadata.
 */
export function parseMetadataTable(
  text: string,
  file: string,
  options: { delimiter: "auto" | "," | ";" | "\t"; decimalMark: "auto" | "." | ","; labelPrefix: string },
  warnings: WarningCollector,
): Map<string, RawEmbryoAttributes> {
  const table = readDelimitedTable(text, file, options.delimiter);
  const issues = new IssueCollector();
  const decimalMark =
    options.decimalMark !== "auto" ? options.decimalMark : table.delimiter !== "," && looksLikeDecimalComma(table.rows.flatMap((r) => r.cells)) ? "," : ".";
  const columns = classifyHeaders(table.header.cells);
  const embryoCol = columns.find((c) => c.role === "embryo") ?? columns[0];
  const ignored = columns.filter((c) => c !== embryoCol && ["position", "intensity", "channel", "time", "embryo"].includes(c.role));
  for (const c of ignored) {
    warnings.add(`meta-ignored:${c.header}`, null, () => `side file column "${c.header}" was ignored: it describes profiles, not embryos`, "put profile columns in the data file");
  }
  const attrColumns = columns.filter((c) => c !== embryoCol && !ignored.includes(c));
  const reader = new EmbryoAttributeReader(file, attrColumns, decimalMark, issues, warnings);
  const seenRow = new Map<string, number>();
  for (const row of table.rows) {
    const label = row.cells[embryoCol.index].trim();
    if (label === "") {
      issues.add({ file, row: row.line, column: embryoCol.header }, "the embryo label is empty");
      continue;
    }
    const embryo = options.labelPrefix + label;
    if (seenRow.has(embryo)) {
      issues.add({ file, row: row.line, column: embryoCol.header, value: label }, `embryo "${label}" is listed twice in the side file (also row ${seenRow.get(embryo)})`);
      continue;
    }
    seenRow.set(embryo, row.line);
    reader.read(embryo, row.line, row.cells);
  }
  issues.throwIfAny();
  return reader.finish(warnings);
}
