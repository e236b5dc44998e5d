import type { ParsedImport } from "../import/records.ts";
import { raiseHint, type ServerLimits } from "../serverLimits.ts";
import { UserError, type UserIssue } from "../userError.ts";

/** Longest stretch of a bad cell a message may quote. */
export const EXCERPT_CHARS = 40;
/** Most issues one refusal lists. */
export const MAX_ISSUES = 20;

/** At most EXCERPT_CHARS of a text, with how much was left out. */
export function excerpt(text: string, max = EXCERPT_CHARS): string {
  return text.length <= max ? text : `${text.slice(0, max)}… (${text.length - max} more characters)`;
}

/** Shorten every quoted part of a message ("…", paired from the left) to an excerpt, and the whole message to a readable length. */
export function shortenEchoes(message: string, maxChars = 600): string {
  const quoted = message.replace(/"([^"]*)"/g, (m, inner: string) => (inner.length > EXCERPT_CHARS ? `"${excerpt(inner)}"` : m));
  return quoted.length <= maxChars ? quoted : `${quoted.slice(0, maxChars)}… (message shortened)`;
}

/** A user error with short echoes and at most MAX_ISSUES issues (the count of the rest is said). */
export function boundedUserError(e: UserError): UserError {
  const issues: UserIssue[] = e.issues.slice(0, MAX_ISSUES).map((i) => ({ path: shortenEchoes(i.path, 200), message: shortenEchoes(i.message, 300) }));
  if (e.issues.length > MAX_ISSUES) issues.push({ path: "(more)", message: `${e.issues.length - MAX_ISSUES} more problems of the same kinds were found; fix the ones listed and try again` });
  return new UserError(e.code, shortenEchoes(e.message), { status: e.status, issues });
}

/**
 * Cheap checks on the raw bytes before a file is parsed: the longest line,
 * the columns of the first line and the cells of the file. Refused files never
 * reach the parser, so a one-line 50 MB file or a million columns cost a scan,
 * not minutes.
 */
export function checkTableShape(name: string, bytes: Uint8Array, limits: Pick<ServerLimits, "maxColumns" | "maxCells" | "maxLineChars">): void {
  let lines = 0;
  let longest = 0;
  let longestLine = 0;
  let start = 0;
  let firstEnd = -1;
  for (let i = 0; i <= bytes.length; i++) {
    const b = i < bytes.length ? bytes[i] : 10;
    if (b !== 10 && b !== 13) continue;
    const len = i - start;
    if (len > 0) {
      lines++;
      if (firstEnd < 0) firstEnd = i;
      if (len > longest) {
        longest = len;
        longestLine = lines;
      }
    }
    start = i + 1;
  }
  if (longest > limits.maxLineChars) {
    throw new UserError(
      "line-too-long",
      `${name}: line ${longestLine} is ${longest.toLocaleString("en-US")} characters long; at most ${limits.maxLineChars.toLocaleString("en-US")} are accepted per line (a table export has one row per line; ${raiseHint("maxLineChars")}). Nothing was imported.`,
      { status: 413 },
    );
  }
  const first = bytes.subarray(0, Math.max(firstEnd, 0));
  let best = 0;
  for (const sep of [44, 59, 9]) {
    let n = 0;
    for (const b of first) if (b === sep) n++;
    best = Math.max(best, n);
  }
  const columns = best + 1;
  if (columns > limits.maxColumns) {
    throw new UserError(
      "too-many-columns",
      `${name}: the first line has ${columns.toLocaleString("en-US")} columns; at most ${limits.maxColumns.toLocaleString("en-US")} are accepted (${raiseHint("maxColumns")}). Nothing was imported.`,
      { status: 413 },
    );
  }
  if (columns * lines > limits.maxCells) {
    throw new UserError(
      "too-many-cells",
      `${name}: ${lines.toLocaleString("en-US")} lines × ${columns.toLocaleString("en-US")} columns is more than the ${limits.maxCells.toLocaleString("en-US")} cells accepted per file; split the file (${raiseHint("maxCells")}). Nothing was imported.`,
      { status: 413 },
    );
  }
}

/**
 * Checks on a parsed file that the parser leaves open: only one position
 * column, and positions and intensities that stay finite after conversion to
 * µm (a huge value times a huge pixel size overflows to Infinity).
 */
export function checkParsedImport(parsed: ParsedImport): void {
  const positions = parsed.columns.filter((c) => c.role === "position");
  if (positions.length > 1) {
    throw new UserError(
      "two-position-columns",
      `${parsed.fileName}: ${positions.length} columns are recognised as positions (${positions.map((c) => `"${excerpt(c.header)}"`).join(", ")}); keep one and rename or remove the others. Nothing was imported.`,
      { status: 422 },
    );
  }
  for (const p of parsed.profiles) {
    const badX = p.positionsUm.findIndex((v) => !Number.isFinite(v));
    if (badX >= 0) {
      throw new UserError(
        "position-overflow",
        `${parsed.fileName}: embryo "${excerpt(p.embryo)}": position ${p.positionsRaw[badX]} ${p.positionUnit === "px" ? `px × pixel size ${p.pixelSizeUm} µm` : `(${p.positionUnit})`} is too large to convert to µm (it would be infinite). Check the position unit and the pixel size. Nothing was imported.`,
        { status: 422 },
      );
    }
    const badY = p.intensities.findIndex((v) => !Number.isFinite(v));
    if (badY >= 0) {
      throw new UserError("intensity-overflow", `${parsed.fileName}: embryo "${excerpt(p.embryo)}": an intensity is not a finite number. Nothing was imported.`, { status: 422 });
    }
  }
}
