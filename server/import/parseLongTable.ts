import type { ColumnHeader } from "./columnRoles.ts";
import type { TableStream } from "./delimitedTable.ts";
import { EmbryoAttributeReader } from "./embryoAttributes.ts";
import type { IssueCollector } from "./importError.ts";
import { cellNumber, readNumericCell } from "./numericCell.ts";
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
 * intensity, and optionally channel, time and per-embryo attributes. Reads
 * the rows as they stream by; what it keeps is the numbers of each profile.
 */
export function parseLongTable(
  table: TableStream,
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

  // Rows of one profile usually follow each other: reuse the last profile while its key holds.
  let last: RawProfile | null = null;
  table.forEachRow((row) => {
    const cells = row.cells;
    const label = cells[embryoCol.index].trim();
    if (label === "") {
      issues.add({ file, row: row.line, column: embryoCol.header }, "the embryo label is empty");
      return;
    }
    const embryo = ctx.labelPrefix + label;
    attributes.read(embryo, row.line, cells);
    const channel = channelCol ? cells[channelCol.index].trim() || null : null;
    let timeS: number | null = null;
    if (timeCol) {
      const t = readNumericCell(cells[timeCol.index], decimalMark);
      if (t.kind === "invalid") issues.add({ file, row: row.line, column: timeCol.header, value: cells[timeCol.index] }, `"${cells[timeCol.index]}" is not a number`);
      else if (t.kind === "number") timeS = t.value * timeFactor;
    }
    let profile = last;
    if (profile === null || profile.embryo !== embryo || profile.channel !== channel || profile.timeS !== timeS) {
      const key = JSON.stringify([embryo, channel, timeS]);
      profile = profiles.get(key) ?? null;
      if (!profile) {
        profile = { embryo, channel, timeS, positions: [], intensities: [], rows: [], dropped: 0 };
        profiles.set(key, profile);
      }
      last = profile;
    }
    const x = cellNumber(cells[posCol.index], decimalMark);
    const y = cellNumber(cells[intCol.index], decimalMark);
    if (x === "invalid") issues.add({ file, row: row.line, column: posCol.header, value: cells[posCol.index] }, `"${cells[posCol.index]}" is not a number`);
    if (y === "invalid") issues.add({ file, row: row.line, column: intCol.header, value: cells[intCol.index] }, `"${cells[intCol.index]}" is not a number`);
    if (x === "missing" || y === "missing") {
      profile.dropped++;
      const which = x === "missing" ? posCol : intCol;
      ctx.dropped.push({ row: row.line, column: which.header, value: cells[which.index] });
      return;
    }
    if (typeof x === "number" && typeof y === "number") {
      profile.positions.push(x);
      profile.intensities.push(y);
      profile.rows.push(row.line);
    }
  });
  return { profiles: [...profiles.values()], attributes: attributes.finish(ctx.warnings) };
}
