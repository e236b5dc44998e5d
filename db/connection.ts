import Database from "better-sqlite3";
import { existsSync, statSync } from "node:fs";
import { dirname } from "node:path";
import { UserError } from "../server/userError.ts";
import { backupHint, databaseUserError } from "./databaseError.ts";
import { applyMigrations, loadMigrations, schemaVersion, type Migration } from "./migrate.ts";

export type Db = Database.Database;

export interface OpenedDatabase {
  db: Db;
  path: string;
  created: boolean;
  /** Migrations applied while opening. */
  migrated: number[];
  /** Where the pre-migration copy was written, if one was needed. */
  backupPath: string | null;
}

/** Where the database lives when no --db is given: MORPHOGAUGE_DB, else ./morphogauge.db. */
export function defaultDatabasePath(env: NodeJS.ProcessEnv = process.env): string {
  return env.MORPHOGAUGE_DB && env.MORPHOGAUGE_DB.length > 0 ? env.MORPHOGAUGE_DB : "./morphogauge.db";
}

/** Where the invented demo data lives, apart from the lab's own: MORPHOGAUGE_DEMO_DB, else ./morphogauge-demo.db. */
export function defaultDemoDatabasePath(env: NodeJS.ProcessEnv = process.env): string {
  return env.MORPHOGAUGE_DEMO_DB && env.MORPHOGAUGE_DEMO_DB.length > 0 ? env.MORPHOGAUGE_DEMO_DB : "./morphogauge-demo.db";
}

/**
 * Open (creating if needed) a morphogauge database: WAL journal, foreign keys on,
 * migrations applied. An existing file that needs migrating is first copied to
 * `<path>.before-schema-<N>` so no stored data can be lost to an upgrade.
 */
export async function openDatabase(path: string, migrations: Migration[] = loadMigrations()): Promise<OpenedDatabase> {
  const existed = path !== ":memory:" && existsSync(path) && statSync(path).size > 0;
  if (path !== ":memory:" && !existsSync(dirname(path))) {
    throw new UserError("database-cannot-open", `Cannot create the database ${path}: the folder ${dirname(path)} does not exist. Create it first, or choose another --db path.`);
  }
  let db: Db;
  try {
    db = new Database(path);
  } catch (e) {
    throw databaseUserError(e, path) ?? e;
  }
  try {
    return await prepareOpened(db, path, existed, migrations);
  } catch (e) {
    db.close();
    throw databaseUserError(e, path) ?? e;
  }
}

async function prepareOpened(db: Db, path: string, existed: boolean, migrations: Migration[]): Promise<OpenedDatabase> {
  db.pragma("busy_timeout = 5000");
  if (existed) checkIntegrity(db, path);
  db.pragma("journal_mode = WAL");
  db.pragma("foreign_keys = ON");
  const current = schemaVersion(db);
  let backupPath: string | null = null;
  if (existed && current > 0 && current < (migrations.at(-1)?.version ?? 0)) {
    backupPath = `${path}.before-schema-${migrations.at(-1)!.version}`;
    await db.backup(backupPath);
  }
  const migrated = applyMigrations(db, migrations);
  return { db, path, created: !existed, migrated, backupPath };
}

/** Synchronous open for tests and in-memory use (no backup step is needed there). */
export function openDatabaseSync(path: string): Db {
  const db = new Database(path);
  db.pragma("journal_mode = WAL");
  db.pragma("foreign_keys = ON");
  applyMigrations(db);
  return db;
}

/**
 * SQLite's quick check of every page, run when an existing file is opened, so
 * that a damaged database is noticed before anything is written to it rather
 * than at the next write.
 */
export function checkIntegrity(db: Db, path: string): void {
  const rows = db.pragma("quick_check(5)") as { quick_check: string }[];
  const problems = rows.map((r) => r.quick_check).filter((m) => m !== "ok");
  if (problems.length === 0) return;
  throw new UserError(
    "database-damaged",
    `${path} is damaged: SQLite's check found ${problems.length === 5 ? "5 or more problems" : `${problems.length} problem(s)`}, first: ${problems[0].slice(0, 200)}. Nothing was written to it. Restore your latest backup (morphogauge restore BACKUP --db "${path}" --force), or save what can still be read with: ${backupHint(path)}`,
    { status: 500 },
  );
}
