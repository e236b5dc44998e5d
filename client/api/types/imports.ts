import type { ApiIssue } from "../apiError.ts";

/** A warning of the importer: counted, with a hint on how to fix or silence it. */
export interface ImportWarning {
  code: string;
  message: string;
  hint: string;
  embryos: string[];
}

export interface PreviewColumn {
  header: string;
  role: string;
  unit: string | null;
}

export interface PreviewEmbryo {
  label: string;
  genotype: string | null;
  lengthUm: number | null;
  profiles: { channel: string; timeS: number | null; points: number; positionUnit: string; flipped: boolean }[];
}

export type PreviewFile =
  | {
      file: string;
      status: "ok";
      format: string;
      delimiter: string;
      decimalMark: string;
      columns: PreviewColumn[];
      embryos: PreviewEmbryo[];
      warnings: ImportWarning[];
      droppedCells: { row: number; column: string; value: string }[];
    }
  | { file: string; status: "rejected"; error: { code: string; message: string; issues: ApiIssue[] } };

/** POST /api/imports/preview */
export interface PreviewAnswer {
  files: PreviewFile[];
}

export type ImportReport =
  | {
      file: string;
      status: "imported" | "already-imported";
      importId: number;
      format: string;
      embryosAdded: number;
      embryosMatched: number;
      profilesAdded: number;
      embryos: string[];
      warnings: ImportWarning[];
      message: string;
    }
  | { file: string; status: "rejected"; error: { code: string; message: string; issues: ApiIssue[] } };

/** POST /api/imports */
export interface ImportAnswer {
  files: ImportReport[];
}

/** One entry of GET /api/imports */
export interface StoredImport {
  id: number;
  fileName: string;
  byteSize: number;
  format: string;
  metaFileName: string | null;
  importedAt: string;
  embryos: number;
  profiles: number;
  warnings: ImportWarning[];
}
