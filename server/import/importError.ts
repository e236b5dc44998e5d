import { UserError, type UserIssue } from "../userError.ts";

/** Where in which file a problem sits; rows are the file's own 1-based line numbers. */
export interface CellLocation {
  file: string;
  row?: number;
  column?: string;
  value?: string;
}

const MAX_LISTED = 20;

/** Format "file.csv, row 214, column "intensity": message". */
export function describeLocation(loc: CellLocation): string {
  const parts = [loc.file];
  if (loc.row !== undefined) parts.push(`row ${loc.row}`);
  if (loc.column !== undefined) parts.push(`column "${loc.column}"`);
  return parts.join(", ");
}

/**
 * A file could not be imported. Carries every problem found (up to a limit),
 * each naming file, row and column; nothing was stored.
 */
export class ImportError extends UserError {
  constructor(issues: { location: CellLocation; message: string }[]) {
    const listed: UserIssue[] = issues.slice(0, MAX_LISTED).map((i) => ({
      path: describeLocation(i.location),
      message: i.message,
    }));
    const first = listed[0];
    const more = issues.length > 1 ? ` (and ${issues.length - 1} more problem${issues.length > 2 ? "s" : ""})` : "";
    super("import-rejected", `${first.path}: ${first.message}${more}. Nothing was imported.`, { status: 422, issues: listed });
    this.name = "ImportError";
  }
}

/** Collects problems while parsing so the user sees all of them at once. */
export class IssueCollector {
  readonly issues: { location: CellLocation; message: string }[] = [];

  add(location: CellLocation, message: string): void {
    this.issues.push({ location, message });
  }

  get count(): number {
    return this.issues.length;
  }

  /** Throw an ImportError if anything was collected. */
  throwIfAny(): void {
    if (this.issues.length > 0) throw new ImportError(this.issues);
  }
}
