import { readdirSync, readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import type { Database } from "better-sqlite3";
import { UserError } from "../server/userError.ts";
import { rebuildWithAutoincrement } from "./rebuildWithAutoincrement.ts";

const MIGRATIONS_DIR = fileURLToPath(new URL("./migrations/", import.meta.url));

export interface Migration {
  version: number;
  name: string;
  sql: string;
}

/**
 * Steps a migration's SQL cannot express, run just before that migration's SQL
 * in the same transaction, with foreign keys off (table rebuilds) and every
 * foreign key checked before the commit.
 */
const STEPS: Partial<Record<number, (db: Database) => void>> = {
  4: (db) => void rebuildWithAutoincrement(db),
};

/** Numbered migrations `NNN_name.sql`, in order. */
export function loadMigrations(dir = MIGRATIONS_DIR): Migration[] {
  return readdirSync(dir)
    .filter((f) => /^\d{3}_[a-z0-9_]+\.sql$/.test(f))
    .sort()
    .map((f) => ({ version: Number(f.slice(0, 3)), name: f, sql: readFileSync(dir + f, "utf8") }));
}

/** The schema version recorded in the file (PRAGMA user_version). */
export function schemaVersion(db: Database): number {
  return db.pragma("user_version", { simple: true }) as number;
}

/**
 * Apply every migration newer than the file's user_version, each in its own
 * transaction together with the version bump, so a failure leaves the file at
 * the last complete version.
 */
export function applyMigrations(db: Database, migrations = loadMigrations()): number[] {
  const applied: number[] = [];
  const current = schemaVersion(db);
  const newest = migrations.at(-1)?.version ?? 0;
  if (current > newest) {
    throw new UserError(
      "database-too-new",
      `This database was written by a newer morphogauge (schema ${current}; this version knows up to ${newest}). Update morphogauge; the file was not changed.`,
    );
  }
  for (const m of migrations) {
    if (m.version <= current) continue;
    const step = STEPS[m.version];
    // PRAGMA foreign_keys is ignored inside a transaction: switch it off first, so that
    // dropping a rebuilt table neither cascades nor fails, then check every key before committing.
    const foreignKeys = db.pragma("foreign_keys", { simple: true }) as number;
    if (step) db.pragma("foreign_keys = OFF");
    try {
      db.transaction(() => {
        step?.(db);
        db.exec(m.sql);
        if (step) {
          const broken = db.pragma("foreign_key_check") as { table: string; rowid: number; parent: string }[];
          if (broken.length > 0) {
            throw new Error(`migration ${m.name} would leave ${broken.length} broken reference(s), first ${broken[0].table} row ${broken[0].rowid} → ${broken[0].parent}; nothing was changed`);
          }
        }
        db.pragma(`user_version = ${m.version}`);
      })();
    } finally {
      if (step && foreignKeys) db.pragma("foreign_keys = ON");
    }
    applied.push(m.version);
  }
  return applied;
}
