/** Cell texts that mean "no value here": reported and dropped, never read as 0. */
const MISSING = new Set(["", "nan", "na", "n/a", "null", "none", "-", "--", "#n/a", "#value!", "#div/0!", "inf?"]);

export type CellValue = { kind: "number"; value: number } | { kind: "missing" } | { kind: "invalid" };

// One way to match each number (no nested choices), so a long run of digits cannot make the match take quadratic time.
const PLAIN_NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Read one cell as a number. With decimal mark ',' the cell "12,5" is 12.5;
 * a cell holding both marks ("1.234,5") is rejected rather than guessed.
 */
export function readNumericCell(raw: string, decimalMark: "." | ","): CellValue {
  const text = raw.trim();
  if (MISSING.has(text.toLowerCase())) return { kind: "missing" };
  let normalised = text;
  if (decimalMark === ",") {
    if (text.includes(".") && text.includes(",")) return { kind: "invalid" };
    normalised = text.replace(",", ".");
  }
  if (!PLAIN_NUMBER.test(normalised)) return { kind: "invalid" };
  const value = Number(normalised);
  return Number.isFinite(value) ? { kind: "number", value } : { kind: "invalid" };
}

/**
 * readNumericCell without allocating, for the per-point loop of large files:
 * the number, or "missing" or "invalid" (same rules).
 */
export function cellNumber(raw: string, decimalMark: "." | ","): number | "missing" | "invalid" {
  const text = raw.trim();
  const c = text.charCodeAt(0);
  // No "missing" spelling starts with a digit, "+" or "."; other cells go through the full check.
  const digitLike = (c >= 48 && c <= 57) || c === 43 || c === 46;
  if (!digitLike && MISSING.has(text.toLowerCase())) return "missing";
  let normalised = text;
  if (decimalMark === ",") {
    if (text.includes(".") && text.includes(",")) return "invalid";
    normalised = text.replace(",", ".");
  }
  if (!PLAIN_NUMBER.test(normalised)) return "invalid";
  const value = Number(normalised);
  return Number.isFinite(value) ? value : "invalid";
}

/** True when some cell looks like a decimal-comma number ("12,5"), which picks ',' as the decimal mark. */
export function looksLikeDecimalComma(cells: Iterable<string>): boolean {
  for (const c of cells) if (/^[+-]?\d+,\d+([eE][+-]?\d+)?$/.test(c.trim())) return true;
  return false;
}
