/** What parsing a file yields: validated records, ready to store. */

export type PositionUnit = "um" | "px" | "fraction";
export type TableFormat = "long" | "wide";

export interface EmbryoRecord {
  label: string;
  genotype: string;
  stage: string | null;
  ageS: number | null;
  lengthUm: number | null;
  dosage: number | null;
  session: string | null;
  /** Columns of the side file (or long table) that have no role of their own. */
  metadata: Record<string, string>;
}

export interface ProfileRecord {
  embryo: string;
  channel: string;
  /** Time point of a time course in s, or null. */
  timeS: number | null;
  /** Unit the positions were given in. */
  positionUnit: PositionUnit;
  pixelSizeUm: number | null;
  /** Positions as written in the file (after a flip, mirrored the same way). */
  positionsRaw: Float64Array;
  /** Positions in µm from the source end. */
  positionsUm: Float64Array;
  /** Intensities in a.u. */
  intensities: Float64Array;
  /** Points dropped because the cell was empty, NaN or NA. */
  droppedPoints: number;
  /** True when the profile was reversed so that the source is at x = 0. */
  flipped: boolean;
}

export interface ImportWarning {
  /** Stable identifier, e.g. 'saturated', 'rising', 'negative', 'missing-cells'. */
  code: string;
  message: string;
  /** How to fix or silence it. */
  hint: string;
  /** Embryos concerned (de-duplicated), when the warning is about embryos. */
  embryos: string[];
}

export interface DroppedCell {
  row: number;
  column: string;
  value: string;
}

export interface ParsedImport {
  fileName: string;
  sha256: string;
  byteSize: number;
  format: TableFormat;
  delimiter: string;
  decimalMark: "." | ",";
  metaFileName: string | null;
  metaSha256: string | null;
  embryos: EmbryoRecord[];
  profiles: ProfileRecord[];
  warnings: ImportWarning[];
  droppedCells: DroppedCell[];
  /** Column roles as detected, for the preview: header → role and unit. */
  columns: { header: string; role: string; unit: string | null }[];
}
