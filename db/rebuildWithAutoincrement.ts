import type { Db } from "./connection.ts";

/** The `id INTEGER PRIMARY KEY` column definition of a CREATE TABLE statement, without AUTOINCREMENT yet. */
const ID_COLUMN = /(\bid\s+INTEGER\s+PRIMARY\s+KEY)(?!\s+AUTOINCREMENT)(?=\s*[,)]|\s+(?:NOT\s+NULL|CHECK|REFERENCES)\b)/i;

/**
 * Rebuild every table whose `id` is a plain INTEGER PRIMARY KEY so that it
 * becomes AUTOINCREMENT: SQLite then never hands a deleted row's id to a new
 * row. Follows SQLite's documented procedure for schema changes ALTER TABLE
 * cannot make (sqlite.org/lang_altertable.html, "Making Other Kinds Of Table
 * Schema Changes"): create the new table from the old statement, copy every
 * row, drop the old one, rename, and recreate its indexes and triggers.
 * Columns added by any earlier migration are kept because the new statement is
 * the stored one with one clause added. The caller runs this inside a
 * transaction with foreign keys switched off and checks them afterwards.
 * Returns the names of the rebuilt tables.
 */
export function rebuildWithAutoincrement(db: Db): string[] {
  const tables = db
    .prepare("SELECT name, sql FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name")
    .all() as { name: string; sql: string }[];
  const rebuilt: string[] = [];
  for (const t of tables) {
    if (!ID_COLUMN.test(t.sql)) continue;
    const temp = `${t.name}__rebuild`;
    const createSql = t.sql.replace(ID_COLUMN, "$1 AUTOINCREMENT").replace(/^CREATE\s+TABLE\s+("?)([A-Za-z_][A-Za-z0-9_]*)\1/i, `CREATE TABLE "${temp}"`);
    if (createSql === t.sql) throw new Error(`could not rewrite the schema of table ${t.name}`);
    const dependents = db
      .prepare("SELECT sql FROM sqlite_master WHERE tbl_name = ? AND type IN ('index', 'trigger') AND sql IS NOT NULL ORDER BY type, name")
      .all(t.name) as { sql: string }[];
    const before = (db.prepare(`SELECT COUNT(*) AS n FROM "${t.name}"`).get() as { n: number }).n;
    db.exec(createSql);
    db.exec(`INSERT INTO "${temp}" SELECT * FROM "${t.name}"`);
    db.exec(`DROP TABLE "${t.name}"`);
    db.exec(`ALTER TABLE "${temp}" RENAME TO "${t.name}"`);
    for (const d of dependents) db.exec(d.sql);
    const after = (db.prepare(`SELECT COUNT(*) AS n FROM "${t.name}"`).get() as { n: number }).n;
    if (after !== before) throw new Error(`rebuilding ${t.name} kept ${after} of ${before} rows`);
    rebuilt.push(t.name);
  }
  return rebuilt;
}
