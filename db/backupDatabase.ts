import Database from "better-sqlite3";
import { existsSync, renameSync, rmSync, statSync } from "node:fs";
import { UserError } from "../server/userError.ts";
import type { Db } from "./connection.ts";
import { databaseUserError } from "./databaseError.ts";
import { loadMigrations, schemaVersion } from "./migrate.ts";

export interface BackupSummary {
  path: string;
  bytes: number;
  schema: number;
  /** Rows of the main tables in the copy. */
  counts: { imports: number; embryos: number; profiles: number; fits: number; analyses: number };
}

const TABLES = ["imports", "embryos", "profiles", "fits", "analyses"] as const;

/** Open a copy read-only, run SQLite's full integrity check and count its rows; refuse anything that is not a sound morphogauge database. */
export function inspectCopy(path: string): BackupSummary {
  let copy: Db;
  try {
    copy = new Database(path, { readonly: true, fileMustExist: true });
  } catch (e) {
    throw databaseUserError(e, path) ?? new UserError("not-a-database", `${path} cannot be opened: ${(e as Error).message}`);
  }
  try {
    const problems = (copy.pragma("integrity_check(5)") as { integrity_check: string }[]).map((r) => r.integrity_check).filter((m) => m !== "ok");
    if (problems.length > 0) throw new UserError("database-damaged", `${path} is damaged (${problems[0].slice(0, 200)}); it cannot be used as a backup.`);
    const tables = new Set((copy.prepare("SELECT name FROM sqlite_master WHERE type = 'table'").all() as { name: string }[]).map((r) => r.name));
    const missing = TABLES.filter((t) => !tables.has(t));
    if (missing.length > 0) throw new UserError("not-a-morphogauge-database", `${path} is an SQLite file but not a morphogauge database (no ${missing.join(", ")} table).`);
    const counts = Object.fromEntries(TABLES.map((t) => [t, (copy.prepare(`SELECT COUNT(*) AS n FROM "${t}"`).get() as { n: number }).n])) as BackupSummary["counts"];
    return { path, bytes: statSync(path).size, schema: schemaVersion(copy), counts };
  } catch (e) {
    throw databaseUserError(e, path) ?? e;
  } finally {
    copy.close();
  }
}

/**
 * A consistent copy of a database that may be in use (SQLite's online backup:
 * it includes everything committed, also what is still in the write-ahead
 * log, and a server may keep writing meanwhile), checked after it is written.
 * Written to a temporary name first, so a failed backup never leaves a half file under `out`.
 */
export async function backupDatabase(db: Db, out: string, options: { force: boolean }): Promise<BackupSummary> {
  if (existsSync(out) && !options.force) throw new UserError("backup-exists", `${out} already exists; choose another --out, or add --force to replace it.`);
  const temp = `${out}.partial`;
  rmSync(temp, { force: true });
  try {
    await db.backup(temp);
    const summary = inspectCopy(temp);
    renameSync(temp, out);
    return { ...summary, path: out };
  } catch (e) {
    rmSync(temp, { force: true });
    throw databaseUserError(e, out) ?? e;
  }
}

/**
 * Replace the database at `target` with a backup: the backup is checked first
 * (integrity, tables, not from a newer version), the current file is kept as
 * `<target>.before-restore`, and the copy goes through SQLite so that the
 * target's write-ahead log cannot mix old pages into it.
 */
export async function restoreDatabase(backup: string, target: string, options: { force: boolean }): Promise<BackupSummary & { previous: string | null }> {
  if (!existsSync(backup)) throw new UserError("no-backup", `${backup} does not exist.`);
  const summary = inspectCopy(backup);
  const newest = loadMigrations().at(-1)?.version ?? 0;
  if (summary.schema > newest) throw new UserError("database-too-new", `${backup} was written by a newer morphogauge (schema ${summary.schema}); update morphogauge first.`);
  const exists = existsSync(target) && statSync(target).size > 0;
  if (exists && !options.force) {
    throw new UserError("restore-would-overwrite", `${target} already holds a database; restoring would replace it. Stop any server using it, then add --force (the current file is kept as ${target}.before-restore).`);
  }
  let previous: string | null = null;
  if (exists) {
    previous = `${target}.before-restore`;
    const current = new Database(target, { fileMustExist: true });
    try {
      rmSync(previous, { force: true });
      await current.backup(previous);
    } finally {
      current.close();
    }
  }
  const source = new Database(backup, { readonly: true, fileMustExist: true });
  try {
    await source.backup(target);
  } catch (e) {
    throw databaseUserError(e, target) ?? e;
  } finally {
    source.close();
  }
  return { ...inspectCopy(target), previous };
}
