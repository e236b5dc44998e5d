import { UserError } from "../server/userError.ts";

/** The backup command to suggest in messages about a damaged or unreadable database. */
export function backupHint(path: string): string {
  return `morphogauge backup --db "${path}" --out "${path}.backup"`;
}

/**
 * SQLite's and the file system's environment errors, which are not bugs, as
 * user errors that name the file and say what to do: read-only, full disk,
 * locked by another program, not a database, damaged. Anything else: null.
 */
export function databaseUserError(e: unknown, path: string): UserError | null {
  if (!e || typeof e !== "object") return null;
  const code = String((e as { code?: unknown }).code ?? "");
  const file = `the database ${path}`;
  if (code.startsWith("SQLITE_READONLY") || code === "EROFS" || code === "EACCES" || code === "EPERM") {
    return new UserError(
      "database-read-only",
      `Cannot write to ${file}: the file or its folder is read-only (or on a read-only disk). Nothing was changed. Make the file and its folder writable, or copy the database somewhere writable and use --db.`,
      { status: 503 },
    );
  }
  if (code === "SQLITE_FULL" || code === "ENOSPC" || code === "SQLITE_IOERR_WRITE" || code === "SQLITE_IOERR_FSYNC") {
    return new UserError(
      "disk-full",
      `Cannot write to ${file}: the disk is full. The last change was rolled back and nothing stored is lost. Free some space on that disk (or move the database with --db) and try again.`,
      { status: 507 },
    );
  }
  if (code.startsWith("SQLITE_BUSY") || code.startsWith("SQLITE_LOCKED")) {
    return new UserError(
      "database-locked",
      `${file[0].toUpperCase()}${file.slice(1)} is locked by another program or morphogauge command that is writing to it. Wait for it to finish and try again.`,
      { status: 503 },
    );
  }
  if (code === "SQLITE_NOTADB") {
    return new UserError("not-a-database", `${path} is not a morphogauge database (not an SQLite file). Check the --db path; nothing was changed.`, { status: 500 });
  }
  if (code.startsWith("SQLITE_CORRUPT")) {
    return new UserError(
      "database-damaged",
      `${file[0].toUpperCase()}${file.slice(1)} is damaged (${(e as Error).message}). Stop writing to it; restore your latest backup with "morphogauge restore FILE --db ${path} --force", or save what can still be read with: ${backupHint(path)}`,
      { status: 500 },
    );
  }
  if (code === "SQLITE_CANTOPEN" || code === "ENOENT" || code === "ENOTDIR") {
    return new UserError("database-cannot-open", `Cannot open or create ${file}: its folder does not exist, is read-only, or cannot be entered. Check the --db path and the folder's permissions.`, { status: 503 });
  }
  if (code.startsWith("SQLITE_IOERR")) {
    return new UserError("database-io-error", `Reading or writing ${file} failed (${code}): the disk or network drive may be failing or full. Nothing more was stored; check the disk and try again.`, { status: 503 });
  }
  return null;
}
