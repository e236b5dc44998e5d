import type { ColumnHeader } from "./columnRoles.ts";
import type { IssueCollector } from "./importError.ts";
import { readNumericCell } from "./numericCell.ts";
import type { RawEmbryoAttributes } from "./rawTables.ts";
import { KNOWN_LENGTH_UNITS, KNOWN_TIME_UNITS, lengthUnit, timeUnitSeconds } from "./units.ts";
import type { WarningCollector } from "./warningCollector.ts";

/** Roles that describe the embryo rather than a single point of its profile. */
export const EMBRYO_ROLES = new Set(["genotype", "stage", "age", "length", "dosage", "session", "pixel-size"]);

/**
 * Reads per-embryo attribute cells row by row and insists that each embryo
 * has one value per attribute: a second, different value is an error naming both rows.
 */
export class EmbryoAttributeReader {
  private readonly varying = new Set<string>();
  private readonly firstRow = new Map<string, Map<string, { value: string; row: number }>>();
  readonly attributes = new Map<string, RawEmbryoAttributes>();
  private readonly ageFactor: number;
  private readonly lengthUnit: { unit: "um" | "px"; factor: number } | null;

  constructor(
    private readonly file: string,
    private readonly columns: ColumnHeader[],
    private readonly decimalMark: "." | ",",
    private readonly issues: IssueCollector,
    warnings: WarningCollector,
  ) {
    const age = columns.find((c) => c.role === "age");
    this.ageFactor = 1;
    if (age) {
      if (age.unitText === null) {
        warnings.add("assumed-unit", null, () => `column "${age.header}" names no unit; ages were read as seconds`, `write the unit in the header, e.g. "age [min]"`);
      } else {
        const f = timeUnitSeconds(age.unitText);
        if (f === null) issues.add({ file, column: age.header }, `unknown time unit "${age.unitText}"; use ${KNOWN_TIME_UNITS}`);
        else this.ageFactor = f;
      }
    }
    const len = columns.find((c) => c.role === "length");
    this.lengthUnit = { unit: "um", factor: 1 };
    if (len && len.unitText !== null) {
      const u = lengthUnit(len.unitText);
      if (u === null || u.unit === "fraction") {
        issues.add({ file, column: len.header }, `unknown length unit "${len.unitText}"; embryo lengths can be in µm, mm or px`);
        this.lengthUnit = null;
      } else this.lengthUnit = { unit: u.unit === "px" ? "px" : "um", factor: u.factor };
    }
  }

  /**
   * Columns without a role that change within an embryo describe points, not
   * embryos: they are left out of the metadata, with a warning.
   */
  finish(warnings: WarningCollector): Map<string, RawEmbryoAttributes> {
    for (const header of this.varying) {
      for (const attrs of this.attributes.values()) delete attrs.metadata[header];
      warnings.add(
        `unused-column:${header}`,
        null,
        () => `column "${header}" was not imported: it is not a known column and its value changes along a profile`,
        "rename it if it holds positions or intensities (e.g. \"position [µm]\", \"intensity\")",
      );
    }
    return this.attributes;
  }

  read(embryo: string, row: number, cells: string[]): void {
    let attrs = this.attributes.get(embryo);
    if (!attrs) {
      attrs = { metadata: {} };
      this.attributes.set(embryo, attrs);
    }
    for (const col of this.columns) {
      const raw = cells[col.index]?.trim() ?? "";
      if (raw === "" || !(EMBRYO_ROLES.has(col.role) || col.role === "other")) continue;
      if (!this.consistent(embryo, col, raw, row)) continue;
      this.assign(attrs, col, raw, row);
    }
  }

  private consistent(embryo: string, col: ColumnHeader, raw: string, row: number): boolean {
    let seen = this.firstRow.get(embryo);
    if (!seen) {
      seen = new Map();
      this.firstRow.set(embryo, seen);
    }
    const prior = seen.get(col.header);
    if (!prior) {
      seen.set(col.header, { value: raw, row });
      return true;
    }
    if (prior.value === raw) return false;
    if (col.role === "other") {
      this.varying.add(col.header);
      return false;
    }
    const what = col.role === "genotype" ? "genotype" : `"${col.header}"`;
    this.issues.add(
      { file: this.file, row, column: col.header, value: raw },
      `embryo "${embryo}" has ${what} "${raw}" here but "${prior.value}" in row ${prior.row}; one embryo has one ${col.role === "genotype" ? "genotype" : "value"}`,
    );
    return false;
  }

  private number(col: ColumnHeader, raw: string, row: number): number | null {
    const v = readNumericCell(raw, this.decimalMark);
    if (v.kind === "number") return v.value;
    if (v.kind === "invalid") this.issues.add({ file: this.file, row, column: col.header, value: raw }, `"${raw}" is not a number`);
    return null;
  }

  private assign(attrs: RawEmbryoAttributes, col: ColumnHeader, raw: string, row: number): void {
    switch (col.role) {
      case "genotype": attrs.genotype = raw; break;
      case "stage": attrs.stage = raw; break;
      case "session": attrs.session = raw; break;
      case "age": {
        const v = this.number(col, raw, row);
        if (v !== null) attrs.ageS = v * this.ageFactor;
        break;
      }
      case "length": {
        const v = this.number(col, raw, row);
        if (v !== null && this.lengthUnit) {
          if (!(v > 0)) this.issues.add({ file: this.file, row, column: col.header, value: raw }, "an embryo length must be greater than 0");
          else attrs.length = { value: v * this.lengthUnit.factor, unit: this.lengthUnit.unit };
        }
        break;
      }
      case "dosage": {
        const v = this.number(col, raw.replace(/[x×]$/i, ""), row);
        if (v !== null) {
          if (!(v > 0)) this.issues.add({ file: this.file, row, column: col.header, value: raw }, "a dosage must be greater than 0 (e.g. 0.5, 1, 2)");
          else attrs.dosage = v;
        }
        break;
      }
      case "pixel-size": {
        const v = this.number(col, raw, row);
        if (v !== null) {
          if (!(v > 0)) this.issues.add({ file: this.file, row, column: col.header, value: raw }, "a pixel size must be greater than 0 (in µm)");
          else attrs.pixelSizeUm = v;
        }
        break;
      }
      default:
        attrs.metadata[col.header] = raw;
    }
  }
}
