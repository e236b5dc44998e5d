import { IssueCollector } from "./importError.ts";

export type Delimiter = "," | ";" | "\t";

export interface TableRow {
  /** 1-based line number in the file where the row starts. */
  line: number;
  cells: string[];
}

export interface DelimitedTable {
  delimiter: Delimiter;
  header: TableRow;
  rows: TableRow[];
}

/**
 * Split text into rows of cells. Handles quoted cells ("a,b", doubled quotes,
 * line breaks inside quotes), CRLF/CR/LF line ends, `#` comment lines, blank
 * lines and lines made only of separators, and trailing empty columns. The
 * first remaining row is the header.
 */
export function readDelimitedTable(text: string, fileName: string, delimiterOption: "auto" | Delimiter): DelimitedTable {
  const issues = new IssueCollector();
  const rawRows = tokenize(text, delimiterOption === "auto" ? detectDelimiter(text) : delimiterOption);
  const delimiter = rawRows.delimiter;
  const rows = rawRows.rows.filter((r) => !isSkippable(r));
  if (rows.length === 0) {
    issues.add({ file: fileName }, "the file has no header and no data (only blank or # comment lines)");
    issues.throwIfAny();
  }
  const header = rows[0];
  header.cells = header.cells.map((c) => c.trim());
  let width = header.cells.length;
  while (width > 0 && header.cells[width - 1] === "") width--;
  if (width < 2) {
    const sep = delimiter === "\t" ? "tab" : `"${delimiter}"`;
    issues.add(
      { file: fileName, row: header.line },
      `the header has ${width} column${width === 1 ? "" : "s"} when split at ${sep}; expected at least a position and an intensity column (separators accepted: comma, semicolon, tab)`,
    );
    issues.throwIfAny();
  }
  header.cells.length = width;
  header.cells.forEach((name, i) => {
    if (name === "") issues.add({ file: fileName, row: header.line }, `column ${i + 1} has no name in the header`);
  });
  const seen = new Map<string, number>();
  header.cells.forEach((name, i) => {
    const key = name.toLowerCase();
    if (name !== "" && seen.has(key)) {
      issues.add({ file: fileName, row: header.line, column: name }, `the column name appears twice (columns ${seen.get(key)! + 1} and ${i + 1})`);
    }
    seen.set(key, i);
  });
  const data = rows.slice(1);
  for (const r of data) {
    for (let i = width; i < r.cells.length; i++) {
      if (r.cells[i].trim() !== "") {
        issues.add({ file: fileName, row: r.line, value: r.cells[i] }, `has a value in column ${i + 1}, which has no header`);
        break;
      }
    }
    r.cells.length = Math.min(r.cells.length, width);
    while (r.cells.length < width) r.cells.push("");
  }
  issues.throwIfAny();
  return { delimiter, header, rows: data };
}

/** Tab if the header line has a tab, else semicolon if it has one, else comma. */
export function detectDelimiter(text: string): Delimiter {
  for (const line of text.split(/\r\n|\n|\r/)) {
    const t = line.trim();
    if (t === "" || t.startsWith("#")) continue;
    const unquoted = line.replace(/"[^"]*"/g, "");
    if (unquoted.includes("\t")) return "\t";
    if (unquoted.includes(";")) return ";";
    return ",";
  }
  return ",";
}

function isSkippable(row: TableRow): boolean {
  const first = row.cells[0]?.trimStart() ?? "";
  if (first.startsWith("#")) return true;
  return row.cells.every((c) => c.trim() === "");
}

function tokenize(text: string, delimiter: Delimiter): { delimiter: Delimiter; rows: TableRow[] } {
  const rows: TableRow[] = [];
  let cells: string[] = [];
  let cell = "";
  let inQuotes = false;
  let line = 1;
  let rowStart = 1;
  let cellWasQuoted = false;
  const endCell = () => {
    cells.push(cellWasQuoted ? cell : cell.trim());
    cell = "";
    cellWasQuoted = false;
  };
  const endRow = () => {
    endCell();
    rows.push({ line: rowStart, cells });
    cells = [];
  };
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (inQuotes) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          cell += '"';
          i++;
        } else inQuotes = false;
      } else {
        if (ch === "\n" || (ch === "\r" && text[i + 1] !== "\n")) line++;
        cell += ch;
      }
      continue;
    }
    if (ch === '"' && cell.trim() === "") {
      inQuotes = true;
      cellWasQuoted = true;
      cell = "";
    } else if (ch === delimiter) {
      endCell();
    } else if (ch === "\r" || ch === "\n") {
      if (ch === "\r" && text[i + 1] === "\n") i++;
      endRow();
      line++;
      rowStart = line;
    } else {
      cell += ch;
    }
  }
  if (cell !== "" || cells.length > 0 || cellWasQuoted) endRow();
  return { delimiter, rows };
}
