/** One CSV cell: numbers as plain decimals, missing as empty. */
export type CsvCell = string | number | boolean | null | undefined;

/** Characters that make a spreadsheet treat a text cell as a formula. */
const FORMULA_START = /^[=+\-@\t\r]/;

function cell(value: CsvCell): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  let text = String(value);
  // A label such as "=HYPERLINK(…)" must stay text when the file is opened in a spreadsheet.
  // Source: OWASP, "CSV Injection".
  if (FORMULA_START.test(text) && !/^-?\d/.test(text)) text = `'${text}`;
  // Quote fields holding the separator, a quote or a line break; double inner quotes. Source: RFC 4180, section 2.
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** A comma-separated table with a header row and CRLF line ends (Source: RFC 4180). */
export function toCsv(header: string[], rows: CsvCell[][]): string {
  return [header, ...rows].map((r) => r.map(cell).join(",")).join("\r\n") + "\r\n";
}
