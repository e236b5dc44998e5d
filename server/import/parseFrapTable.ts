import type { RawRecovery } from "../analysis/dynamics/frap/normaliseRecovery.ts";
import { splitHeaderUnit } from "./columnRoles.ts";
import { readDelimitedTable } from "./delimitedTable.ts";
import { IssueCollector } from "./importError.ts";
import { looksLikeDecimalComma, readNumericCell } from "./numericCell.ts";

type FrapRole = "time" | "bleached" | "reference" | "background" | "normalised" | "prebleach";

const NAMES: [FrapRole, string[]][] = [
  ["time", ["time", "t", "timepoint", "time point"]],
  ["bleached", ["bleached", "bleach", "frap", "roi", "bleached region", "bleach region", "frap region", "intensity"]],
  ["reference", ["reference", "ref", "reference region", "whole", "whole cell", "total"]],
  ["background", ["background", "bg", "bkg", "background region"]],
  ["normalised", ["normalised", "normalized", "recovery", "normalised intensity", "normalized intensity", "relative intensity"]],
  ["prebleach", ["prebleach", "pre bleach", "pre", "phase", "is prebleach"]],
];
const LOOKUP = new Map<string, FrapRole>();
for (const [role, names] of NAMES) for (const n of names) LOOKUP.set(n, role);

const TIME_FACTORS: Record<string, number> = { s: 1, sec: 1, second: 1, seconds: 1, ms: 1e-3, min: 60, minutes: 60, h: 3600, hr: 3600 };
const PRE_TRUE = new Set(["1", "yes", "true", "pre", "prebleach", "pre-bleach", "y"]);
const PRE_FALSE = new Set(["0", "no", "false", "post", "postbleach", "post-bleach", "n", ""]);

/**
 * Read a FRAP recovery table: a time column (s unless the header says ms, min
 * or h) and either a bleached-region column (with optional reference and
 * background columns) or an already normalised column; optionally a column
 * flagging pre-bleach frames (otherwise they are the frames at t < 0).
 */
export function parseFrapTable(text: string, fileName: string): { raw: RawRecovery; columns: Record<string, string>; timeUnit: string } {
  const issues = new IssueCollector();
  const table = readDelimitedTable(text, fileName, "auto");
  const roles = new Map<FrapRole, { index: number; header: string; unit: string | null }>();
  table.header.cells.forEach((header, index) => {
    const { name, unitText } = splitHeaderUnit(header);
    const role = LOOKUP.get(name);
    if (role && !roles.has(role)) roles.set(role, { index, header, unit: unitText });
  });
  const time = roles.get("time");
  if (!time) issues.add({ file: fileName, row: table.header.line }, `no time column found among ${table.header.cells.map((c) => `"${c}"`).join(", ")}; name one "time (s)"`);
  if (!roles.has("bleached") && !roles.has("normalised"))
    issues.add({ file: fileName, row: table.header.line }, 'no intensity column: name the bleached-region column "bleached" (or give an already normalised curve as "normalised")');
  issues.throwIfAny();
  const unit = (time!.unit ?? "s").toLowerCase();
  const factor = TIME_FACTORS[unit];
  if (factor === undefined) issues.add({ file: fileName, column: time!.header }, `time unit "${time!.unit}" is not one of s, ms, min, h`);
  issues.throwIfAny();
  const decimal = looksLikeDecimalComma(table.rows.flatMap((r) => r.cells)) && table.delimiter !== "," ? "," : ".";
  const numbers = (role: FrapRole): number[] | null => {
    const col = roles.get(role);
    if (!col) return null;
    return table.rows.map((row) => {
      const cell = readNumericCell(row.cells[col.index] ?? "", decimal);
      if (cell.kind !== "number") {
        issues.add({ file: fileName, row: row.line, column: col.header, value: row.cells[col.index] }, `"${row.cells[col.index] ?? ""}" is not a number`);
        return NaN;
      }
      return cell.value;
    });
  };
  const timesS = numbers("time")!.map((t) => t * (factor ?? 1));
  const raw: RawRecovery = {
    timesS,
    bleached: numbers("bleached"),
    reference: numbers("reference"),
    background: numbers("background"),
    normalised: roles.has("normalised") ? numbers("normalised") : null,
    preBleach: null,
  };
  const flag = roles.get("prebleach");
  if (flag) {
    raw.preBleach = table.rows.map((row) => {
      const v = (row.cells[flag.index] ?? "").trim().toLowerCase();
      if (PRE_TRUE.has(v)) return true;
      if (!PRE_FALSE.has(v)) issues.add({ file: fileName, row: row.line, column: flag.header, value: v }, `"${v}" is neither pre nor post; write 1/0, yes/no or pre/post`);
      return false;
    });
  }
  for (let i = 1; i < timesS.length; i++)
    if (!(timesS[i] > timesS[i - 1])) {
      issues.add({ file: fileName, row: table.rows[i].line, column: time!.header }, `times must increase from frame to frame (${timesS[i - 1] / (factor ?? 1)} then ${timesS[i] / (factor ?? 1)})`);
      break;
    }
  const isPre = raw.preBleach ?? timesS.map((t) => t < 0);
  const nPre = isPre.filter(Boolean).length;
  if (raw.normalised === null && nPre === 0)
    issues.add({ file: fileName }, "no pre-bleach frames: give them negative times (the bleach at t = 0) or flag them in a \"prebleach\" column, or give an already normalised curve");
  if (raw.preBleach === null && timesS.some((t) => t === 0)) issues.add({ file: fileName, column: time!.header }, "a frame at t = 0 is ambiguous: put the bleach at t = 0 with pre-bleach frames before it and recovery frames after it");
  issues.throwIfAny();
  const columns: Record<string, string> = {};
  for (const [role, c] of roles) columns[role] = c.header;
  return { raw, columns, timeUnit: unit };
}
