import type { ColumnHeader } from "./columnRoles.ts";
import type { DelimitedTable } from "./delimitedTable.ts";
import { EmbryoAttributeReader } from "./embryoAttributes.ts";
import type { IssueCollector } from "./importError.ts";
import { readNumericCell } from "./numericCell.ts";
import type { RawEmbryoAttributes, RawProfile } from "./rawTables.ts";
import type { DroppedCell } from "./records.ts";
import { KNOWN_TIME_UNITS, timeUnitSeconds } from "./units.ts";
import type { WarningCollector } from "./warningCollector.ts";

export interface LongTableResult {
  profiles: RawProfile[];
  attributes: Map<string, RawEmbryoAttributes>;
}

/**
 * A long (tidy) table: one row per point, with columns for embryo, position and
 * intensity, and optionally channel, time and per-embryo attributes.
 */
export function parseLongTable(
  table: DelimitedTable,
  columns: ColumnHeader[],
  ctx: { file: string; decimalMark: "." | ","; labelPrefix: string; issues: IssueCollector; warnings: WarningCollector; dropped: DroppedCell[] },
): LongTableResult {
  const { file, decimalMark, issues } = ctx;
  const col = (role: string) => columns.find((c) => c.role === role);
  const embryoCol = col("embryo")!;
  const posCol = col("position")!;
  const intCol = col("intensity")!;
  const channelCol = col("channel");
  const timeCol = col("time");
  let timeFactor = 1;
  if (timeCol) {
    if (timeCol.unitText === null) {
      ctx.warnings.add("assumed-unit", null, () => `column "${timeCol.header}" names no unit; times were read as seconds`, `write the unit in the header, e.g. "time [min]"`);
    } else {
      const f = timeUnitSeconds(timeCol.unitText);
      if (f === null) issues.add({ file, column: timeCol.header }, `unknown time unit "${timeCol.unitText}"; use ${KNOWN_TIME_UNITS}`);
      else timeFactor = f;
    }
  }
  const attributeColumns = columns.filter(
    (c) => c !== embryoCol && c !== posCol && c !== intCol && c !== channelCol && c !== timeCol && c.role !== "embryo" && c.role !== "position" && c.role !== "intensity",
  );
  const attributes = new EmbryoAttributeReader(file, attributeColumns, decimalMark, issues, ctx.warnings);
  const profiles = new Map<string, RawProfile>();

  for (const row of table.rows) {
    const label = row.cells[embryoCol.index].trim();
    if (label === "") {
      issues.add({ file, row: row.line, column: embryoCol.header }, "the embryo label is empty");
      continue;
    }
    const embryo = ctx.labelPrefix + label;
    attributes.read(embryo, row.line, row.cells);
    const channel = channelCol ? row.cells[channelCol.index].trim() || null : null;
    let timeS: number | null = null;
    if (timeCol) {
      const t = readNumericCell(row.cells[timeCol.index], decimalMark);
      if (t.kind === "invalid") issues.add({ file, row: row.line, column: timeCol.header, value: row.cells[timeCol.index] }, `"${row.cells[timeCol.index]}" is not a number`);
      else if (t.kind === "number") timeS = t.value * timeFactor;
    }
    const key = JSON.stringify([embryo, channel, timeS]);
    let profile = profiles.get(key);
    if (!profile) {
      profile = { embryo, channel, timeS, positions: [], intensities: [], rows: [], dropped: 0 };
      profiles.set(key, profile);
    }
    const x = readNumericCell(row.cells[posCol.index], decimalMark);
    const y = readNumericCell(row.cells[intCol.index], decimalMark);
    if (x.kind === "invalid") issues.add({ file, row: row.line, column: posCol.header, value: row.cells[posCol.index] }, `"${row.cells[posCol.index]}" is not a number`);
    if (y.kind === "invalid") issues.add({ file, row: row.line, column: intCol.header, value: row.cells[intCol.index] }, `"${row.cells[intCol.index]}" is not a number`);
    if (x.kind === "missing" || y.kind === "missing") {
      profile.dropped++;
      const which = x.kind === "missing" ? posCol : intCol;
      ctx.dropped.push({ row: row.line, column: which.header, value: row.cells[which.index] });
      continue;
    }
    if (x.kind === "number" && y.kind === "number") {
      profile.positions.push(x.value);
      profile.intensities.push(y.value);
      profile.rows.push(row.line);
    }
  }
  return { profiles: [...profiles.values()], attributes: attributes.finish(ctx.warnings) };
}
