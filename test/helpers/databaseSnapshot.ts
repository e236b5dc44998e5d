import { createHash } from "node:crypto";
import type { Db } from "../../db/connection.ts";

/** Row counts and a SHA-256 of every row of every table: equal snapshots mean nothing was written. */
export function databaseSnapshot(db: Db): { counts: Record<string, number>; checksum: string } {
  const tables = (db.prepare("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name").all() as { name: string }[]).map((t) => t.name);
  const hash = createHash("sha256");
  const counts: Record<string, number> = {};
  for (const t of tables) {
    const rows = db.prepare(`SELECT * FROM "${t}" ORDER BY rowid`).raw().all() as unknown[][];
    counts[t] = rows.length;
    for (const r of rows) hash.update(JSON.stringify(r, (_k, v) => (Buffer.isBuffer(v) ? v.toString("base64") : v)));
  }
  return { counts, checksum: hash.digest("hex") };
}
