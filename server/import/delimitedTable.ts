import { IssueCollector } from "./importError.ts";
import { tokenizeRows, type Delimiter, type TableRow } from "./tokenizeRows.ts";

export type { Delimiter, TableRow } from "./tokenizeRows.ts";

/** A table read whole: header and every data row. */
export interface DelimitedTable {
  delimiter: Delimiter;
  header: TableRow;
  rows: TableRow[];
}

/** A table read one row at a time: the header now, the data rows on `forEachRow`. */
export interface TableStream {
  delimiter: Delimiter;
  header: TableRow;
  /**
   * Calls `onRow` for each data row in file order, with exactly as many cells
   * as the header has columns (blank and `#` comment lines skipped). Problems
   * of the table's shape (a value in a column with no header) are thrown
   * together after the last row, in place of anything `onRow` collected.
   * `onRow` may return false to stop early (shape problems are then not checked).
   */
  forEachRow(onRow: (row: TableRow) => void | boolean): void;
}

/**
 * Open a table given as text pieces (`pieces()` starts a new pass): detect the
 * delimiter, read and check the header. The first non-blank, non-comment row
 * is the header; trailing empty header columns are dropped.
 */
export function openDelimitedTable(pieces: () => Iterable<string>, fileName: string, delimiterOption: "auto" | Delimiter): TableStream {
  const issues = new IssueCollector();
  const delimiter = delimiterOption === "auto" ? detectDelimiterInPieces(pieces()) : delimiterOption;
  const rows = tokenizeRows(pieces(), delimiter, fileName);
  // Pulled by hand: leaving a for-of loop early would close the generator.
  let header: TableRow | undefined;
  for (let next = rows.next(); !next.done; next = rows.next()) {
    if (!isBlank(next.value)) {
      header = next.value;
      break;
    }
  }
  if (header === undefined) {
    issues.add({ file: fileName }, "the file has no header and no data (only blank or # comment lines)");
    issues.throwIfAny();
  }
  const head = header!;
  head.cells = head.cells.map((c) => c.trim());
  let width = head.cells.length;
  while (width > 0 && head.cells[width - 1] === "") width--;
  if (width < 2) {
    const sep = delimiter === "\t" ? "tab" : `"${delimiter}"`;
    issues.add(
      { file: fileName, row: head.line },
      `the header has ${width} column${width === 1 ? "" : "s"} when split at ${sep}; expected at least a position and an intensity column (separators accepted: comma, semicolon, tab)`,
    );
    issues.throwIfAny();
  }
  head.cells.length = width;
  head.cells.forEach((name, i) => {
    if (name === "") issues.add({ file: fileName, row: head.line }, `column ${i + 1} has no name in the header`);
  });
  const seen = new Map<string, number>();
  head.cells.forEach((name, i) => {
    const key = name.toLowerCase();
    if (name !== "" && seen.has(key)) {
      issues.add({ file: fileName, row: head.line, column: name }, `the column name appears twice (columns ${seen.get(key)! + 1} and ${i + 1})`);
    }
    seen.set(key, i);
  });
  issues.throwIfAny();

  let used = false;
  return {
    delimiter,
    header: head,
    forEachRow(onRow) {
      if (used) throw new Error("TableStream.forEachRow: a table stream can be read once");
      used = true;
      const shape = new IssueCollector();
      for (let next = rows.next(); !next.done; next = rows.next()) {
        const r = next.value;
        if (isBlank(r)) continue;
        const cells = r.cells;
        if (cells.length > width) {
          for (let i = width; i < cells.length; i++) {
            if (cells[i].trim() !== "") {
              shape.add({ file: fileName, row: r.line, value: cells[i] }, `has a value in column ${i + 1}, which has no header`);
              break;
            }
          }
          cells.length = width;
        }
        while (cells.length < width) cells.push("");
        if (onRow(r) === false) {
          rows.return(undefined);
          return;
        }
      }
      shape.throwIfAny();
    },
  };
}

/** Read a whole table held as one text (side files, small tables). */
export function readDelimitedTable(text: string, fileName: string, delimiterOption: "auto" | Delimiter): DelimitedTable {
  return collectRows(openDelimitedTable(() => [text], fileName, delimiterOption));
}

/** Every data row of a table stream, kept (wide tables, side files). */
export function collectRows(table: TableStream): DelimitedTable {
  const rows: TableRow[] = [];
  table.forEachRow((r) => {
    rows.push(r);
  });
  return { delimiter: table.delimiter, header: table.header, rows };
}

/** Tab if the header line has a tab, else semicolon if it has one, else comma. */
export function detectDelimiter(text: string): Delimiter {
  return detectInLines(text, true) ?? ",";
}

function detectDelimiterInPieces(pieces: Iterable<string>): Delimiter {
  let head = "";
  for (const piece of pieces) {
    head += piece;
    const found = detectInLines(head, false);
    if (found !== null) return found;
  }
  return detectInLines(head, true) ?? ",";
}

/** The delimiter from the first non-blank, non-comment line, or null if that line may not be complete yet. */
function detectInLines(text: string, complete: boolean): Delimiter | null {
  let start = 0;
  for (;;) {
    const m = /\r\n|\n|\r/g;
    m.lastIndex = start;
    const hit = m.exec(text);
    if (hit === null && !complete) return null;
    const end = hit === null ? text.length : hit.index;
    const line = text.slice(start, end);
    const t = line.trim();
    if (t !== "" && !t.startsWith("#")) {
      const unquoted = line.replace(/"[^"]*"/g, "");
      if (unquoted.includes("\t")) return "\t";
      if (unquoted.includes(";")) return ";";
      return ",";
    }
    if (hit === null) return null;
    start = end + hit[0].length;
  }
}

function isBlank(row: TableRow): boolean {
  const first = row.cells[0]?.trimStart() ?? "";
  if (first.startsWith("#")) return true;
  return row.cells.every((c) => c.trim() === "");
}
