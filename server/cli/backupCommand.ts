import { resolve } from "node:path";
import { backupDatabase } from "../../db/backupDatabase.ts";
import { UserError } from "../userError.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { openCliDatabase } from "./openCliDatabase.ts";

export const backupCommand: Command = {
  name: "backup",
  summary: "write a consistent copy of the database (safe while the server runs)",
  help: `Usage: morphogauge backup --out FILE [--force] [options]

Copies the database through SQLite's online backup: the copy holds every
committed import and analysis, also while "morphogauge serve" is using the
database (a plain file copy can miss the newest changes). The copy is checked
(SQLite integrity check) before it is kept. Restore it with "morphogauge restore FILE".

  --out FILE     where to write the copy
  --force        replace FILE if it exists
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, out: { type: "string" }, force: { type: "boolean", default: false } },
  async run(values, _positionals, io) {
    if (!values.out) throw new UserError("missing-option", "--out FILE is required: where to write the backup.");
    const out = resolve(io.cwd, values.out as string);
    const { db, path } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const s = await backupDatabase(db, out, { force: Boolean(values.force) });
      if (values.json) io.stdout(JSON.stringify({ database: path, backup: s }, null, 2) + "\n");
      else io.stdout(`Backed up ${path} to ${out} (${(s.bytes / 1024 / 1024).toFixed(1)} MB; ${s.counts.imports} imports, ${s.counts.profiles} profiles, ${s.counts.fits} fits, ${s.counts.analyses} analyses; integrity check ok).\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};
