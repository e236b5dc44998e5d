/** One database the server can open (GET /api/datasets). */
export interface DataSetView {
  /** "demo" for the invented demo; otherwise the file name. */
  id: string;
  path: string;
  kind: "demo" | "user";
  current: boolean;
  exists: boolean;
}

export interface DataSetsAnswer {
  current: DataSetView;
  available: DataSetView[];
  /** False when the server was started on one database only. */
  switchable: boolean;
}
