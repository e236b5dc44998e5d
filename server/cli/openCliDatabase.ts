import { resolve } from "node:path";
import { defaultDatabasePath, openDatabase, type OpenedDatabase } from "../../db/connection.ts";
import type { CommandIo } from "./command.ts";

/** Open the database named by --db, $MORPHOGAUGE_DB or ./morphogauge.db, telling stderr about upgrades. */
export async function openCliDatabase(dbOption: string | undefined, io: CommandIo): Promise<OpenedDatabase> {
  const path = resolve(io.cwd, dbOption ?? defaultDatabasePath(io.env));
  const opened = await openDatabase(path);
  if (opened.backupPath) io.stderr(`database upgraded to schema ${opened.migrated.at(-1)}; the previous file was kept as ${opened.backupPath}\n`);
  return opened;
}
