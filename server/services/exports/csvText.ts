/** A cell: numbers are written in full (shortest round-trip form), null and non-finite numbers as empty cells. */
export type CsvCell = string | number | boolean | null | undefined;

/** A table with its column names (units in the names, e.g. lambda_um) and rows of cells. */
export interface CsvTable {
  columns: string[];
  rows: CsvCell[][];
}

function cellText(c: CsvCell): string {
  if (c === null || c === undefined) return "";
  if (typeof c === "number") return Number.isFinite(c) ? String(c) : "";
  if (typeof c === "boolean") return c ? "true" : "false";
  return c;
}

/** Quote a field when it holds a comma, a double quote or a line break, doubling inner quotes (RFC 4180, section 2). */
function field(c: CsvCell): string {
  const text = cellText(c);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The table as CSV text: a header line, then one line per row, each ended by CRLF (RFC 4180). */
export function csvText(table: CsvTable): string {
  const width = table.columns.length;
  for (const [i, row] of table.rows.entries()) {
    if (row.length !== width) throw new RangeError(`csvText: row ${i + 1} has ${row.length} cells but there are ${width} columns`);
  }
  return [table.columns, ...table.rows].map((r) => r.map(field).join(",") + "\r\n").join("");
}
