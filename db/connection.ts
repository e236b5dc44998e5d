import Database from "better-sqlite3";
import { existsSync, statSync } from "node:fs";
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
  const db = new Database(path);
  db.pragma("journal_mode = WAL");
  db.pragma("foreign_keys = ON");
  db.pragma("busy_timeout = 5000");
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
