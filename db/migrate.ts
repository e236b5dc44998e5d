import { readdirSync, readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import type { Database } from "better-sqlite3";

const MIGRATIONS_DIR = fileURLToPath(new URL("./migrations/", import.meta.url));

export interface Migration {
  version: number;
  name: string;
  sql: string;
}

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
    throw new Error(
      `This database was written by a newer morphogauge (schema ${current}; this version knows up to ${newest}). Update morphogauge; the file was not changed.`,
    );
  }
  // A migration may rebuild a table that others reference (create, copy, drop, rename), which
  // needs foreign keys off while it runs; they are checked before each migration commits.
  // Source: SQLite documentation, "Making Other Kinds Of Table Schema Changes" (ALTER TABLE).
  const foreignKeys = db.pragma("foreign_keys", { simple: true }) as number;
  db.pragma("foreign_keys = OFF");
  try {
    for (const m of migrations) {
      if (m.version <= current) continue;
      db.transaction(() => {
        db.exec(m.sql);
        const broken = db.pragma("foreign_key_check") as unknown[];
        if (broken.length > 0) throw new Error(`migration ${m.name} leaves ${broken.length} broken references; the file was not changed`);
        db.pragma(`user_version = ${m.version}`);
      })();
      applied.push(m.version);
    }
  } finally {
    db.pragma(`foreign_keys = ${foreignKeys ? "ON" : "OFF"}`);
  }
  return applied;
}
