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

/** A stored embryo's value against the file's. */
export interface FieldDifference {
  field: string;
  name: string;
  stored: string | number | null;
  file: string | number | null;
}

/** What a file would do to an embryo already stored under the same label. */
export interface StoredEmbryoPlan {
  label: string;
  storedFrom: string;
  additions: FieldDifference[];
  conflicts: FieldDifference[];
  newProfiles: string[];
  unchangedProfiles: string[];
  clashingProfiles: { profile: string; storedFrom: string }[];
}

/** The comparison of a file with the open data set. */
export interface DatabaseComparison {
  sameImport: { importId: number; fileName: string; differences: string[] } | null;
  earlierImports: { importId: number; fileName: string; differences: string[] }[];
  newEmbryos: string[];
  stored: StoredEmbryoPlan[];
  newProfiles: number;
  unchangedProfiles: number;
  conflicts: number;
  additions: number;
}

export type PreviewFile =
  | {
      file: string;
      /** ok: ready to import; conflicts: a choice is needed; already-imported: importing would store nothing. */
      status: "ok" | "conflicts" | "already-imported";
      database: DatabaseComparison;
      outcome: { message: string; issues: ApiIssue[] };
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
  /** How a side file given among the profile files was recognised. */
  notes?: string[];
}

export type ImportReport =
  | {
      file: string;
      status: "imported" | "already-imported";
      importId: number | null;
      format: string;
      embryosAdded: number;
      embryosMatched: number;
      profilesAdded: number;
      valuesChanged: number;
      embryos: string[];
      warnings: ImportWarning[];
      message: string;
    }
  | { file: string; status: "rejected"; error: { code: string; message: string; issues: ApiIssue[] } };

/** POST /api/imports */
export interface ImportAnswer {
  files: ImportReport[];
  notes?: string[];
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
  /** Values of embryos stored before this import that it filled in or replaced. */
  valuesChanged: number;
  warnings: ImportWarning[];
}
