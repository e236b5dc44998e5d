import { ImportError } from "./importError.ts";

export type Delimiter = "," | ";" | "\t";

export interface TableRow {
  /** 1-based line number in the file where the row starts. */
  line: number;
  cells: string[];
}

const HASH = 35;
const QUOTE = '"';

/**
 * Split text, given in pieces, into rows of cells, one row at a time. Handles
 * quoted cells ("a,b", doubled quotes, line breaks inside quotes), CRLF/CR/LF
 * line ends; skips lines whose first non-blank character is `#` (comments,
 * whatever they contain). Unquoted cells are trimmed. A quote that is never
 * closed is an error naming the row where it opened: read on, it would turn
 * the rest of the file into one cell.
 *
 * Lines without quotes and without a lone CR take a fast path (one native
 * split); the rest go through a character loop. Memory: the current piece and
 * the current row.
 */
export function* tokenizeRows(pieces: Iterable<string>, delimiter: Delimiter, fileName: string): Generator<TableRow> {
  const source = pieces[Symbol.iterator]();
  let buf = "";
  let pos = 0;
  let eof = false;
  let line = 1;
  // Next quote / CR at or after pos (-1: none left in buf); recomputed only once pos passes them,
  // so lines without either cost no extra scan.
  let nextQuote = -1;
  let nextCr = -1;
  const rescan = () => {
    nextQuote = buf.indexOf(QUOTE, pos);
    nextCr = buf.indexOf("\r", pos);
  };
  const more = (): boolean => {
    if (eof) return false;
    const next = source.next();
    if (next.done) {
      eof = true;
      return false;
    }
    buf = pos < buf.length ? buf.slice(pos) + next.value : next.value;
    pos = 0;
    rescan();
    return true;
  };
  more();

  for (;;) {
    if (pos >= buf.length && !more()) return;
    const nl = buf.indexOf("\n", pos);
    if (nl < 0 && !eof) {
      more();
      continue;
    }
    const end = nl < 0 ? buf.length : nl;
    if (nextQuote >= 0 && nextQuote < pos) nextQuote = buf.indexOf(QUOTE, pos);
    if (nextCr >= 0 && nextCr < pos) nextCr = buf.indexOf("\r", pos);
    const loneCr = nextCr >= 0 && nextCr < end - 1;
    const lineEnd = loneCr ? nextCr : nextCr === end - 1 && nextCr >= 0 ? end - 1 : end;

    if (isCommentStart(buf, pos, lineEnd)) {
      pos = loneCr ? nextCr + 1 : nl < 0 ? buf.length : nl + 1;
      line++;
      continue;
    }
    if (!loneCr && !(nextQuote >= 0 && nextQuote < end)) {
      const text = buf.slice(pos, lineEnd);
      pos = nl < 0 ? buf.length : nl + 1;
      const rowLine = line++;
      if (nl < 0 && text === "") continue;
      const cells = text.split(delimiter);
      for (let i = 0; i < cells.length; i++) cells[i] = cells[i].trim();
      yield { line: rowLine, cells };
      continue;
    }
    const row = quotedRow(buf, pos, delimiter, eof);
    if (row === null) {
      more();
      continue;
    }
    if (row.unclosed) {
      throw new ImportError([
        {
          location: { file: fileName, row: line },
          message: `a quote (") opens a cell here that is never closed, so the rest of the file would be read as one cell; remove the stray quote or close it`,
        },
      ]);
    }
    pos = row.next;
    const rowLine = line;
    line += 1 + row.innerLines;
    if (row.empty) continue;
    yield { line: rowLine, cells: row.cells };
  }
}

function isCommentStart(buf: string, pos: number, lineEnd: number): boolean {
  const first = buf.charCodeAt(pos);
  if (first === HASH) return true;
  if (first !== 32 && first !== 9) return false;
  return buf.slice(pos, lineEnd).trimStart().charCodeAt(0) === HASH;
}

interface QuotedRow {
  cells: string[];
  /** Index just after the row's line end. */
  next: number;
  /** Line breaks inside quoted cells. */
  innerLines: number;
  unclosed: boolean;
  /** Nothing but an end of file (no row). */
  empty: boolean;
}

/**
 * One row that holds a quote or a lone CR, character by character. Returns
 * null when the row runs past the text read so far and more may follow.
 */
function quotedRow(buf: string, start: number, delimiter: Delimiter, eof: boolean): QuotedRow | null {
  const cells: string[] = [];
  let cell = "";
  let inQuotes = false;
  let cellWasQuoted = false;
  let innerLines = 0;
  const endCell = () => {
    cells.push(cellWasQuoted ? cell : cell.trim());
    cell = "";
    cellWasQuoted = false;
  };
  for (let i = start; i < buf.length; i++) {
    const ch = buf[i];
    // A quote or CR at the end of what was read needs the next character to be read.
    if ((ch === QUOTE || ch === "\r") && i + 1 === buf.length && !eof) return null;
    if (inQuotes) {
      if (ch === QUOTE) {
        if (buf[i + 1] === QUOTE) {
          cell += QUOTE;
          i++;
        } else inQuotes = false;
      } else {
        if (ch === "\n" || (ch === "\r" && buf[i + 1] !== "\n")) innerLines++;
        cell += ch;
      }
      continue;
    }
    if (ch === QUOTE && cell.trim() === "") {
      inQuotes = true;
      cellWasQuoted = true;
      cell = "";
    } else if (ch === delimiter) {
      endCell();
    } else if (ch === "\r" || ch === "\n") {
      if (ch === "\r" && buf[i + 1] === "\n") i++;
      endCell();
      return { cells, next: i + 1, innerLines, unclosed: false, empty: false };
    } else {
      cell += ch;
    }
  }
  if (!eof) return null;
  if (inQuotes) return { cells, next: buf.length, innerLines, unclosed: true, empty: false };
  const empty = cell === "" && cells.length === 0 && !cellWasQuoted;
  if (!empty) endCell();
  return { cells, next: buf.length, innerLines, unclosed: false, empty };
}
