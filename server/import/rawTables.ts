/** Intermediate shapes between the table reader and the validated records. */

export interface RawProfile {
  embryo: string;
  /** Channel from a column, or null to use the import's channel option. */
  channel: string | null;
  timeS: number | null;
  positions: number[];
  intensities: number[];
  /** File line of each kept point, for error messages. */
  rows: number[];
  dropped: number;
}

/** Per-embryo attributes read from the data file or the side file. Lengths are in the header's unit. */
export interface RawEmbryoAttributes {
  genotype?: string;
  stage?: string;
  ageS?: number;
  /** Length in µm; a length given in pixels is converted once the pixel size is known. */
  length?: { value: number; unit: "um" | "px" };
  dosage?: number;
  session?: string;
  pixelSizeUm?: number;
  metadata: Record<string, string>;
}
