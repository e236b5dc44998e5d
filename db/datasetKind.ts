import type { Db } from "./connection.ts";

/** What a database file holds: the invented demo data, or the lab's own. */
export type DatasetKind = "demo" | "user";

/** The kind recorded in the file; a file with none (written before data sets existed) holds the lab's own data. */
export function getDatasetKind(db: Db): DatasetKind {
  const row = db.prepare("SELECT kind FROM dataset WHERE id = 1").get() as { kind: DatasetKind } | undefined;
  return row?.kind ?? "user";
}

export function setDatasetKind(db: Db, kind: DatasetKind): void {
  db.prepare("INSERT INTO dataset (id, kind) VALUES (1, ?) ON CONFLICT (id) DO UPDATE SET kind = excluded.kind").run(kind);
}

/** Number of imports stored, to tell an empty file from one holding data. */
export function countImports(db: Db): number {
  return (db.prepare("SELECT COUNT(*) AS n FROM imports").get() as { n: number }).n;
}
