import { resolve } from "node:path";
import { restoreDatabase } from "../../db/backupDatabase.ts";
import { defaultDatabasePath, openDatabase } from "../../db/connection.ts";
import { UserError } from "../userError.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";

export const restoreCommand: Command = {
  name: "restore",
  summary: "replace the database with a backup (refuses to overwrite without --force)",
  help: `Usage: morphogauge restore BACKUP [--force] [options]

Checks BACKUP (SQLite integrity check, morphogauge tables) and copies it to the
database file. An existing database is only replaced with --force, and is then
kept as <database>.before-restore. Stop "morphogauge serve" first.

  --force        replace an existing database
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, force: { type: "boolean", default: false } },
  allowPositionals: true,
  async run(values, positionals, io) {
    if (positionals.length !== 1) throw new UserError("missing-argument", "Name one backup file: morphogauge restore BACKUP [--db PATH] [--force]");
    const backup = resolve(io.cwd, positionals[0]);
    const target = resolve(io.cwd, (values.db as string | undefined) ?? defaultDatabasePath(io.env));
    const s = await restoreDatabase(backup, target, { force: Boolean(values.force) });
    // Opening applies any migration the backup predates (keeping a copy first).
    const opened = await openDatabase(target);
    opened.db.close();
    if (values.json) io.stdout(JSON.stringify({ database: target, restored: s }, null, 2) + "\n");
    else {
      io.stdout(`Restored ${backup} to ${target} (${s.counts.imports} imports, ${s.counts.profiles} profiles, ${s.counts.fits} fits, ${s.counts.analyses} analyses).\n`);
      if (s.previous) io.stdout(`The database it replaced was kept as ${s.previous}.\n`);
    }
    return 0;
  },
};
