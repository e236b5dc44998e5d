import type { ColumnHeader } from "./columnRoles.ts";
import type { DelimitedTable } from "./delimitedTable.ts";
import type { IssueCollector } from "./importError.ts";
import { readNumericCell } from "./numericCell.ts";
import type { RawEmbryoAttributes, RawProfile } from "./rawTables.ts";
import type { DroppedCell } from "./records.ts";

/**
 * A wide table: the first column holds positions, every other column is one
 * embryo's intensities, headed by its label.
 */
export function parseWideTable(
  table: DelimitedTable,
  columns: ColumnHeader[],
  ctx: { file: string; decimalMark: "." | ","; labelPrefix: string; issues: IssueCollector; dropped: DroppedCell[] },
): { profiles: RawProfile[]; attributes: Map<string, RawEmbryoAttributes> } {
  const { file, decimalMark, issues } = ctx;
  const posCol = columns[0];
  const embryoCols = columns.slice(1);
  const profiles = embryoCols.map<RawProfile>((c) => ({
    embryo: ctx.labelPrefix + c.header,
    channel: null,
    timeS: null,
    positions: [],
    intensities: [],
    rows: [],
    dropped: 0,
  }));
  // Empty cells after a column's last value are where a shorter profile ends, not gaps.
  const pending: DroppedCell[][] = profiles.map(() => []);
  for (const row of table.rows) {
    const x = readNumericCell(row.cells[posCol.index], decimalMark);
    if (x.kind === "invalid") {
      issues.add({ file, row: row.line, column: posCol.header, value: row.cells[posCol.index] }, `"${row.cells[posCol.index]}" is not a number`);
      continue;
    }
    if (x.kind === "missing") {
      ctx.dropped.push({ row: row.line, column: posCol.header, value: row.cells[posCol.index] });
      for (const p of profiles) p.dropped++;
      continue;
    }
    embryoCols.forEach((c, k) => {
      const raw = row.cells[c.index];
      const y = readNumericCell(raw, decimalMark);
      if (y.kind === "invalid") issues.add({ file, row: row.line, column: c.header, value: raw }, `"${raw}" is not a number`);
      else if (y.kind === "missing") pending[k].push({ row: row.line, column: c.header, value: raw });
      else {
        profiles[k].dropped += pending[k].length;
        ctx.dropped.push(...pending[k]);
        pending[k] = [];
        profiles[k].positions.push(x.value);
        profiles[k].intensities.push(y.value);
        profiles[k].rows.push(row.line);
      }
    });
  }
  return { profiles, attributes: new Map(profiles.map((p) => [p.embryo, { metadata: {} }])) };
}
